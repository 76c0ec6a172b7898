using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// What every step of one screen works with, passed as one value instead of five: the panel, its
/// byte codes (binned once), the settings resolved against the panel (threads included), where
/// progress goes and the token that stops the run. Inner screens share their screen's context;
/// only the rows and the run seed they use differ.
/// </summary>
internal sealed record ScreenContext(Panel Panel, BinnedMatrix Matrix, ScreenSettings Settings,
    IProgress<ScreenProgress>? Progress, CancellationToken Cancellation)
{
    public ScreenOptions Options => Settings.Options;

    /// <summary>The class outcome; throws for other outcome kinds (steps that work for every kind use <see cref="ScreenOutcome"/>).</summary>
    public ClassOutcome Outcome => Panel.Outcome;

    /// <summary>What the screen's steps need of the outcome, whatever its kind.</summary>
    public ScreenOutcome ScreenOutcome { get; } = ScreenOutcome.For(Panel);

    public SampleGrouping? Subject => Panel.Subject;

    /// <summary>Worker threads, resolved once ("0 = all cores" read in <see cref="ScreenSettings.Resolve"/>).</summary>
    public int ThreadCount => Settings.ThreadCount;

    public void Report(ScreenStage stage, int done, int total) => Progress?.Report(new ScreenProgress(stage, done, total));
}
