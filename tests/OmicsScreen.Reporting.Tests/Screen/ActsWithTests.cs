using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Tests.Screen;

public sealed class ActsWithTests
{
    private static FeatureSummary Feature(double rankTestP, double interactionP, int partner) =>
        new(0, "AN0001", 1, 1, 1, 1, 0.1, 0.01, 0.1, 0.01, 0.1, 0.01, 0.01, double.NaN, 1e-6, 1e-4, 1)
        {
            RankTestP = rankTestP,
            InteractionP = interactionP,
            InteractionPartner = partner,
        };

    [Fact]
    public void A_marker_carried_by_its_pair_names_its_partner_and_a_marker_that_shifts_does_not()
    {
        // Common practice: name the partner only where the pair, not a shift of the marker's own,
        // carries the evidence (scan p <= 0.05 and below the rank test's).
        Assert.Equal(7, ScreenReportTables.ActsWith(Feature(rankTestP: 0.6, interactionP: 1e-9, partner: 7)));
        Assert.Equal(-1, ScreenReportTables.ActsWith(Feature(rankTestP: 1e-8, interactionP: 1e-3, partner: 7)));
        Assert.Equal(-1, ScreenReportTables.ActsWith(Feature(rankTestP: 0.6, interactionP: 0.2, partner: 7)));
        // The scan did not run: no partner, whatever the p-values say.
        Assert.Equal(-1, ScreenReportTables.ActsWith(Feature(rankTestP: 0.6, interactionP: double.NaN, partner: -1)));
        // No rank test (forest evidence alone): the scan's p-value decides on its own.
        Assert.Equal(3, ScreenReportTables.ActsWith(Feature(rankTestP: double.NaN, interactionP: 0.01, partner: 3)));
    }
}
