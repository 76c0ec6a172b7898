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
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `apply` with a panel locked on a time to an event: risk scores and groups, and with follow-up
/// known Harrell's C, the time-dependent AUC at --horizon and the risk groups' survival.
/// </summary>
internal static class ApplyFollowUpRun
{
    public static int Execute(CliConsole console, ApplyRunOptions options, ResultsFolder folder, LoadedLockedPanel stored, DateTimeOffset started)
    {
        var model = stored.FollowUp!;
        var (matrix, followUp, inputs) = LoadCohort(options);
        if (followUp is not null && options.Horizon is { } horizon
            && TimeDependentAuc.HorizonProblem(followUp.Times, followUp.Events, horizon) is { } problem)
            throw new CommandInputException(FormattableString.Invariant(
                $"{Path.GetFileName(options.SampleSheetPath ?? options.MatrixPath)}: --horizon {horizon:G6}: {problem}. Choose a horizon after the first event and before the last follow-up time."),
                ExitCode.InputError);
        var overlap = DiscoveryOverlap.Warnings(model.Provenance, stored.DiscoverySampleIdHashes, inputs, matrix.SampleIds);
        LockedFollowUpScores scores;
        try
        {
            scores = LockedPanelScorer.ScoreFollowUp(model, matrix);
        }
        catch (MissingMarkersException e)
        {
            throw new CommandInputException($"{Path.GetFileName(options.MatrixPath)}: {e.Message}", ExitCode.InputError);
        }
        var performance = followUp is null ? null
            : LockedPanelEvaluation.EvaluateFollowUp(scores, followUp.Times, followUp.Events, options.Horizon);

        folder.ClearEarlierOutputs();
        double[]? times = followUp?.Times.ToArray();
        bool[]? events = followUp?.Events.ToArray();
        folder.WriteText(ApplyResultFiles.Scores, w => ApplyTables.WriteFollowUpScores(w, scores, times, events));
        if (performance is not null)
        {
            folder.WriteText(ApplyResultFiles.Evaluation, w => ManifestJson.Write(w, ApplyFollowUpEvaluation.Of(model, scores, performance, overlap)));
            folder.WriteText(ApplyResultFiles.RiskGroups, w => ApplyTables.WriteRiskGroupCurves(w, performance));
        }
        folder.WriteText(ApplyResultFiles.Report, w => w.Write(FollowUpApplyReport.Build(model, scores, performance, options.MatrixPath,
            options.ShowSampleIds, overlap, stored.DisplayNames)));
        ApplyManifests.Write(folder, options, stored, inputs, started);

        foreach (var warning in overlap) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
        foreach (var warning in scores.Warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning.Message)}");
        if (options.Json) ManifestJson.Write(console.Out, ApplyFollowUpHeadline.Of(model, scores, performance, folder.Path, overlap, stored.DisplayNames));
        else PrintSummary(console.Out, model, scores, performance, folder.Path, stored.DisplayNames);
        return ExitCode.Success;
    }

    private static (FeatureMatrix Matrix, FollowUpOutcome? FollowUp, IReadOnlyList<InputFileRecord> Inputs) LoadCohort(ApplyRunOptions options)
    {
        if (options.FollowUpColumn is null)
        {
            var (matrix, input) = MatrixLoader.Load(options.MatrixPath, options.Layout, options.SampleIdColumn, options.AnnotationColumns,
                longColumns: options.MatrixColumns());
            return (matrix, null, [input]);
        }
        // No EnsureScreenable: a validation cohort with few events can still be scored; the report says how few.
        var loaded = PanelLoader.Load(options.ToLoadOptions());
        ApplyRun.EnsureKind(loaded, OutcomeKind.TimeToEvent, options);
        return (loaded.Panel.Matrix, loaded.Panel.FollowUp, loaded.Inputs);
    }

    private static void PrintSummary(TextWriter output, LockedFollowUpPanel model, LockedFollowUpScores scores, LockedFollowUpPerformance? performance,
        string folder, IReadOnlyDictionary<string, string> displayNames)
    {
        int high = scores.HighRiskCount;
        output.WriteLine(FormattableString.Invariant(
            $"Scored {scores.SampleCount} samples with a locked panel of {model.MarkerCount} markers and {model.Trees.Count} trees (a random survival forest); risk groups: {high} high, {scores.SampleCount - high} low (cut at the discovery median risk score {model.RiskGroupCut:G4})."));
        output.WriteLine(TextTable.Printable("Markers (matched by id): " + string.Join(", ", model.MarkerNames.Select(m => MarkerLabels.Label(m, displayNames)))));
        if (performance is not null)
        {
            var c = performance.Concordance;
            output.WriteLine();
            output.WriteLine(FormattableString.Invariant(
                $"Concordance (Harrell's C) {c.Concordance:0.000} [95% CI {c.Interval.Lower:0.000} to {c.Interval.Upper:0.000}] over {performance.EventCount} events; discovery out-of-bag C {model.OutOfBagConcordance:0.000}."));
            if (performance.TimeDependentAuc is { } auc)
                output.WriteLine(FormattableString.Invariant(
                    $"Time-dependent AUC at {auc.Horizon:G6}: {auc.Auc:0.000} ({auc.Cases} events by then against {auc.Controls} samples followed beyond it, censoring-weighted)."));
            if (performance.LogRank is { } test)
                output.WriteLine(FormattableString.Invariant($"Risk groups: log-rank chi-square {test.ChiSquare:0.00}, p {test.PValue:G2}."));
        }
        output.WriteLine();
        output.WriteLine($"Results in {folder}");
        output.WriteLine("A risk score ranks samples; it is not a calibrated survival probability. Validate the panel in independent cohorts before any use.");
    }
}
