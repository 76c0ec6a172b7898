using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Scores a panel the way the procedure would use it: a forest grown on the training rows with
/// only the panel's markers, then asked about rows it never saw. The panel-size curve scores a
/// fold's panels with it and the cohort check a held-out cohort, so both measure the same thing.
/// </summary>
internal static class PanelScorer
{
    public static PanelScore Score(ScreenContext context, ReadOnlySpan<int> features, int[] trainingRows, ReadOnlySpan<int> testRows,
        ForestStreams streams)
    {
        // The panel forest tries floor(sqrt(k)) features per split of its own k, whatever the screen used.
        var forestOptions = context.Settings.ForestOptions(context.Subject, streams);
        forestOptions = forestOptions with { Tree = forestOptions.Tree with { FeaturesPerSplit = null } };
        return context.ScreenOutcome.ScorePanel(context.Matrix, features, trainingRows, testRows, forestOptions);
    }
}
