using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// What `apply` does differently for one outcome kind of locked panel: how the known outcome is
/// read, how the panel scores and is evaluated, and which tables and page it writes.
/// <see cref="ApplyJob"/> runs the steps every kind shares, in one order.
/// </summary>
/// <typeparam name="TKnown">The cohort's known outcome as the evaluation reads it.</typeparam>
internal abstract class ApplyKind<TModel, TKnown, TScores, TPerformance>
    where TKnown : class
    where TPerformance : class
{
    private readonly Func<TModel, TScores, TPerformance?, string, bool, IReadOnlyList<string>, IReadOnlyDictionary<string, string>, string> _page;
    private readonly Func<string, IReadOnlyList<string>, IReadOnlyDictionary<string, string>, TModel, TScores, TPerformance?, AppliedPanel> _result;

    /// <param name="page">The kind's page: (panel, scores, performance, matrix path, show sample ids, discovery overlap, display names) to HTML.</param>
    /// <param name="result">The kind's record of what was applied: (folder, discovery overlap, display names, panel, scores, performance).</param>
    protected ApplyKind(TModel model,
        Func<TModel, TScores, TPerformance?, string, bool, IReadOnlyList<string>, IReadOnlyDictionary<string, string>, string> page,
        Func<string, IReadOnlyList<string>, IReadOnlyDictionary<string, string>, TModel, TScores, TPerformance?, AppliedPanel> result)
    {
        Model = model;
        _page = page;
        _result = result;
    }

    public TModel Model { get; }

    public abstract OutcomeKind Kind { get; }

    /// <summary>The discovery inputs' SHA-256, for the overlap warnings.</summary>
    public abstract LockProvenance Provenance { get; }

    /// <summary>How the cohort is read when its outcome is known.</summary>
    public virtual PanelLoadOptions LoadOptions(ApplyRequest request) => request.ToLoadOptions();

    /// <summary>The known outcome of a cohort already checked to be of <see cref="Kind"/>.</summary>
    public abstract TKnown Known(Panel panel);

    /// <summary>Refuses a known outcome the evaluation cannot use as asked; nothing is written yet.</summary>
    public virtual void CheckKnown(ApplyRequest request, TKnown known)
    {
    }

    /// <exception cref="MissingMarkersException">A marker of the panel is not in the cohort's matrix.</exception>
    public abstract TScores Score(FeatureMatrix matrix);

    public abstract TPerformance Evaluate(ApplyRequest request, TScores scores, TKnown known);

    /// <summary>Writes the scores table, and with the outcome known the evaluation and the kind's other tables.</summary>
    public abstract void WriteTables(ResultsFolder folder, TScores scores, TKnown? known, TPerformance? performance, IReadOnlyList<string> discoveryOverlap);

    public string Report(ApplyRequest request, TScores scores, TPerformance? performance, IReadOnlyList<string> discoveryOverlap,
        IReadOnlyDictionary<string, string> displayNames) =>
        _page(Model, scores, performance, request.MatrixPath, request.ShowSampleIds, discoveryOverlap, displayNames);

    public AppliedPanel Result(string folder, IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string> displayNames,
        TScores scores, TPerformance? performance) =>
        _result(folder, discoveryOverlap, displayNames, Model, scores, performance);
}
