using System.Globalization;
using System.Text.Json;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public class DeLongTests
{
    [Fact]
    public void Midrank_version_equals_the_pairwise_definition_on_random_tied_data()
    {
        var random = new Random(2024);
        for (int trial = 0; trial < 40; trial++)
        {
            int n1 = random.Next(2, 60), n0 = random.Next(2, 60), levels = random.Next(1, 12);
            var positive = Enumerable.Range(0, n1).Select(_ => (double)random.Next(levels) + (random.Next(3) == 0 ? 0.5 : 0)).ToArray();
            var negative = Enumerable.Range(0, n0).Select(_ => (double)random.Next(levels)).ToArray();
            var fast = DeLong.Estimate(positive, negative);
            var plain = DeLong.EstimateByPairs(positive, negative);
            Assert.Equal(plain.Auc, fast.Auc, 12);
            if (double.IsNaN(plain.Variance)) Assert.True(double.IsNaN(fast.Variance));
            else Assert.Equal(plain.Variance, fast.Variance, 12);
        }
    }

    [Fact]
    public void Variance_matches_an_independent_numpy_computation()
    {
        // Source: stats_reference.json "delong": psi over all pairs and ddof-1 variances in numpy.
        foreach (var item in StatsReference.Block("delong"))
        {
            var estimate = DeLong.Estimate(item.Doubles("positive"), item.Doubles("negative"));
            Tolerance.Relative(item.Number("auc"), estimate.Auc, 1e-12, "AUC");
            Tolerance.Relative(item.Number("variance"), estimate.Variance, 1e-10, "variance");
        }
    }

    [Fact]
    public void Variance_worked_by_hand_on_a_three_by_two_example()
    {
        // positives {1, 2, 3}, negatives {0, 2}. psi rows: 1 -> (1, 0), 2 -> (1, 0.5), 3 -> (1, 1).
        // V10 = (0.5, 0.75, 1), mean 0.75, S10 = ((-0.25)^2 + 0 + 0.25^2) / 2 = 0.0625.
        // V01 = (1, 0.5), mean 0.75, S01 = (0.25^2 + 0.25^2) / 1 = 0.125.
        // Var = 0.0625 / 3 + 0.125 / 2 = 0.0833333...
        var estimate = DeLong.Estimate([1.0, 2, 3], [0.0, 2]);
        Assert.Equal(0.75, estimate.Auc, 15);
        Assert.Equal(0.0625 / 3 + 0.0625, estimate.Variance, 15);
    }

    [Fact]
    public void Auc_agrees_with_mann_whitney()
    {
        var data = WdbcFeatureStatistics.Instance;
        var (malignant, benign) = data.Split(0);
        Assert.Equal(MannWhitney.Test(malignant, benign).Auc, DeLong.Estimate(malignant, benign).Auc, 12);
    }

    [Fact]
    public void Perfect_separation_has_zero_variance()
    {
        var estimate = DeLong.Estimate([5.0, 6, 7], [1.0, 2]);
        Assert.Equal(1.0, estimate.Auc);
        Assert.Equal(0.0, estimate.Variance);
    }

    [Fact]
    public void A_class_with_one_value_has_no_variance_estimate()
    {
        Assert.True(double.IsNaN(DeLong.Estimate([5.0], [1.0, 2]).Variance));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Paired_comparison_matches_pROC_roc_test_on_the_aSAH_data(int index)
    {
        // Source: R pROC 1.18.0 roc.test(..., method = "delong", paired = TRUE) on pROC's public aSAH data
        // (Turck et al. 2010; reference/roc/make_paired_delong_reference.R). From memory, pROC's own
        // documentation prints Z = -2.209, p = 0.02718 for s100b against wfns, the first comparison.
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(OmicsScreen.TestSupport.ReferenceData.Directory, "roc", "paired_delong_reference.json")));
        var expected = json.RootElement.GetProperty("comparisons")[index];
        var lines = File.ReadAllLines(Path.Combine(OmicsScreen.TestSupport.ReferenceData.Directory, "roc", "asah.csv"));
        var header = lines[0].Split(',');
        var rows = lines[1..].Select(l => l.Split(',')).ToArray();
        double[] Column(string name) => rows.Select(r => double.Parse(r[Array.IndexOf(header, name)], CultureInfo.InvariantCulture)).ToArray();
        var poor = Column("poor").Select(v => v == 1).ToArray();
        var result = DeLong.ComparePaired(Column(expected.GetProperty("a").GetString()!), Column(expected.GetProperty("b").GetString()!), poor);
        Assert.Equal(expected.GetProperty("auc_a").GetDouble(), result.AucA, 1e-12);
        Assert.Equal(expected.GetProperty("auc_b").GetDouble(), result.AucB, 1e-12);
        Assert.Equal(expected.GetProperty("z").GetDouble(), result.Z, 1e-9);
        Assert.Equal(expected.GetProperty("p").GetDouble(), result.PValue, 1e-9);
        Assert.Equal(expected.GetProperty("lower").GetDouble(), result.Interval.Lower, 1e-9);
        Assert.Equal(expected.GetProperty("upper").GetDouble(), result.Interval.Upper, 1e-9);
        Assert.Equal(41, result.PositiveCount);
        Assert.Equal(72, result.NegativeCount);
    }

    [Fact]
    public void Paired_comparison_of_a_score_with_itself_has_no_spread_and_with_its_reverse_the_whole_gap()
    {
        // Common practice: identical scores differ by nothing (SE 0, so no test); a score and its
        // negation have AUCs a and 1 - a.
        var positive = new[] { true, false, true, true, false, false, true, false };
        var score = new[] { 0.9, 0.1, 0.4, 0.8, 0.35, 0.2, 0.7, 0.6 };
        var same = DeLong.ComparePaired(score, score, positive);
        Assert.Equal(0, same.Difference);
        Assert.True(double.IsNaN(same.PValue));
        var reversed = DeLong.ComparePaired(score, score.Select(v => -v).ToArray(), positive);
        Assert.Equal(2 * reversed.AucA - 1, reversed.Difference, 12);
    }
}
