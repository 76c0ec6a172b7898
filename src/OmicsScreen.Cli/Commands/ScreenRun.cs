using System.Diagnostics;
using System.Globalization;
using System.Security.Cryptography;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Memory;
using OmicsScreen.Cli.Work;
using OmicsScreen.Data;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Univariate;
using OmicsScreen.Runs;
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
        using var folder = ResultsFolder.Open(options.ResolveOutputFolder(), options.Force, ResultsKind.Screen, InputPaths(options.Panel), console.Error);
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
        PrintWarnings(console, Warnings(options, loaded));
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

    /// <summary>
    /// What the run should be warned about: the loader's warnings (an outcome column given twice,
    /// constant features, dropped samples) and settings that are legal but weak. Printed before the
    /// work starts and kept in the manifest's warnings list.
    /// </summary>
    /// <param name="withSampleIds">False for the report without --show-sample-ids: a warning that names samples says how many instead.</param>
    internal static List<string> Warnings(ScreenRunOptions options, LoadedPanel loaded, bool withSampleIds = true)
    {
        var warnings = new List<string>();
        foreach (var finding in loaded.Inspection.Findings)
        {
            if (finding.Severity != FindingSeverity.Warning) continue;
            if (!withSampleIds && finding.Code == "unmatched-samples-dropped")
                warnings.Add($"{loaded.Inspection.DroppedSamples.Count} samples were dropped because they are in only one file (--drop-unmatched); the console named them, and --show-sample-ids lists them here.");
            else if (!withSampleIds && finding.Code == "names-differ-only-by-case" && finding.Message.Contains("sample ids", StringComparison.Ordinal))
                warnings.Add("Some sample ids differ from another only by upper and lower case; they are kept as different samples. `omicsscreen check` names them.");
            else warnings.Add(finding.Message);
        }
        warnings.AddRange(ScreenFeasibility.Warnings(options.Screen, loaded.Panel));
        return warnings;
    }

    internal static void PrintWarnings(CliConsole console, IEnumerable<string> warnings)
    {
        foreach (var warning in warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
    }

    /// <summary>The files a run reads, which its outputs must never replace.</summary>
    internal static IEnumerable<string?> InputPaths(PanelLoadOptions panel) => [panel.MatrixPath, panel.SampleSheetPath, panel.FeatureSheetPath];

    /// <summary>
    /// Writes every table, the locked panel, the report and (last) the manifest of a finished
    /// screen, and prints its summary: the same for a single run and for merged parts.
    /// </summary>
    internal static void WriteResults(CliConsole console, ScreenRunOptions options, LoadedPanel loaded, ScreenResult result,
        ResultsFolder folder, DateTimeOffset started, double loadSeconds, int mergedParts)
    {
        var labels = MarkerLabels.Of(loaded);
        folder.WriteText("shortlist.tsv", w => ScreenTables.WriteShortlist(w, result, labels));
        folder.WriteText("features.tsv", w => ScreenTables.WriteFeatures(w, result, labels));
        if (result.PanelSize is { } curve) folder.WriteText("panel_size_curve.tsv", w => ScreenTables.WritePanelSizeCurve(w, curve));
        switch (result.Kind)
        {
            case Engine.Panels.OutcomeKind.Measured:
                folder.WriteText("marker_statistics.tsv", w => OutcomeMarkerTableWriter.WriteMeasured(w, result.MeasuredMarkers));
                break;
            case Engine.Panels.OutcomeKind.TimeToEvent:
                folder.WriteText("marker_statistics.tsv", w => OutcomeMarkerTableWriter.WriteFollowUp(w, result.FollowUpMarkers));
                break;
            default:
                folder.WriteText("marker_statistics.tsv", w => UnivariateTableWriter.WriteAllSamples(w, result.Univariate));
                break;
        }
        if (result.Univariate.PerCohort.Count > 0)
            folder.WriteText("marker_statistics_by_cohort.tsv", w => UnivariateTableWriter.WritePerCohort(w, result.Univariate));
        if (result.Cohorts is { } cohorts) CohortTableFiles.Write(folder, cohorts);
        if (result.AddedValue is { } added) folder.WriteText(AddedValueTables.FileName, w => AddedValueTables.Write(w, added));
        if (result.CovariateTracking is { } tracking) folder.WriteText(CovariateTrackingTables.FileName, w => CovariateTrackingTables.Write(w, tracking));
        // The shortlist (or its prefix the curve recommends), locked for scoring new cohorts with
        // `apply`, for every outcome kind; an empty shortlist locks nothing.
        LockedPanelWritten? locked = null;
        if (result.LockedPanelSize > 0)
        {
            locked = PanelLocking.Lock(folder.Path, loaded, result);
            folder.WrittenFiles.Add(locked.FileName);
        }
        var finished = DateTimeOffset.UtcNow;
        var report = ReportInput(options, loaded, result, folder, started, finished, loadSeconds)
            with { MergedParts = mergedParts, LockedRiskGroups = locked?.DiscoveryRiskGroups };
        folder.WriteText(ReportFileName, w => w.Write(ScreenReport.Render(report)));
        var manifest = ScreenManifestBuilder.Build(options.CommandLine, options.Panel, loaded, result, started, finished, loadSeconds, folder.WrittenFiles, Warnings(options, loaded), mergedParts);
        folder.WriteText(ResultsFolder.ManifestFileName, w => ManifestJson.Write(w, manifest));

        if (options.Json) ManifestJson.Write(console.Out, ScreenHeadline.Of(loaded, result, folder.Path));
        else PrintSummary(console.Out, loaded, result, folder.Path);
    }

    /// <summary>What the report shows: the run's provenance, with the SHA-256 of every table already written beside it.</summary>
    private static ScreenReportInput ReportInput(ScreenRunOptions options, LoadedPanel loaded, ScreenResult result, ResultsFolder folder,
        DateTimeOffset started, DateTimeOffset finished, double loadSeconds)
    {
        var inputs = new List<ReportedFile>(loaded.Inputs.Count);
        for (int i = 0; i < loaded.Inputs.Count; i++)
            inputs.Add(new ReportedFile(i == 0 ? "matrix" : loaded.Inputs[i].Path == options.Panel.FeatureSheetPath ? "feature sheet" : "sample sheet",
                loaded.Inputs[i].Path, loaded.Inputs[i].Sha256));
        var tables = new List<ReportedFile>(folder.WrittenFiles.Count);
        foreach (var name in folder.WrittenFiles)
        {
            using var stream = File.OpenRead(Path.Combine(folder.Path, name));
            tables.Add(new ReportedFile("result table", name, Convert.ToHexStringLower(SHA256.HashData(stream))));
        }
        int threads = result.Settings.ThreadCount;
        return new ScreenReportInput(loaded.Panel, result, inputs, LayoutText(options.Panel), tables,
            ShellWords.Join(options.CommandLine), ToolVersion.Current, started, finished, loadSeconds,
            Environment.ProcessorCount, threads, options.ShowSampleIds, Warnings: Warnings(options, loaded, withSampleIds: options.ShowSampleIds),
            Labels: MarkerLabels.Of(loaded));
    }

    /// <summary>The layout, and any feature block or list the panel was narrowed to, with what that means for the error control.</summary>
    internal static string LayoutText(PanelLoadOptions panel)
    {
        string text = panel.Layout switch
        {
            PanelLayout.SamplesInRows => "samples in rows",
            PanelLayout.FeaturesInRows => "features in rows (--features-in-rows)",
            _ => "long table, one row per sample and feature (--long)",
        };
        if (panel.FeatureBlock is { } block) text += $"; feature block {block} only";
        if (panel.KeepFeatures is { } keep)
            text += $"; only {keep.Count} features from a list (when the list was chosen on these samples, "
                + "the q-values and the selection-aware curve do not account for that choice)";
        return text;
    }

    private static void PrintSummary(TextWriter output, LoadedPanel loaded, ScreenResult result, string folder)
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
                    ScreenTables.DirectionOf(e, result),
                    ScreenTables.EffectOf(e).ToString("0.000", CultureInfo.InvariantCulture),
                    e.RedundancyGroup.ToString(CultureInfo.InvariantCulture));
            table.WriteTo(output);
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
        output.WriteLine($"Results: {folder}");
        output.WriteLine($"Report: {Path.Combine(folder, ReportFileName)}");
        if (result.LockedPanelSize > 0)
            output.WriteLine($"Locked panel for `omicsscreen apply`: {Path.Combine(folder, LockedPanelFile.DefaultFileName)}");
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
