using System.Globalization;
using System.Text.Json;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Cohorts;

/// <summary>
/// How strongly a measured or time-to-event outcome depends on the cohort, against R on public
/// data: survival::lung (Loprinzi et al. 1994) with the ECOG score as the cohort
/// (reference/cohorts/make_cohort_reference.R: survdiff, survfit's Nelson-Aalen, lm, kruskal.test).
/// </summary>
public sealed class OutcomeCohortAssociationTests
{
    private static readonly JsonElement Reference = JsonDocument.Parse(
        File.ReadAllText(Path.Combine(ReferenceData.Directory, "cohorts", "cohort_reference.json"))).RootElement;

    private static (double[] Time, bool[] Event, int[] Group, double[] Age) Lung()
    {
        var lines = File.ReadAllLines(Path.Combine(ReferenceData.Directory, "cohorts", "lung_groups.csv")).Skip(1).ToArray();
        var cells = lines.Select(l => l.Split(',')).ToArray();
        return (cells.Select(c => double.Parse(c[0], CultureInfo.InvariantCulture)).ToArray(),
            cells.Select(c => c[1] == "1").ToArray(),
            cells.Select(c => int.Parse(c[2], CultureInfo.InvariantCulture)).ToArray(),
            cells.Select(c => double.Parse(c[3], CultureInfo.InvariantCulture)).ToArray());
    }

    private static SampleGrouping Groups(int[] group) =>
        SampleGrouping.FromLabels("ph.ecog", group.Select(g => "ecog" + g.ToString(CultureInfo.InvariantCulture)).ToArray());

    private static double Number(string name) => Reference.GetProperty(name).GetDouble();

    [Fact]
    public void The_k_sample_log_rank_test_matches_survdiff()
    {
        var (time, events, group, _) = Lung();
        // survdiff(Surv(time, status) ~ ph.ecog): chi-square on 3 df.
        var result = LogRankTestOfGroups.Test(time, events, group, 4);
        Assert.Equal(3, result.DegreesOfFreedom);
        Assert.Equal(Number("logrank_chisq"), result.ChiSquare, 1e-8);
        Assert.Equal(Number("logrank_p"), result.PValue, 1e-10);

        // Two groups: the same as the two-group test and as survdiff on scores 0 and 1.
        var rows = Enumerable.Range(0, time.Length).Where(s => group[s] <= 1).ToArray();
        var two = LogRankTestOfGroups.Test(rows.Select(s => time[s]).ToArray(), rows.Select(s => events[s]).ToArray(),
            rows.Select(s => group[s]).ToArray(), 2);
        Assert.Equal(Number("logrank01_chisq"), two.ChiSquare, 1e-8);
        Assert.Equal(Number("logrank01_p"), two.PValue, 1e-10);
        var pairwise = LogRankTest.TwoGroups(rows.Select(s => time[s]).ToArray(), rows.Select(s => events[s]).ToArray(),
            rows.Select(s => group[s] == 1).ToArray());
        Assert.Equal(pairwise.ChiSquare, two.ChiSquare, 1e-9);
    }

    [Fact]
    public void Follow_up_association_is_eta_of_the_martingale_residuals_with_the_log_rank_p()
    {
        var (time, events, group, _) = Lung();
        var residuals = OutcomeCohortAssociation.MartingaleResiduals(time, events);
        var first = Reference.GetProperty("martingale_first").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        for (int i = 0; i < first.Length; i++) Assert.Equal(first[i], residuals[i], 1e-10);
        var (eta, p) = OutcomeCohortAssociation.OfFollowUp(time, events, Groups(group));
        // R: summary(lm(residual ~ group))$r.squared.
        Assert.Equal(Number("eta2_martingale"), eta * eta, 1e-10);
        Assert.Equal(Number("logrank_p"), p, 1e-10);
    }

    [Fact]
    public void Measured_association_is_eta_of_the_ranks_with_the_kruskal_wallis_test()
    {
        var (_, _, group, age) = Lung();
        var (eta, p) = OutcomeCohortAssociation.OfMeasured(age, Groups(group));
        // R: kruskal.test(age ~ ph.ecog) (ties corrected) and the R² of rank(age) on the group.
        Assert.Equal(Number("eta2_ranks"), eta * eta, 1e-10);
        Assert.Equal(Number("kruskal_h"), (age.Length - 1) * eta * eta, 1e-8);
        Assert.Equal(Number("kruskal_p"), p, 1e-10);
    }

    [Fact]
    public void With_two_classes_eta_of_the_class_indicator_equals_cramers_v()
    {
        // The worked 2 x 2 table of CohortAnalysisTests (V = 0.5, Cramér 1946): eta of a 0/1 outcome's
        // ranks on cohort is the same number, which is why one confounding threshold serves every kind.
        var classes = Enumerable.Repeat(0, 40).Concat(Enumerable.Repeat(1, 40)).ToArray();
        var levels = Enumerable.Repeat(0, 30).Concat(Enumerable.Repeat(1, 10)).Concat(Enumerable.Repeat(0, 10)).Concat(Enumerable.Repeat(1, 30)).ToArray();
        var cohort = new SampleGrouping("c", ["x", "y"], levels);
        var (v, _) = OutcomeCohortAssociation.OfClasses(new ClassOutcome("y", ["a", "b"], classes), cohort);
        var (eta, _) = OutcomeCohortAssociation.OfMeasured(classes.Select(c => (double)c).ToArray(), cohort);
        Assert.Equal(v, eta, 12);
    }
}
