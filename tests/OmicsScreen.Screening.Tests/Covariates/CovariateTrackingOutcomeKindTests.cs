using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Covariates;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Covariates;

/// <summary>
/// Markers that track a covariate for a measured outcome and a time to an event, on invented
/// panels with known truth (a design of our own): age = 60 + 10 a with a ~ N(0, 1), sex a coin
/// flip; SIM000-SIM002 are age proxies (0.7 a + 0.7 e, correlation with age about 0.71) that
/// reach the outcome only through age; SIM003-SIM005 are independent of age and enter the
/// outcome themselves. Proxies must be flagged as tracking age, true markers must not be.
/// </summary>
public class CovariateTrackingOutcomeKindTests
{
    private static ScreenOptions Quick(ulong seed) => new()
    {
        Seed = seed, HalfSamplePairs = 5, TreesPerForest = 200, CurveFolds = 0,
    };

    private static readonly string[] Proxies = ["SIM000", "SIM001", "SIM002"];
    private static readonly string[] TrueMarkers = ["SIM003", "SIM004", "SIM005"];

    /// <summary>The panel's features (proxies planted), the standardised age a and the true markers' values z3-z5.</summary>
    private static (FeatureMatrix Matrix, double[] A, double[][] Z, Covariate[] Covariates) Draw(int samples, int features, ulong seed)
    {
        var (matrix, z, _) = StandardNormalFeatures.Draw(samples, features, seed, s => $"SIMT{s:D3}");
        var draws = SeedSchedule.Generator(seed, 7, 0, SeedPurpose.Sampling);
        var a = new double[samples];
        var sex = new int[samples];
        for (int s = 0; s < samples; s++)
        {
            a[s] = draws.NextGaussian();
            sex[s] = draws.NextDouble() < 0.5 ? 0 : 1;
        }
        var columns = new float[features][];
        for (int f = 0; f < features; f++)
        {
            columns[f] = matrix.Column(f).ToArray();
            if (f < Proxies.Length)
                for (int s = 0; s < samples; s++) columns[f][s] = (float)(5 + 0.7 * a[s] + 0.7 * z[f][s]);
        }
        var planted = new FeatureMatrix(matrix.FeatureNames, matrix.SampleIds, columns, new CellState[]?[features]);
        Covariate[] covariates = [Covariate.Numeric("age", a.Select(v => 60 + 10 * v).ToArray()), Covariate.Categorical("sex", ["F", "M"], sex)];
        return (planted, a, z, covariates);
    }

    [Fact]
    public void Measured_outcome_age_proxies_are_flagged_and_true_markers_are_not()
    {
        var (matrix, a, z, covariates) = Draw(300, 40, 41);
        var noise = SeedSchedule.Generator(41, 8, 0, SeedPurpose.Sampling);
        var y = new double[300];
        for (int s = 0; s < y.Length; s++) y[s] = 1.5 * a[s] + 0.8 * z[3][s] + 0.8 * z[4][s] + 0.8 * z[5][s] + 0.5 * noise.NextGaussian();
        var panel = new Panel(matrix, new MeasuredOutcome("score", y)).WithCovariates(covariates);

        var tracking = Assert.IsType<CovariateTracking>(ScreenRunner.Run(panel, Quick(41)).CovariateTracking);
        Assert.Equal("squared_error_rise", tracking.Loss);
        AssertProxiesFlaggedTrueMarkersNot(tracking);
    }

    [Fact]
    public void Follow_up_age_proxies_are_flagged_and_true_markers_are_not()
    {
        var (matrix, a, z, covariates) = Draw(300, 40, 42);
        var draws = SeedSchedule.Generator(42, 8, 0, SeedPurpose.Sampling);
        var times = new double[300];
        var events = new bool[300];
        for (int s = 0; s < times.Length; s++)
        {
            // Exponential event times with log hazard linear in age and the true markers (a
            // proportional-hazards model, Cox 1972), independent exponential censoring.
            double logHazard = 1.5 * a[s] + 0.8 * z[3][s] + 0.8 * z[4][s] + 0.8 * z[5][s];
            double eventTime = -Math.Log(1 - draws.NextDouble()) / Math.Exp(logHazard);
            double censorTime = -Math.Log(1 - draws.NextDouble()) / 0.3;
            times[s] = Math.Min(eventTime, censorTime);
            events[s] = eventTime <= censorTime;
        }
        var panel = new Panel(matrix, new FollowUpOutcome("months", "relapse", times, events)).WithCovariates(covariates);

        var tracking = Assert.IsType<CovariateTracking>(ScreenRunner.Run(panel, Quick(42)).CovariateTracking);
        Assert.Equal("concordance_drop", tracking.Loss);
        AssertProxiesFlaggedTrueMarkersNot(tracking);
    }

    private static void AssertProxiesFlaggedTrueMarkersNot(CovariateTracking tracking)
    {
        string Describe(MarkerTracking m) =>
            $"{m.Marker}: marginal {m.Marginal}, conditional on age {m.Conditional[0]}, thresholds {tracking.MarginalThreshold} / {tracking.ConditionalThresholds[0]}, tracks [{string.Join(",", m.Tracks)}]";
        string shortlist = string.Join("; ", tracking.Markers.Select(Describe));
        var proxies = tracking.Markers.Where(m => Proxies.Contains(m.Marker)).ToList();
        var trueMarkers = tracking.Markers.Where(m => TrueMarkers.Contains(m.Marker)).ToList();
        Assert.True(proxies.Count >= 2 && trueMarkers.Count >= 2, "shortlist: " + shortlist);
        // Known truth (by construction): the proxies reach the outcome only through age, so
        // permuting them within age strata keeps what they carry (Strobl et al. 2008) and each is
        // flagged as tracking age; none tracks sex (a coin flip).
        foreach (var marker in proxies)
        {
            Assert.True(marker.Tracks.Contains("age"), Describe(marker) + " | " + shortlist);
            Assert.DoesNotContain("sex", marker.Tracks);
        }
        // Known truth: the true markers are independent of age and carry signal of their own, so
        // none tracks a covariate.
        foreach (var marker in trueMarkers) Assert.True(marker.Tracks.Count == 0, Describe(marker) + " | " + shortlist);
    }
}
