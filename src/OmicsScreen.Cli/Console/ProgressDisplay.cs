using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Console;

/// <summary>
/// Shows a screen's progress on standard error: a redrawn bar with stage, count, the run's
/// elapsed time and the stage's estimated time left on a terminal; plain timestamped lines
/// otherwise (CI logs, pipes), so no terminal control code ever lands in a file.
/// </summary>
/// <remarks>
/// The screen reports a stage's start (0 of N) and its steps, not always its end: a stage is known
/// to be finished when the next one starts, so its bar is then drawn full (N of N) before the next
/// bar opens, and <see cref="Finish"/> does the same for the last stage.
/// </remarks>
internal sealed class ProgressDisplay : IProgress<ScreenProgress>
{
    private readonly CliConsole _console;
    private readonly bool _quiet;
    private readonly Stopwatch _stageWatch = new();
    private readonly Stopwatch _runWatch = Stopwatch.StartNew();
    private ScreenProgress? _last;
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
                CompleteStage();
                CloseBar();
                _stage = value.Stage;
                _stageWatch.Restart();
                _lastPercentLogged = -1;
                if (!_console.IsTerminal) Log($"{StageName(value.Stage)}: started");
            }
            _last = value;
            if (_console.IsTerminal) DrawBar(value);
            else LogMilestone(value);
        }
    }

    /// <summary>The run succeeded: the last stage's bar is drawn full and the run's total time printed.</summary>
    public void Finish()
    {
        if (_quiet) return;
        lock (_gate)
        {
            CompleteStage();
            CloseBar();
            Log($"finished in {Duration(_runWatch.Elapsed.TotalSeconds)}");
        }
    }

    /// <summary>Shows the current stage as done, since the screen has moved past it.</summary>
    private void CompleteStage()
    {
        if (_last is not { } last || last.Done >= last.Total) return;
        var done = last with { Done = Math.Max(last.Total, 1), Total = Math.Max(last.Total, 1) };
        _last = done;
        if (_console.IsTerminal) DrawBar(done);
        else Log($"{StageName(done.Stage)}: {done.Done}/{done.Total} in {Duration(_stageWatch.Elapsed.TotalSeconds)}");
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
            ? ", ~" + Duration(_stageWatch.Elapsed.TotalSeconds / value.Done * (value.Total - value.Done)) + " left in this stage"
            : "";
        string percent = ((int)Math.Floor(fraction * 100)).ToString(CultureInfo.InvariantCulture);
        _console.Error.Write($"\r{StageName(value.Stage),-22} [{new string('#', filled)}{new string('.', width - filled)}] {percent,3}% {value.Done}/{value.Total}"
            + $" (elapsed {Duration(_runWatch.Elapsed.TotalSeconds)}{eta})\u001b[K");
        _barOpen = true;
    }

    private void LogMilestone(ScreenProgress value)
    {
        if (value.Total <= 1 || value.Done == 0) return;
        int percent = (int)(100.0 * value.Done / value.Total);
        // A line per tenth keeps logs short on long runs.
        if (percent / 10 == _lastPercentLogged / 10 && value.Done != value.Total) return;
        _lastPercentLogged = percent;
        Log($"{StageName(value.Stage)}: {value.Done}/{value.Total} (elapsed {Duration(_runWatch.Elapsed.TotalSeconds)})");
    }

    private void CloseBar()
    {
        if (!_barOpen) return;
        _console.Error.WriteLine();
        _barOpen = false;
    }

    private void Log(string message) =>
        _console.Error.WriteLine($"{DateTime.Now.ToString("HH:mm:ss", CultureInfo.InvariantCulture)} {message}");

    internal static string Duration(double seconds) =>
        seconds < 90 ? $"{seconds:0}s" : seconds < 5400 ? $"{Math.Floor(seconds / 60):0}m {seconds % 60:00}s" : $"{seconds / 3600:0.0}h";

    public static string StageName(ScreenStage stage) => stage switch
    {
        ScreenStage.Binning => "binning",
        ScreenStage.UnivariateStatistics => "univariate statistics",
        ScreenStage.ReferenceForest => "reference forest",
        ScreenStage.Repeats => "half-sample repeats",
        ScreenStage.OutcomePermutations => "outcome permutations",
        ScreenStage.Effects => "effect shapes and partners",
        ScreenStage.PanelSizeCurve => "panel-size curve",
        ScreenStage.Cohorts => "cohort check",
        ScreenStage.WorkUnits => "work units",
        _ => stage.ToString(),
    };
}
