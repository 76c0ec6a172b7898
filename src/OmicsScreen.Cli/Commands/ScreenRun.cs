using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Memory;
using OmicsScreen.Cli.Work;
using OmicsScreen.Data;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Output;
using OmicsScreen.Runs.Results;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Cli.Commands;

/// <summary>Loads a panel, runs the screen, writes the results folder and prints the top of the shortlist.</summary>
internal static class ScreenRun
{
    private const int PrintedMarkers = 15;

    public const string ReportFileName = ScreenResultFiles.Report;

    public const string CheckpointFolderName = ScreenResultFiles.CheckpointFolder;

    public const string CheckpointRecordName = ScreenResultFiles.CheckpointRecord;

    public static int Execute(CliConsole console, ScreenRunOptions options)
    {
        ScreenOptionChecks.Check(options.Screen);
        try
        {
            // A rule the option checks do not know yet still stops the run as a usage error.
            options.Screen.Validate();
        }
        catch (ArgumentException e)
        {
            throw new CommandInputException(e.Message);
        }
        InputPathGuard.Check(options.Panel.MatrixPath, "matrix");
        InputPathGuard.Check(options.Panel.SampleSheetPath, "sample sheet");
        InputPathGuard.Check(options.Panel.FeatureSheetPath, "feature sheet");
        if (!MemoryCheck.Passes(console, options)) return ExitCode.NotEnoughMemory;
        if (options.Part is not null) return ExecutePart(console, options);

        // The folder is checked and locked before any work; a refused run leaves it as it was.
        using var folder = ResultsFolder.Open(options.ResolveOutputFolder(), options.Force, ResultsKind.Screen, ResultsFolder.InputPaths(options.Panel), console.Error);
        var started = DateTimeOffset.UtcNow;
        var watch = Stopwatch.StartNew();
        var loaded = PanelLoader.Load(options.Panel).EnsureScreenable();
        double loadSeconds = watch.Elapsed.TotalSeconds;
        PrintKeepFeaturesNote(console, options);
        ScreenFeasibility.Check(options.Screen, loaded.Panel);

        var settings = ScreenSettings.Resolve(options.Screen, loaded.Panel);
        var (identity, record) = RunIdentity.Of("checkpoint", loaded, options.Panel, options.Screen, options.ShowSampleIds, options.CommandLine);
        var checkpoint = WorkFolder.Open(Path.Combine(folder.Path, CheckpointFolderName), CheckpointRecordName,
            record, identity, loaded.Panel.FeatureCount,
            settings.DecoyCount, options.Resume, options.Force, "checkpoint",
            Path.Combine(options.ResolveOutputFolder(), CheckpointFolderName));
        // From here on the run replaces the folder's earlier results; a refusal is never preceded by warnings.
        folder.ClearEarlierOutputs();
        PrintWarnings(console, ScreenWarnings.Of(options.Screen, loaded));
        var plan = WorkPlan.For(loaded.Panel, settings);
        if (options.Resume && !options.Quiet)
            console.Error.WriteLine($"resume: {checkpoint.CountPresent(plan.Units.Select(u => u.Unit))} of {plan.Units.Count} work units are in the checkpoint.");

        var progress = new ProgressDisplay(console, options.Quiet);
        ScreenResult result;
        try
        {
            result = ScreenRunner.Run(loaded.Panel, options.Screen, progress, default, checkpoint);
            progress.Finish();
        }
        finally
        {
            progress.Complete();
        }
        foreach (var discarded in checkpoint.Discarded) console.Error.WriteLine($"warning: checkpoint unit {discarded}; it was computed again.");

        WriteResults(console, options, loaded, result, folder, started, loadSeconds, mergedParts: 0);
        checkpoint.Delete();
        if (options.Resume)
            (options.Json ? console.Error : console.Out).WriteLine($"Resumed: {checkpoint.ReusedCount} of {plan.Units.Count} work units came from the checkpoint.");
        return ExitCode.Success;
    }

    private static int ExecutePart(CliConsole console, ScreenRunOptions options)
    {
        var loaded = PanelLoader.Load(options.Panel).EnsureScreenable();
        PrintKeepFeaturesNote(console, options);
        ScreenFeasibility.Check(options.Screen, loaded.Panel);
        return PartRun.Execute(console, options, loaded, options.Part!.Value);
    }

    private static void PrintKeepFeaturesNote(CliConsole console, ScreenRunOptions options)
    {
        if (options.Panel.KeepFeatures is not null)
            console.Error.WriteLine("note: only the features of the --keep-features list were read. If the list was chosen on these same samples "
                + "(a first-stage screen), q-values and the selection-aware panel-size curve do not account for that choice: confirm in independent samples.");
    }

