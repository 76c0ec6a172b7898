using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Covariates;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Covariates;

/// <summary>
/// The added value for a measured outcome (R²) and a time to an event (Harrell's C), with the
/// paired bootstrap interval, on invented panels with known truth: the outcome depends on age and
/// on three markers independent of age (by construction), so the gain's interval lies above 0.
/// </summary>
public class AddedValueOutcomeKindTests
{
    private static ScreenOptions Quick(ulong seed) => new()
    {
        Seed = seed, HalfSamplePairs = 4, TreesPerForest = 120, CurveFolds = 4, CurveInnerPairs = 2, CurveMaxPanelSize = 5,
    };

    private static (FeatureMatrix Matrix, double[][] Z, double[] Age) Draw(int samples, ulong seed)
    {
        var (matrix, z, _) = StandardNormalFeatures.Draw(samples, 25, seed, s => $"SIMK{s:D3}");
        var draws = SeedSchedule.Generator(seed, 4, 0, SeedPurpose.Sampling);
        var a = new double[samples];
        for (int s = 0; s < samples; s++) a[s] = draws.NextGaussian();
        return (matrix, z, a);
    }

    private static Covariate[] Age(double[] a) => [Covariate.Numeric("age", a.Select(v => 60 + 10 * v).ToArray())];

    [Fact]
    public void Markers_that_add_to_age_raise_r_squared_with_a_bootstrap_interval_above_zero()
    {
        var (matrix, z, a) = Draw(200, 31);
        var noise = SeedSchedule.Generator(31, 5, 0, SeedPurpose.Sampling);
        var y = new double[200];
        for (int s = 0; s < 200; s++) y[s] = 1.0 * a[s] + 1.0 * z[0][s] + 0.8 * z[1][s] + 0.6 * z[2][s] + 0.5 * noise.NextGaussian();
        var panel = new Panel(matrix, new MeasuredOutcome("score", y)).WithCovariates(Age(a));

        var added = Assert.IsType<AddedValue>(ScreenRunner.Run(panel, Quick(31)).AddedValue);
        Assert.Equal("r_squared", added.Metric);
        Assert.Equal("bootstrap", added.IntervalMethod);
        // Known truth (by construction): the markers explain variance age cannot.
        Assert.True(added.GainInterval.Lower > 0, added.ToString());
        Assert.True(added.GainInterval.Lower <= added.Gain && added.Gain <= added.GainInterval.Upper, added.ToString());
    }

    [Fact]
    public void Markers_that_add_to_age_raise_the_concordance_with_a_bootstrap_interval_above_zero()
    {
        var (matrix, z, a) = Draw(200, 32);
        var draws = SeedSchedule.Generator(32, 6, 0, SeedPurpose.Sampling);
        var times = new double[200];
        var events = new bool[200];
        for (int s = 0; s < 200; s++)
        {
            double logHazard = 1.0 * a[s] + 1.0 * z[0][s] + 0.8 * z[1][s] + 0.6 * z[2][s];
            double eventTime = -Math.Log(1 - draws.NextDouble()) / Math.Exp(logHazard);
            double censorTime = -Math.Log(1 - draws.NextDouble()) / 0.3;
            times[s] = Math.Min(eventTime, censorTime);
            events[s] = eventTime <= censorTime;
        }
        var panel = new Panel(matrix, new FollowUpOutcome("months", "relapse", times, events)).WithCovariates(Age(a));

        var added = Assert.IsType<AddedValue>(ScreenRunner.Run(panel, Quick(32)).AddedValue);
        Assert.Equal("concordance", added.Metric);
        // Known truth (by construction): the markers raise the hazard beside age.
        Assert.True(added.GainInterval.Lower > 0, added.ToString());
    }

    [Fact]
    public void Markers_that_add_to_age_raise_the_accuracy_of_three_classes_with_a_bootstrap_interval_above_zero()
    {
        // Known truth (by construction): the class is the largest of three scores, one led by age and
        // two by markers independent of age, so the markers name classes age cannot.
        var (matrix, z, a) = Draw(240, 33);
        var noise = SeedSchedule.Generator(33, 7, 0, SeedPurpose.Sampling);
        var classes = new int[240];
        for (int s = 0; s < 240; s++)
        {
            double[] score = [1.5 * a[s], 1.5 * z[0][s] + 1.2 * z[1][s], 1.5 * z[2][s] + 1.2 * z[3][s]];
            for (int c = 0; c < 3; c++) score[c] += 0.3 * noise.NextGaussian();
            classes[s] = Array.IndexOf(score, score.Max());
        }
        var panel = new Panel(matrix, new ClassOutcome("stage", ["stage-a", "stage-b", "stage-c"], classes)).WithCovariates(Age(a));

        var added = Assert.IsType<AddedValue>(ScreenRunner.Run(panel, Quick(33)).AddedValue);
        Assert.Equal("accuracy", added.Metric);
        Assert.Equal("bootstrap", added.IntervalMethod);
        Assert.True(added.GainInterval.Lower > 0, added.ToString());
        Assert.True(added.GainInterval.Lower <= added.Gain && added.Gain <= added.GainInterval.Upper, added.ToString());
        // Accuracies are shares of samples (definition); age alone cannot tell the two marker-led classes apart.
        Assert.InRange(added.CovariatesAlone, 0, 1);
        Assert.InRange(added.CovariatesAndPanel, 0, 1);
        Assert.True(added.CovariatesAlone < added.CovariatesAndPanel, added.ToString());
    }

    [Fact]
    public void Three_classes_unrelated_to_age_and_markers_rarely_show_an_accuracy_gain_over_age()
    {
        // Known truth: the classes are drawn apart from every feature and from age, so the panel adds
        // nothing; a 95% interval should lie above 0 in about 1 panel in 40 (2.5%, one side). Over
        // 10 null panels more than 2 such intervals would have probability under 0.003 (binomial).
        // Measured 2026-12-05 on seeds 34-43: 1 (seed 34, whose noise features reach a held-out
        // accuracy of 0.49 by chance); in 7 of 10 the folds lock no panel and the gain is exactly 0.
        int above = 0;
        for (ulong seed = 34; seed < 44; seed++)
        {
            var (matrix, _, a) = Draw(180, seed);
            var draws = SeedSchedule.Generator(seed, 8, 0, SeedPurpose.Sampling);
            var classes = new int[180];
            for (int s = 0; s < 180; s++) classes[s] = draws.NextInt(3);
            var panel = new Panel(matrix, new ClassOutcome("stage", ["stage-a", "stage-b", "stage-c"], classes)).WithCovariates(Age(a));
            var added = Assert.IsType<AddedValue>(ScreenRunner.Run(panel, Quick(seed)).AddedValue);
            Assert.Equal("accuracy", added.Metric);
            if (added.GainInterval.Lower > 0) above++;
        }
        Assert.True(above <= 2, $"{above} of 10 null panels show an accuracy gain over age");
    }
}
