using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>`apply` with a panel locked on classes: class probabilities and calls, and with the classes known the AUC, error, calibration and confusion.</summary>
internal sealed class ClassesApplyKind(LockedPanel model)
    : ApplyKind<LockedPanel, ClassOutcome, LockedPanelScores, LockedPanelPerformance>(model, ApplyReport.Build,
        (folder, overlap, names, panel, scores, performance) => new ClassesApplied(folder, overlap, names, panel, scores, performance))
{
    public override OutcomeKind Kind => OutcomeKind.Classes;

    public override LockProvenance Provenance => Model.Provenance;

    // No EnsureScreenable: a cohort of one class can still be scored and its error measured.
    public override ClassOutcome Known(Panel panel) => panel.Outcome;

    public override LockedPanelScores Score(FeatureMatrix matrix) => LockedPanelScorer.Score(Model, matrix);

    public override LockedPanelPerformance Evaluate(ApplyRequest request, LockedPanelScores scores, ClassOutcome known)
    {
        try
        {
            return LockedPanelEvaluation.Evaluate(scores, known);
        }
        catch (ArgumentException e)
        {
            throw new RunRefusedException($"{Path.GetFileName(request.MatrixPath)}: {e.Message}", RunRefusal.Input);
        }
    }

    public override void WriteTables(ResultsFolder folder, LockedPanelScores scores, ClassOutcome? known, LockedPanelPerformance? performance,
        IReadOnlyList<string> discoveryOverlap)
    {
        var knownClasses = known is null ? null : KnownClassNames(known);
        folder.WriteText(ApplyResultFiles.Scores, w => ApplyTables.WriteScores(w, scores, knownClasses));
        if (performance is null) return;
        folder.WriteText(ApplyResultFiles.Evaluation, w => ManifestJson.Write(w, ApplyEvaluation.Of(Model, scores, performance, discoveryOverlap)));
        folder.WriteText(ApplyResultFiles.Calibration, w => ApplyTables.WriteCalibration(w, performance));
        folder.WriteText(ApplyResultFiles.Confusion, w => ApplyTables.WriteConfusion(w, performance));
    }

    private static string[] KnownClassNames(ClassOutcome outcome)
    {
        var names = new string[outcome.SampleCount];
        var classes = outcome.SampleClasses;
        for (int s = 0; s < names.Length; s++) names[s] = outcome.ClassNames[classes[s]];
        return names;
    }
}
