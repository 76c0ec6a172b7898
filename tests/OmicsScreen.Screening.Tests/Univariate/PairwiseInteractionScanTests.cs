using System.Text.Json;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Tests.Support;
using OmicsScreen.Screening.Univariate;
using OmicsScreen.TestSupport;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Univariate;

public sealed class PairwiseInteractionScanTests
{
    [Fact]
    public void Two_by_two_chi_square_matches_scipy()
    {
        // Source: stats_reference.json "chi_square_tables" (scipy.stats.chi2_contingency,
        // correction=False: Pearson's statistic without Yates' correction).
        foreach (var item in StatsReference.Block("chi_square_tables"))
        {
            var table = item.GetProperty("table").EnumerateArray().Select(r => r.EnumerateArray().Select(c => c.GetInt64()).ToArray()).ToArray();
            if (table.Length != 2) continue;
            double expected = item.Number("chi_square");
            double actual = PairwiseInteractionScan.TwoByTwoChiSquare(table[0][0], table[0][1], table[1][0], table[1][1]);
            Assert.Equal(expected, actual, expected * 1e-12);
        }
    }

    [Theory]
    [InlineData("two_classes")]
    [InlineData("three_classes")]
    public void Largest_chi_square_and_partner_match_an_independent_scipy_scan(string name)
    {
        // Source: stats_reference.json "interaction_scan", written in numpy with
        // scipy.stats.chi2_contingency(correction=False) per pair, medians by numpy.median over the
        // measured values, missing values (NaN) dropped pairwise.
        var item = StatsReference.Block("interaction_scan").First(e => e.GetProperty("name").GetString() == name);
        var (matrix, outcome) = ReferencePanel(item);
        var rows = Enumerable.Range(0, matrix.SampleCount).ToArray();
        var (statistics, partners) = PairwiseInteractionScan.Scan(matrix, null, outcome, rows);
        var expected = item.Doubles("statistics");
        var expectedPartners = item.GetProperty("partners").EnumerateArray().Select(e => e.GetInt32()).ToArray();
        for (int c = 0; c < expected.Length; c++)
        {
            Assert.Equal(expected[c], statistics[c], 1e-9 * Math.Max(1, expected[c]));
            Assert.Equal(expectedPartners[c], partners[c]);
        }
        // The planted pair (columns 0 and 1) finds each other.
        Assert.Equal(1, partners[0]);
        Assert.Equal(0, partners[1]);
    }

    [Fact]
    public void Scan_of_a_subset_of_samples_equals_the_scan_of_that_subset_copied_out()
    {
        // Common practice: the screen's inner folds pass row indices rather than copies.
        var item = StatsReference.Block("interaction_scan").First();
        var (matrix, outcome) = ReferencePanel(item);
        var rows = Enumerable.Range(0, matrix.SampleCount).Where(s => s % 3 != 1).ToArray();
        var (viaRows, partnersViaRows) = PairwiseInteractionScan.Scan(matrix, null, outcome, rows);
        var copied = matrix.SelectSamples(rows);
        var copiedOutcome = outcome.SelectSamples(rows);
        var (viaCopy, partnersViaCopy) = PairwiseInteractionScan.Scan(copied, null, copiedOutcome, Enumerable.Range(0, rows.Length).ToArray());
        Assert.Equal(viaCopy, viaRows);
        Assert.Equal(partnersViaCopy, partnersViaRows);
    }

    [Fact]
    public void Results_do_not_depend_on_the_thread_count()
    {
        // DEVELOPERS.md: results are identical whatever the thread count.
        var model = CalibrationCatalogue.Create("planted-interaction", 1);
        var panel = model.Discovery();
        var decoys = DecoyPlan.For(panel.FeatureCount, 300, 5).Values(panel.Matrix);
        var rows = Enumerable.Range(0, panel.SampleCount).ToArray();
        var one = PairwiseInteractionScan.Scan(panel.Matrix, decoys, panel.Outcome, rows, threadCount: 1);
        var all = PairwiseInteractionScan.Scan(panel.Matrix, decoys, panel.Outcome, rows, threadCount: 0);
        Assert.Equal(one.Statistics, all.Statistics);
        Assert.Equal(one.Partners, all.Partners);
        // And the planted pair is each other's strongest partner, far above every other feature.
        var pair = model.InteractingPair;
        Assert.Equal(pair[1], one.Partners[pair[0]]);
        Assert.Equal(pair[0], one.Partners[pair[1]]);
        double largestElse = Enumerable.Range(0, panel.FeatureCount).Where(f => !pair.Contains(f)).Max(f => one.Statistics[f]);
        Assert.True(one.Statistics[pair[0]] > 2 * largestElse, $"pair {one.Statistics[pair[0]]:F1}, largest other {largestElse:F1}");
    }