    internal static void PrintWarnings(CliConsole console, IEnumerable<string> warnings)
    {
        foreach (var warning in warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
    }

    /// <summary>
    /// Writes the results folder of a finished screen (<see cref="ScreenResultsWriter"/>) and prints
    /// its summary: the same for a single run and for merged parts.
    /// </summary>
    internal static void WriteResults(CliConsole console, ScreenRunOptions options, LoadedPanel loaded, ScreenResult result,
        ResultsFolder folder, DateTimeOffset started, double loadSeconds, int mergedParts)
    {
        var request = new ScreenResultsRequest
        {
            Panel = options.Panel,
            Screen = options.Screen,
            ShowSampleIds = options.ShowSampleIds,
            CommandLine = options.CommandLine,
        };
        var written = ScreenResultsWriter.Write(request, loaded, result, folder, started, loadSeconds, mergedParts);
        if (options.Json) ManifestJson.Write(console.Out, ScreenHeadline.Of(loaded, result, written.Folder));
        else PrintSummary(console.Out, loaded, result, written);
    }

    private static void PrintSummary(TextWriter output, LoadedPanel loaded, ScreenResult result, ScreenResultsWritten written)
    {
        var panel = loaded.Panel;
        var settings = result.Settings;
        var o = settings.Options;
        output.WriteLine($"Screened {panel.SampleCount} samples x {panel.FeatureCount} features: {settings.RepeatCount} half-sample repeats, "
            + $"{o.TreesPerForest} trees per forest, seed {o.Seed}.");
        var reference = result.ReferenceForest;
        if (reference.OutOfBagRSquared is { } rSquared)
            output.WriteLine(FormattableString.Invariant($"Outcome: {panel.OutcomeColumn}, a measured quantity. Forest on all samples: out-of-bag R² {rSquared:0.000} (mean squared error {reference.OutOfBagError:0.###})."));
        else if (reference.OutOfBagConcordance is { } concordance)
            output.WriteLine(FormattableString.Invariant($"Outcome: follow-up '{panel.FollowUp!.TimeColumn}' with event '{panel.FollowUp.EventColumn}' ({panel.FollowUp.EventCount} events). Forest on all samples: out-of-bag concordance {concordance:0.000}."));
        else
        {
            string auc = reference.OutOfBagAuc is { } value ? FormattableString.Invariant($", AUC {value:0.000}") : "";
            output.WriteLine(FormattableString.Invariant($"Forest on all samples: out-of-bag error {reference.OutOfBagError:0.000}{auc}."));
        }
        output.WriteLine();
        if (result.Shortlist.Count == 0)
        {
            output.WriteLine($"Shortlist: empty. No feature reached q <= {o.QValueThreshold}{FrequencyClause(o)}.");
        }
        else
        {
            output.WriteLine($"Shortlist: {result.Shortlist.Count} markers (q <= {o.QValueThreshold}{FrequencyClause(o)})"
                + (result.Shortlist.Count > PrintedMarkers ? $", top {PrintedMarkers} shown" : ""));
            var labels = MarkerLabels.Of(loaded);
            // The single-marker effect in the outcome kind's measure: AUC, Spearman's rho or Harrell's C.
            string effect = result.Kind switch
            {
                Engine.Panels.OutcomeKind.Measured => "rho",
                Engine.Panels.OutcomeKind.TimeToEvent => "C",
                _ => "AUC",
            };
            var table = new TextTable("rank", "marker", "frequency", "median rank", "q", "direction", effect, "group").AlignRight(0, 2, 3, 4, 6, 7);
            foreach (var e in result.Shortlist.Take(PrintedMarkers))
                table.Add(e.Rank.ToString(CultureInfo.InvariantCulture), labels.Label(e.Forest.FeatureIndex, e.Forest.Feature),
                    e.Forest.SelectionFrequency.ToString("0.00", CultureInfo.InvariantCulture),
                    e.Forest.MedianRank.ToString("0.0", CultureInfo.InvariantCulture),
                    e.Forest.QValue.ToString("0.###", CultureInfo.InvariantCulture),
                    EffectTables.DirectionWords(e, result),
                    ScreenTables.EffectOf(e).ToString("0.000", CultureInfo.InvariantCulture),
                    e.RedundancyGroup.ToString(CultureInfo.InvariantCulture));
            table.WriteTo(output);
            if (result.CovariateTracking is { } tracking)
            {
                var tracked = result.Shortlist.Where(e => tracking.TracksOf(e.Forest.FeatureIndex).Count > 0).ToList();
                output.WriteLine(tracked.Count == 0
                    ? $"No shortlisted marker only tracks {UntrustedText.Printable(string.Join(", ", tracking.Covariates))}."
                    : "Only track a covariate: " + string.Join("; ", tracked.Select(e => UntrustedText.Printable(labels.Label(e.Forest.FeatureIndex, e.Forest.Feature))
                        + " tracks " + UntrustedText.Printable(string.Join(", ", tracking.TracksOf(e.Forest.FeatureIndex))))) + ".");
            }
        }
        output.WriteLine();
        output.WriteLine("Error control:");
        foreach (string line in ErrorControlText.Lines(result)) output.WriteLine("  " + line);
        if (result.PanelSize is { } curve)
        {
            var point = curve.Points.First(p => p.PanelSize == curve.RecommendedSize);
            output.WriteLine(FormattableString.Invariant(
                $"Panel-size curve: {curve.RecommendedSize} markers recommended over the whole grid, selection-aware {MetricText(curve.Metric)} {point.SelectionAwareAuc:0.000} +- {point.SelectionAwareAucStandardError:0.000} ({curve.FoldCount}-fold, selection inside each fold); optimistic {point.OptimisticAuc:0.000} if selection re-uses the samples."));
        }
        output.WriteLine(ErrorControlText.LockedPanelSentence(result));
        if (result.Cohorts is { } cohorts) CohortSummary.Print(output, result, cohorts);
        output.WriteLine();
        output.WriteLine($"Results: {written.Folder}");
        output.WriteLine($"Report: {written.Report}");
        if (written.LockedPanel is { } lockedPanel)
            output.WriteLine($"Locked panel for `omicsscreen apply`: {lockedPanel}");
        output.WriteLine("A screen is not a diagnostic test: confirm every marker in independent cohorts before any use.");
    }

    /// <summary>The curve's score as the console names it (the classes' names, auc and accuracy, as before).</summary>
    private static string MetricText(string metric) => metric switch
    {
        "r_squared" => "R²",
        "concordance" => "concordance (Harrell's C)",
        _ => metric,
    };

    private static string FrequencyClause(ScreenOptions options) =>
        options.FrequencyThreshold > 0 ? FormattableString.Invariant($" and selected in >= {options.FrequencyThreshold * 100:0}% of repeats") : "";
}
