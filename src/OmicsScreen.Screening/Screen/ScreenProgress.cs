namespace OmicsScreen.Screening.Screen;

/// <summary>How far a stage of the screen has got; the CLI turns it into a progress bar or log line.</summary>
public readonly record struct ScreenProgress(ScreenStage Stage, int Done, int Total);
