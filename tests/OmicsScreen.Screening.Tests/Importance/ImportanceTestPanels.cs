using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Importance;

/// <summary>Small simulated panels shared by the importance tests, binned once.</summary>
internal static class ImportanceTestPanels
{
    /// <summary>Features 0..informativeCount-1 shifted by effectSize SDs in one class; the rest noise.</summary>
    public static (BinnedMatrix Matrix, ClassOutcome Outcome) Binned(int sampleCount, int featureCount, int informativeCount,
        double effectSize, ulong seed)
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec
        {
            SampleCount = sampleCount,
            FeatureCount = featureCount,
            InformativeCount = informativeCount,
            EffectSize = effectSize,
            BlockCorrelation = 0,
            Seed = seed,
        });
        return (new BinMapper().Bin(panel.Matrix, threadCount: 1), panel.Outcome);
    }
}
