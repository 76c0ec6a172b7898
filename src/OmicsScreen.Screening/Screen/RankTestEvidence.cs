using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>The rank-test p-values of a screen's features and of its decoys, on the samples the screen uses.</summary>
internal static class RankTestEvidence
{
    public static (double[] Features, double[] Decoys) Compute(Panel panel, int[] rows, DecoyPlan decoys, int threadCount)
    {
        var features = UnivariateScreen.RankTestPValues(panel.Matrix, panel.Outcome, rows, threadCount);
        var decoyValues = decoys.DecoyCount == 0 ? [] : UnivariateScreen.RankTestPValues(decoys.Values(panel.Matrix), panel.Outcome, rows, threadCount);
        return (features, decoyValues);
    }
}
