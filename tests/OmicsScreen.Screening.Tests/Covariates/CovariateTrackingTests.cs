using OmicsScreen.Screening.Covariates;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Covariates;

/// <summary>
/// Markers that only track age are flagged, markers with signal of their own are not
/// (<see cref="CovariatePanels"/>, known truth by construction), and the association table holds
/// every marker-covariate pair.
/// </summary>
public class CovariateTrackingTests
{
    private static ScreenOptions Quick(ulong seed) => new()
    {
        Seed = seed, HalfSamplePairs = 5, TreesPerForest = 200, CurveFolds = 0,
    };

    private static readonly string[] Planted = ["SIM000", "SIM001", "SIM002"];

    [Fact]
    public void Markers_that_only_proxy_age_are_flagged_as_tracking_age_and_not_sex()
    {
        var result = ScreenRunner.Run(CovariatePanels.Proxy(240, 40, 21), Quick(21));

        var tracking = Assert.IsType<CovariateTracking>(result.CovariateTracking);
        var planted = tracking.Markers.Where(m => Planted.Contains(m.Marker)).ToList();
        // Known truth: the outcome depends on age alone and the planted markers are age plus noise
        // (by construction), so each found is flagged as tracking age (Strobl et al. 2008: permuting
        // within age strata keeps their age-related part), and none as tracking sex (a coin flip).
        Assert.True(planted.Count >= 2, "shortlist: " + string.Join(", ", tracking.Markers.Select(m => m.Marker)));
        foreach (var marker in planted)
        {
            Assert.True(marker.Tracks.Contains("age"), $"{marker.Marker}: marginal {marker.Marginal}, conditional on age {marker.Conditional[0]}, thresholds {tracking.MarginalThreshold} / {tracking.ConditionalThresholds[0]}");
            Assert.DoesNotContain("sex", marker.Tracks);
        }
        // Spearman association of every planted marker with age is strong (built in: rho about 0.7).
        foreach (var association in tracking.Associations.Where(a => Planted.Contains(a.Marker) && a.Covariate == "age"))
        {
            Assert.Equal("spearman", association.Test);
            Assert.True(association.Effect > 0.5 && association.QValue < 0.001, association.ToString());
        }
        Assert.Equal(tracking.Markers.Count * 2, tracking.Associations.Count);
        Assert.All(tracking.Associations.Where(a => a.Covariate == "sex"), a => Assert.Equal("kruskal_wallis", a.Test));
    }

    [Fact]
    public void Markers_with_signal_of_their_own_are_not_flagged()
    {
        var result = ScreenRunner.Run(CovariatePanels.Adds(240, 40, 22), Quick(22));

        var tracking = Assert.IsType<CovariateTracking>(result.CovariateTracking);
        var planted = tracking.Markers.Where(m => Planted.Contains(m.Marker)).ToList();
        // Known truth: the planted markers are independent of age and enter the outcome themselves
        // (by construction): permuting them within age strata destroys their signal as much as
        // permuting them freely, so none tracks a covariate.
        Assert.True(planted.Count >= 2, "shortlist: " + string.Join(", ", tracking.Markers.Select(m => m.Marker)));
        foreach (var marker in planted) Assert.True(marker.Tracks.Count == 0, $"{marker.Marker} tracks {string.Join(",", marker.Tracks)}");
    }
}
