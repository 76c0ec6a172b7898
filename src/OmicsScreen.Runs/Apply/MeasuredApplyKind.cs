using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>`apply` with a panel locked on a measured outcome: predictions, and with the outcome known R², RMSE and the calibration line.</summary>
internal sealed class MeasuredApplyKind(LockedMeasuredPanel model)
    : ApplyKind<LockedMeasuredPanel, double[], LockedMeasuredScores, LockedMeasuredPerformance>(model, MeasuredApplyReport.Build,
        (folder, overlap, names, panel, scores, performance) => new MeasuredApplied(folder, overlap, names, panel, scores, performance))
{
    public override OutcomeKind Kind => OutcomeKind.Measured;

    public override LockProvenance Provenance => Model.Provenance;

    // The panel predicts a quantity, so the column is read as one (a number in every cell),
    // whatever its number of distinct values.
    public override PanelLoadOptions LoadOptions(ApplyRequest request) => request.ToLoadOptions() with { OutcomeKind = OutcomeKindChoice.Measured };

    public override double[] Known(Panel panel) => panel.Measured!.Values.ToArray();

    public override LockedMeasuredScores Score(FeatureMatrix matrix) => LockedPanelScorer.ScoreMeasured(Model, matrix);

    public override LockedMeasuredPerformance Evaluate(ApplyRequest request, LockedMeasuredScores scores, double[] known) =>
        LockedPanelEvaluation.EvaluateMeasured(scores, known);

    public override void WriteTables(ResultsFolder folder, LockedMeasuredScores scores, double[]? known, LockedMeasuredPerformance? performance,
        IReadOnlyList<string> discoveryOverlap)
    {
        folder.WriteText(ApplyResultFiles.Scores, w => ApplyTables.WriteMeasuredScores(w, scores, known));
        if (performance is null) return;
        folder.WriteText(ApplyResultFiles.Evaluation, w => ManifestJson.Write(w, ApplyMeasuredEvaluation.Of(Model, scores, performance, discoveryOverlap)));
        folder.WriteText(ApplyResultFiles.Calibration, w => ApplyTables.WriteMeasuredCalibration(w, performance));
    }
}
