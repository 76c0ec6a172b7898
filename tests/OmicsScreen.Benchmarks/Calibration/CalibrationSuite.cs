using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The calibration suite of issue 12 (item 7): screens every shape and design of
/// <see cref="CalibrationCatalogue"/> for each seed with the default screen, in this process
/// (it measures error control, not time), prints each panel as it finishes and then the table,
/// the goals and the p-value uniformity.
/// Usage: calibration [--seeds N] [--first-seed S] [--quick] [--threads T] [--kind classes|measured|follow-up] [--only NAME[,NAME...]],
/// or calibration shuffled ... (<see cref="ShuffledOutcomeCheck"/>), or calibration evidence|weigh ... (<see cref="CombinationStudy"/>).
/// </summary>
public static class CalibrationSuite
{
    public static int Run(IReadOnlyList<string> args, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(args);
        ArgumentNullException.ThrowIfNull(output);
        if (args.Count > 0 && args[0] is "shuffled" or "evidence" or "weigh")
        {
            try
            {
                return args[0] == "shuffled" ? ShuffledOutcomeCheck.Run(args.Skip(1).ToList(), output) : CombinationStudy.Run(args, output);
            }
            catch (Exception error) when (error is ArgumentException or FormatException)
            {
                Console.Error.WriteLine(error.Message);
                return 2;
            }
        }
        CalibrationSettings settings;
        try
        {
            settings = CalibrationSettings.Parse(args);
            foreach (var name in settings.Only)
                if (!CalibrationCatalogue.All.Contains(name))
                    throw new ArgumentException($"No calibration shape or design is called '{name}'. Known: {string.Join(", ", CalibrationCatalogue.All)}.");
        }
        catch (ArgumentException error)
        {
            Console.Error.WriteLine(error.Message);
            Console.Error.WriteLine("Usage: calibration [--seeds N] [--first-seed S] [--quick] [--threads T] [--kind classes|measured|follow-up] [--only NAME[,NAME...]]");
            return 2;
        }

        var designs = CalibrationCatalogue.All
            .Where(d => settings.Only.Count == 0 || settings.Only.Contains(d))
            .Where(d => settings.Kind is null || CalibrationCatalogue.Create(d, 1).Kind == settings.Kind)
            .ToList();
        var defaults = new Screening.Screen.ScreenOptions();
        output.WriteLine(Invariant($"# calibration: {designs.Count} shapes/designs x {settings.SeedCount} seed{(settings.SeedCount == 1 ? "" : "s")} = {designs.Count * settings.SeedCount} panels; threads {(settings.ThreadCount == 0 ? "all" : settings.ThreadCount.ToString(CultureInfo.InvariantCulture))}"));
        output.WriteLine(Invariant($"# machine: {Environment.ProcessorCount} cores, load average {LoadAverage()}"));
        output.WriteLine(settings.Quick
            ? Invariant($"# QUICK run: {CalibrationSettings.QuickHalfSamplePairs} half-sample pairs (default {defaults.HalfSamplePairs}), {CalibrationSettings.QuickTreesPerForest} trees per forest (default {defaults.TreesPerForest}); every other option at its default. Quick figures show the suite works; judge the goals on a full run.")
            : "# full run: every screen option at its default");
        output.WriteLine();

        var watch = Stopwatch.StartNew();
        var panels = new List<PanelCalibration>();
        for (int seedNumber = settings.FirstSeed; seedNumber < settings.FirstSeed + settings.SeedCount; seedNumber++)
            foreach (var design in designs)
            {
                var model = CalibrationCatalogue.Create(design, seedNumber);
                var panel = PanelMeasurer.Measure(model, settings);
                panels.Add(panel);
                output.WriteLine(ProgressLine(panel, panels.Count, designs.Count * settings.SeedCount, watch.Elapsed.TotalSeconds));
                output.Flush();
            }
        double wall = watch.Elapsed.TotalSeconds;
        output.WriteLine();
        // Group rows in catalogue order, whatever order the panels ran in.
        var ordered = panels.OrderBy(p => designs.IndexOf(p.Design)).ThenBy(p => p.Seed).ToList();
        CalibrationReport.Write(ordered, output);
        output.WriteLine();
        output.WriteLine(Invariant($"Wall time: {wall:F0} s for {panels.Count} panel{(panels.Count == 1 ? "" : "s")} ({wall / Math.Max(1, panels.Count):F1} s per panel){(settings.Quick ? ", quick settings" : "")}; load average at the end {LoadAverage()}."));
        return 0;
    }

    private static string ProgressLine(PanelCalibration p, int done, int total, double elapsed)
    {
        string measure = p.Kind switch
        {
            OutcomeKind.Measured => "R²",
            OutcomeKind.TimeToEvent => "C",
            _ => p.ClassCount == 2 ? "AUC" : "accuracy",
        };
        string estimate = p.LockedPanelSize == 0
            ? "no panel locked"
            : Invariant($"locked {p.LockedPanelSize}, {measure} selection-aware {Number(p.SelectionAwareEstimate)} fresh {Number(p.FreshEstimate)}");
        if (p.CurveFolds > 0) estimate += Invariant($"; folds without a panel {p.FoldsWithoutPanel}/{p.CurveFolds}, mean fold panel {p.MeanFoldPanelSize:F1}");
        if (double.IsFinite(p.EventShare)) estimate += Invariant($"; events {p.EventShare:P0}");
        string found = p.IsNull ? "" : Invariant($", true {p.TrueDiscoveries}/{p.RelatedCount} (baseline {p.BaselineTrueDiscoveries})");
        if (p.PairFound is { } pair) found += pair ? ", pair found" : ", pair missed";
        if (p.ThresholdFound is { } threshold) found += threshold ? ", threshold found" : ", threshold missed";
        return Invariant(
            $"[{done}/{total}] {p.Design} seed {p.Seed}: shortlist {p.Shortlisted} (false {p.FalseDiscoveries}, FDP {p.FalseDiscoveryProportion:F3}, decoy estimate {Number(p.DecoyEstimate)}){found}; {estimate}; null p <= 1e-3/1e-4: {p.SmallNullPValues}; {p.Seconds:F1} s (total {elapsed:F0} s){(p.SpecialMarkers.Length > 0 ? " [" + p.SpecialMarkers + "]" : "")}{(p.FalseEntries.Length > 0 ? " {false: " + p.FalseEntries + "}" : "")}{(p.MissedEntries.Length > 0 ? " {missed: " + p.MissedEntries + "}" : "")}");
    }

    /// <summary>The 1-minute load average from /proc/loadavg, for reading wall times on a shared machine; "n/a" elsewhere.</summary>
    private static string LoadAverage()
    {
        const string path = "/proc/loadavg";
        try
        {
            return File.Exists(path) ? File.ReadAllText(path).Split(' ')[0] : "n/a";
        }
        catch (IOException)
        {
            return "n/a";
        }
    }

    private static string Number(double value) => double.IsNaN(value) ? "n/a" : value.ToString("F3", CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
