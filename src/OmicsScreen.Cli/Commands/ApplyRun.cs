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
        var (model, discoveryIds) = LockedPanelFile.ReadWithDiscoveryIds(options.ModelPath);
        var displayNames = LockedPanelFile.ReadDisplayNames(options.ModelPath);
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
        // But a locked panel scores classes, so a measured outcome is refused before anything is written.
        var loaded = PanelLoader.Load(options.ToLoadOptions()).EnsureClasses();
        return (loaded.Panel.Matrix, loaded.Panel.Outcome, loaded.Inputs);
    }

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
