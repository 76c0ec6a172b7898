using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Console;

/// <summary>
/// Shows a screen's progress on standard error: a redrawn bar with stage, count and estimated
/// time left on a terminal; plain timestamped lines otherwise (CI logs, pipes), so no terminal
/// control code ever lands in a file.
/// </summary>
internal sealed class ProgressDisplay : IProgress<ScreenProgress>
{
    private readonly CliConsole _console;
    private readonly bool _quiet;
    private readonly Stopwatch _stageWatch = new();
    private readonly object _gate = new();
    private ScreenStage? _stage;
    private int _lastPercentLogged = -1;
    private bool _barOpen;

    public ProgressDisplay(CliConsole console, bool quiet)
    {
        _console = console;
        _quiet = quiet;
    }

    public void Report(ScreenProgress value)
    {
        if (_quiet) return;
        lock (_gate)
        {
            if (_stage != value.Stage)
            {
                CloseBar();
                _stage = value.Stage;
                _stageWatch.Restart();
                _lastPercentLogged = -1;
                if (!_console.IsTerminal) Log($"{StageName(value.Stage)}: started");
            }
            if (_console.IsTerminal) DrawBar(value);
            else LogMilestone(value);
        }
    }

    /// <summary>Ends the current bar line; call when the run finishes or fails.</summary>
    public void Complete()
    {
        lock (_gate) CloseBar();
    }

    private void DrawBar(ScreenProgress value)
    {
        const int width = 28;
        double fraction = value.Total > 0 ? Math.Clamp((double)value.Done / value.Total, 0, 1) : 0;
        int filled = (int)Math.Round(fraction * width);
        string eta = value.Done > 0 && value.Done < value.Total
            ? " ~" + Duration(_stageWatch.Elapsed.TotalSeconds / value.Done * (value.Total - value.Done)) + " left"
            : "";
        _console.Error.Write($"\r{StageName(value.Stage),-22} [{new string('#', filled)}{new string('.', width - filled)}] {value.Done}/{value.Total}{eta}\u001b[K");
        _barOpen = true;
    }

    private void LogMilestone(ScreenProgress value)
    {
        if (value.Total <= 1 || value.Done == 0) return;
        int percent = (int)(100.0 * value.Done / value.Total);
        // A line per tenth keeps logs short on long runs.
        if (percent / 10 == _lastPercentLogged / 10 && value.Done != value.Total) return;
        _lastPercentLogged = percent;
        Log($"{StageName(value.Stage)}: {value.Done}/{value.Total}");
    }

    private void CloseBar()
    {
        if (!_barOpen) return;
        _console.Error.WriteLine();
        _barOpen = false;
    }

    private void Log(string message) =>
        _console.Error.WriteLine($"{DateTime.Now.ToString("HH:mm:ss", CultureInfo.InvariantCulture)} {message}");

    private static string Duration(double seconds) =>
        seconds < 90 ? $"{seconds:0}s" : seconds < 5400 ? $"{seconds / 60:0}m" : $"{seconds / 3600:0.0}h";

    public static string StageName(ScreenStage stage) => stage switch
    {
        ScreenStage.Binning => "binning",
        ScreenStage.UnivariateStatistics => "univariate statistics",
        ScreenStage.ReferenceForest => "reference forest",
        ScreenStage.Repeats => "half-sample repeats",
        ScreenStage.OutcomePermutations => "outcome permutations",
        ScreenStage.PanelSizeCurve => "panel-size curve",
        ScreenStage.Cohorts => "cohort check",
        ScreenStage.WorkUnits => "work units",
        _ => stage.ToString(),
    };
}
