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

/// <summary>`apply` with a panel locked on a measured outcome: predictions, and with the outcome known R², RMSE and the calibration line.</summary>
internal static class ApplyMeasuredRun
{
    public static int Execute(CliConsole console, ApplyRunOptions options, ResultsFolder folder, LoadedLockedPanel stored, DateTimeOffset started)
    {
        var model = stored.Measured!;
        var (matrix, observed, inputs) = LoadCohort(options);
        var overlap = DiscoveryOverlap.Warnings(model.Provenance, stored.DiscoverySampleIdHashes, inputs, matrix.SampleIds);
        LockedMeasuredScores scores;
        try
        {
            scores = LockedPanelScorer.ScoreMeasured(model, matrix);
        }
        catch (MissingMarkersException e)
        {
            throw new CommandInputException($"{Path.GetFileName(options.MatrixPath)}: {e.Message}", ExitCode.InputError);
        }
        var performance = observed is null ? null : LockedPanelEvaluation.EvaluateMeasured(scores, observed);

        folder.ClearEarlierOutputs();
        folder.WriteText(ApplyResultFiles.Scores, w => ApplyTables.WriteMeasuredScores(w, scores, observed));
        if (performance is not null)
        {
            folder.WriteText(ApplyResultFiles.Evaluation, w => ManifestJson.Write(w, ApplyMeasuredEvaluation.Of(model, scores, performance, overlap)));
            folder.WriteText(ApplyResultFiles.Calibration, w => ApplyTables.WriteMeasuredCalibration(w, performance));
        }
        folder.WriteText(ApplyResultFiles.Report, w => w.Write(MeasuredApplyReport.Build(model, scores, performance, options.MatrixPath,
            options.ShowSampleIds, overlap, stored.DisplayNames)));
        ApplyManifests.Write(folder, options, stored, inputs, started);

        foreach (var warning in overlap) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
        foreach (var warning in scores.Warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning.Message)}");
        if (options.Json) ManifestJson.Write(console.Out, ApplyMeasuredHeadline.Of(model, scores, performance, folder.Path, overlap, stored.DisplayNames));
        else PrintSummary(console.Out, model, scores, performance, folder.Path, stored.DisplayNames);
        return ExitCode.Success;
    }

    private static (FeatureMatrix Matrix, double[]? Observed, IReadOnlyList<InputFileRecord> Inputs) LoadCohort(ApplyRunOptions options)
    {
        if (options.OutcomeColumn is null)
        {
            var (matrix, input) = MatrixLoader.Load(options.MatrixPath, options.Layout, options.SampleIdColumn, options.AnnotationColumns,
                longColumns: options.MatrixColumns());
            return (matrix, null, [input]);
        }
        // The panel predicts a quantity, so the column is read as one (a number in every cell),
        // whatever its number of distinct values.
        var loaded = PanelLoader.Load(options.ToLoadOptions() with { OutcomeKind = OutcomeKindChoice.Measured });
        ApplyRun.EnsureKind(loaded, OutcomeKind.Measured, options);
        return (loaded.Panel.Matrix, loaded.Panel.Measured!.Values.ToArray(), loaded.Inputs);
    }

    private static void PrintSummary(TextWriter output, LockedMeasuredPanel model, LockedMeasuredScores scores, LockedMeasuredPerformance? performance,
        string folder, IReadOnlyDictionary<string, string> displayNames)
    {
        output.WriteLine($"Predicted {model.OutcomeName} for {scores.SampleCount} samples with a locked panel of {model.MarkerCount} markers and {model.Trees.Count} trees (a regression forest).");
        output.WriteLine(TextTable.Printable("Markers (matched by id): " + string.Join(", ", model.MarkerNames.Select(m => MarkerLabels.Label(m, displayNames)))));
        if (performance is not null)
        {
            var line = performance.Calibration;
            output.WriteLine();
            output.WriteLine(FormattableString.Invariant(
                $"R² {performance.RSquared:0.000}, RMSE {performance.RootMeanSquaredError:G4}; discovery out-of-bag R² {model.OutOfBagRSquared:0.000}."));
            output.WriteLine(FormattableString.Invariant(
                $"Calibration (observed on predicted): slope {line.Slope:0.000} [95% CI {line.SlopeInterval.Lower:0.000} to {line.SlopeInterval.Upper:0.000}], intercept {line.Intercept:G4} [95% CI {line.InterceptInterval.Lower:G4} to {line.InterceptInterval.Upper:G4}]."));
        }
        output.WriteLine();
        output.WriteLine($"Results in {folder}");
        output.WriteLine("A locked panel is a candidate for validation in independent cohorts, not a measurement of the outcome.");
    }
}