    [Fact]
    public void Decoys_largest_chi_square_has_the_law_of_a_null_features()
    {
        // The scan's p-value rests on decoys (copies permuted once per run) sharing the law of a
        // null feature's statistic. Two-sample Kolmogorov-Smirnov at the 1% level (critical value
        // 1.63 sqrt((n+m)/(nm)), Smirnov 1948) on a null panel of independent features, two seeds.
        foreach (int seed in new[] { 1, 2 })
        {
            var model = CalibrationCatalogue.Create("null-normal", seed);
            var panel = model.Discovery();
            var decoys = DecoyPlan.For(panel.FeatureCount, panel.FeatureCount, (ulong)seed).Values(panel.Matrix);
            var rows = Enumerable.Range(0, panel.SampleCount).ToArray();
            var (statistics, _) = PairwiseInteractionScan.Scan(panel.Matrix, decoys, panel.Outcome, rows);
            var features = statistics.Take(panel.FeatureCount).ToArray();
            var decoyStatistics = statistics.Skip(panel.FeatureCount).ToArray();
            double distance = KolmogorovSmirnov.TwoSampleDistance(features, decoyStatistics);
            double critical = KolmogorovSmirnov.CriticalDistance(0.01, features.Length, decoyStatistics.Length);
            Assert.True(distance < critical, $"seed {seed}: KS distance {distance:F3}, 1% critical value {critical:F3}");
        }
    }

    [Fact]
    public void Below_detection_cells_fall_on_the_low_side_and_missing_cells_on_neither()
    {
        // Common practice for left-censored assay values: below the limit is lower than any
        // measured value. Hand-worked: values 1..5 with one censored and one missing cell.
        float[] column = [3f, float.NaN, 1f, 5f, 4f, 2f, 0.5f];
        CellState[] states = [CellState.Measured, CellState.Missing, CellState.Measured, CellState.Measured,
            CellState.Measured, CellState.Measured, CellState.BelowDetection];
        var high = new ulong[1];
        var valid = new ulong[1];
        PairwiseInteractionScan.PackSides(column, states, Enumerable.Range(0, 7).ToArray(), new double[7], high, valid);
        // Known: -inf, 1, 2, 3, 4, 5 (six values), median (2 + 3) / 2 = 2.5: high are 3, 5, 4.
        Assert.Equal(0b1111101UL, valid[0]);
        Assert.Equal(0b0011001UL, high[0]);
    }

    private static (FeatureMatrix Matrix, ClassOutcome Outcome) ReferencePanel(JsonElement item)
    {
        var classes = item.GetProperty("classes").EnumerateArray().Select(e => e.GetInt32()).ToArray();
        var columns = item.GetProperty("columns").EnumerateArray()
            .Select(c => c.EnumerateArray().Select(v => v.ValueKind == JsonValueKind.Null ? float.NaN : (float)v.GetDouble()).ToArray()).ToArray();
        int sampleCount = classes.Length;
        var states = columns.Select(c => c.Any(float.IsNaN) ? c.Select(v => float.IsNaN(v) ? CellState.Missing : CellState.Measured).ToArray() : null).ToArray();
        var matrix = new FeatureMatrix(
            Enumerable.Range(0, columns.Length).Select(c => $"col{c}").ToArray(),
            Enumerable.Range(0, sampleCount).Select(s => $"s{s}").ToArray(),
            columns, states);
        int classCount = classes.Max() + 1;
        var outcome = new ClassOutcome("class", Enumerable.Range(0, classCount).Select(k => $"k{k}").ToArray(), classes);
        return (matrix, outcome);
    }
}
