using System.Globalization;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs;
using OmicsScreen.Runs.Apply;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Output;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Cli.Commands;

/// <summary>Reads a locked panel and a new cohort, scores it, evaluates it when the outcome is known, and writes the results folder.</summary>
internal static class ApplyRun
{
    public static int Execute(CliConsole console, ApplyRunOptions options)
    {
        options.Validate();
        InputPathGuard.Check(options.ModelPath, "locked panel");
        InputPathGuard.Check(options.MatrixPath, "matrix");
        InputPathGuard.Check(options.SampleSheetPath, "sample sheet");
        // The folder is checked and locked before any work; a refused run leaves it as it was.
        using var folder = ResultsFolder.Open(options.OutputFolder, options.Force, ResultsKind.Apply,
            [options.ModelPath, options.MatrixPath, options.SampleSheetPath], console.Error);
        var started = DateTimeOffset.UtcNow;
        var stored = LockedPanelFile.ReadAny(options.ModelPath);
        CheckOptionsFit(stored.Kind, options);
        if (stored.Kind == OutcomeKind.Measured) return ApplyMeasuredRun.Execute(console, options, folder, stored, started);
        if (stored.Kind == OutcomeKind.TimeToEvent) return ApplyFollowUpRun.Execute(console, options, folder, stored, started);
        var model = stored.Classes!;
        var discoveryIds = stored.DiscoverySampleIdHashes;
        var displayNames = stored.DisplayNames;
        var (matrix, outcome, inputs) = LoadCohort(options);
        var overlap = DiscoveryOverlap.Warnings(model, discoveryIds, inputs, matrix.SampleIds);
        LockedPanelScores scores;
        try
        {
            scores = LockedPanelScorer.Score(model, matrix);
        }
        catch (MissingMarkersException e)
        {
            throw new CommandInputException($"{Path.GetFileName(options.MatrixPath)}: {e.Message}", ExitCode.InputError);
        }
        LockedPanelPerformance? performance = null;
        if (outcome is not null)
        {
            try
            {
                performance = LockedPanelEvaluation.Evaluate(scores, outcome);
            }
            catch (ArgumentException e)
            {
                throw new CommandInputException($"{Path.GetFileName(options.MatrixPath)}: {e.Message}", ExitCode.InputError);
            }
        }

        folder.ClearEarlierOutputs();
        var knownClasses = outcome is null ? null : KnownClassNames(outcome);
        folder.WriteText(ApplyResultFiles.Scores, w => ApplyTables.WriteScores(w, scores, knownClasses));
        if (performance is not null)
        {
            folder.WriteText(ApplyResultFiles.Evaluation, w => ManifestJson.Write(w, ApplyEvaluation.Of(model, scores, performance, overlap)));
            folder.WriteText(ApplyResultFiles.Calibration, w => ApplyTables.WriteCalibration(w, performance));
            folder.WriteText(ApplyResultFiles.Confusion, w => ApplyTables.WriteConfusion(w, performance));
        }
        folder.WriteText(ApplyResultFiles.Report, w => w.Write(ApplyReport.Build(model, scores, performance, options.MatrixPath, options.ShowSampleIds, overlap, displayNames)));
        var manifest = new ApplyManifest
        {
            Version = ToolVersion.Current,
            CommandLine = ShellWords.Join(options.CommandLine),
            StartedUtc = started.ToString("O"),
            FinishedUtc = DateTimeOffset.UtcNow.ToString("O"),
            Model = new ManifestLockedPanel
            {
                Path = options.ModelPath,
                Sha256 = LockedPanelFile.FileSha256(options.ModelPath),
                Markers = model.MarkerNames,
                MarkerDisplayNames = displayNames,
                DiscoveryInputsSha256 = model.Provenance.InputSha256,
            },
            Inputs = inputs.Select(i => new ManifestInput(i.Path, i.ByteCount, i.Sha256)).ToArray(),
            Outputs = folder.WrittenFiles.ToArray(),
        };
        folder.WriteText(ResultsFolder.ManifestFileName, w => ManifestJson.Write(w, manifest));

        foreach (var warning in overlap) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
        if (options.Json)
        {
            foreach (var warning in scores.Warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning.Message)}");
            ManifestJson.Write(console.Out, ApplyHeadline.Of(model, scores, performance, folder.Path, overlap, displayNames));
        }
        else PrintSummary(console, model, scores, performance, folder.Path, displayNames);
        return ExitCode.Success;
    }

    private static (FeatureMatrix Matrix, ClassOutcome? Outcome, IReadOnlyList<InputFileRecord> Inputs) LoadCohort(ApplyRunOptions options)
    {
        if (options.OutcomeColumn is null)
        {
            var (matrix, input) = MatrixLoader.Load(options.MatrixPath, options.Layout, options.SampleIdColumn, options.AnnotationColumns,
                longColumns: options.MatrixColumns());
            return (matrix, null, [input]);
        }
        // No EnsureScreenable: a cohort of one class can still be scored and its error measured.
        // But a class panel scores classes, so another outcome kind is refused before anything is written.
        var loaded = PanelLoader.Load(options.ToLoadOptions());
        EnsureKind(loaded, OutcomeKind.Classes, options);
        return (loaded.Panel.Matrix, loaded.Panel.Outcome, loaded.Inputs);
    }

    /// <summary>
    /// Refuses options that belong to another outcome kind than the locked panel's, before the
    /// cohort is read: a usage error naming the options the panel needs.
    /// </summary>
    private static void CheckOptionsFit(OutcomeKind kind, ApplyRunOptions options)
    {
        string model = Path.GetFileName(options.ModelPath);
        switch (kind)
        {
            case OutcomeKind.Classes when options.FollowUpColumn is not null:
                throw new CommandInputException($"{model} is a panel locked on classes, so it calls classes; --follow-up, --event and --horizon are for a panel locked on a time to an event. Name the known class with --outcome.");
            case OutcomeKind.Measured when options.FollowUpColumn is not null:
                throw new CommandInputException($"{model} is a panel locked on a measured outcome, so it predicts that quantity; --follow-up, --event and --horizon are for a panel locked on a time to an event. Name the known value with --outcome.");
            case OutcomeKind.TimeToEvent when options.OutcomeColumn is not null:
                throw new CommandInputException($"{model} is a panel locked on a time to an event, so it scores risk; name the cohort's follow-up with --follow-up and --event instead of --outcome.");
        }
    }

    /// <summary>Refuses a cohort whose outcome, as read, is of another kind than the locked panel's (exit code 3: read, but not usable as it is).</summary>
    internal static void EnsureKind(LoadedPanel loaded, OutcomeKind expected, ApplyRunOptions options)
    {
        if (loaded.Panel.Kind == expected) return;
        string found = loaded.Panel.Kind switch
        {
            OutcomeKind.Measured => $"the outcome '{loaded.Panel.OutcomeColumn}' is a measured quantity",
            OutcomeKind.TimeToEvent => "the outcome is a time to an event",
            _ => $"the outcome '{loaded.Panel.OutcomeColumn}' reads as classes",
        };
        throw new CommandInputException(
            $"{Path.GetFileName(options.MatrixPath)}: {found}, but {Path.GetFileName(options.ModelPath)} is a panel locked on {LockedPanelJson.KindText(expected)}. "
            + $"Apply a panel locked on {LockedPanelJson.KindText(loaded.Panel.Kind)} (a screen of this outcome writes one), or name a column of {OutcomeText(expected)}; "
            + "`omicsscreen check` on the same files describes the outcome.",
            ExitCode.NotScreenable);
    }

    private static string OutcomeText(OutcomeKind kind) => kind == OutcomeKind.Classes ? "classes" : "the quantity the panel predicts";

    private static string[] KnownClassNames(ClassOutcome outcome)
    {
        var names = new string[outcome.SampleCount];
        var classes = outcome.SampleClasses;
        for (int s = 0; s < names.Length; s++) names[s] = outcome.ClassNames[classes[s]];
        return names;
    }

    private static void PrintSummary(CliConsole console, LockedPanel model, LockedPanelScores scores, LockedPanelPerformance? performance, string folder,
        IReadOnlyDictionary<string, string> displayNames)
    {
        var output = console.Out;
        foreach (var warning in scores.Warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning.Message)}");
        string rule = model.Threshold is { } threshold
            ? FormattableString.Invariant($"{model.ClassNames[model.PositiveClass]} when its probability is at least {threshold:0.###}")
            : "majority vote of the trees";
        output.WriteLine($"Scored {scores.SampleCount} samples with a locked panel of {model.MarkerCount} markers and {model.Trees.Count} trees; call: {rule}.");
        output.WriteLine(TextTable.Printable("Markers (matched by id): " + string.Join(", ", model.MarkerNames.Select(m => MarkerLabels.Label(m, displayNames)))));
        var called = new int[scores.ClassCount];
        foreach (int c in scores.PredictedClasses) called[c]++;
        output.WriteLine("Called: " + string.Join(", ", scores.ClassNames.Select((name, c) => $"{called[c]} {name}")) + ".");
        if (performance is not null)
        {
            output.WriteLine();
            if (performance.Auc is { } auc && performance.AucInterval is { } interval)
            {
                string discovery = model.OutOfBagAuc is { } value ? FormattableString.Invariant($"; discovery out-of-bag AUC {value:0.000}") : "";
                output.WriteLine(FormattableString.Invariant(
                    $"AUC {auc:0.000} [95% CI {interval.Lower:0.000} to {interval.Upper:0.000}] ({model.ClassNames[model.PositiveClass]} positive){discovery}."));
            }
            output.WriteLine(FormattableString.Invariant($"Error at the locked call: {performance.Error:0.000}"));
            output.WriteLine();
            var header = new List<string> { "known \\ called" };
            header.AddRange(performance.ClassNames);
            var table = new TextTable(header.ToArray()).AlignRight(Enumerable.Range(1, performance.ClassNames.Count).ToArray());
            for (int c = 0; c < performance.ClassNames.Count; c++)
            {
                var row = new List<string> { performance.ClassNames[c] };
                foreach (int count in performance.Confusion[c]) row.Add(count.ToString(CultureInfo.InvariantCulture));
                table.Add(row.ToArray());
            }
            table.WriteTo(output);
        }
        output.WriteLine();
        output.WriteLine($"Results in {folder}");
    }
}
