using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// `apply` with a panel locked on a time to an event: risk scores and groups, and with follow-up
/// known Harrell's C, the time-dependent AUC at --horizon and the risk groups' survival.
/// </summary>
internal sealed class FollowUpApplyKind(LockedFollowUpPanel model)
    : ApplyKind<LockedFollowUpPanel, FollowUpOutcome, LockedFollowUpScores, LockedFollowUpPerformance>(model, FollowUpApplyReport.Build,
        (folder, overlap, names, panel, scores, performance) => new FollowUpApplied(folder, overlap, names, panel, scores, performance))
{
    public override OutcomeKind Kind => OutcomeKind.TimeToEvent;

    public override LockProvenance Provenance => Model.Provenance;

    // No EnsureScreenable: a validation cohort with few events can still be scored; the report says how few.
    public override FollowUpOutcome Known(Panel panel) => panel.FollowUp!;

    public override void CheckKnown(ApplyRequest request, FollowUpOutcome known)
    {
        if (request.Horizon is { } horizon && TimeDependentAuc.HorizonProblem(known.Times, known.Events, horizon) is { } problem)
            throw new RunRefusedException(FormattableString.Invariant(
                $"{Path.GetFileName(request.SampleSheetPath ?? request.MatrixPath)}: --horizon {horizon:G6}: {problem}. Choose a horizon after the first event and before the last follow-up time."),
                RunRefusal.Input);
    }

    public override LockedFollowUpScores Score(FeatureMatrix matrix) => LockedPanelScorer.ScoreFollowUp(Model, matrix);

    public override LockedFollowUpPerformance Evaluate(ApplyRequest request, LockedFollowUpScores scores, FollowUpOutcome known) =>
        LockedPanelEvaluation.EvaluateFollowUp(scores, known.Times, known.Events, request.Horizon);

    public override void WriteTables(ResultsFolder folder, LockedFollowUpScores scores, FollowUpOutcome? known, LockedFollowUpPerformance? performance,
        IReadOnlyList<string> discoveryOverlap)
    {
        double[]? times = known?.Times.ToArray();
        bool[]? events = known?.Events.ToArray();
        folder.WriteText(ApplyResultFiles.Scores, w => ApplyTables.WriteFollowUpScores(w, scores, times, events));
        if (performance is null) return;
        folder.WriteText(ApplyResultFiles.Evaluation, w => ManifestJson.Write(w, ApplyFollowUpEvaluation.Of(Model, scores, performance, discoveryOverlap)));
        folder.WriteText(ApplyResultFiles.RiskGroups, w => ApplyTables.WriteRiskGroupCurves(w, performance));
    }
}
