namespace OmicsScreen.Cli.Commands;

/// <summary>Everything `demo` was asked to do.</summary>
public sealed record DemoRunOptions(string PanelFolder, string ReportFolder, ulong Seed, bool PanelOnly, bool Quiet = false);
