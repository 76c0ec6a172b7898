using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Work;

/// <summary>
/// Computes the work units of one screen, or takes them from a store: a unit found in the store
/// is used as it is, a computed one is saved at once. Because every unit draws its randomness
/// from (seed, kind, index) alone, a result assembled from stored and fresh units is the same,
/// bit for bit, as one computed in a single run.
/// </summary>
internal sealed class ScreenWork
{
    private readonly Panel _panel;
    private readonly BinnedMatrix _matrix;
    private readonly ScreenSettings _settings;
    private readonly IWorkUnitStore? _store;
    private readonly bool _computeMissing;
    private int[][]? _halves;
    private IReadOnlyList<OuterFold>? _folds;

    /// <param name="computeMissing">False when every unit must come from the store (merging parts); a missing one is then an error.</param>
    public ScreenWork(Panel panel, BinnedMatrix matrix, ScreenSettings settings, IWorkUnitStore? store, bool computeMissing = true)
    {
        _panel = panel;
        _matrix = matrix;
        _settings = settings;
        _store = store;
        _computeMissing = computeMissing;
    }

    /// <summary>Units taken from the store so far.</summary>
    public int ReusedCount { get; private set; }

    /// <summary>Units computed so far.</summary>
    public int ComputedCount { get; private set; }

    /// <summary>The half-samples of the main screen's repeats, drawn once from the run seed.</summary>
    private int[][] Halves => _halves ??= HalfSamplePairs.Draw(_panel.Outcome, _panel.Subject,
        Enumerable.Range(0, _panel.SampleCount).ToArray(), _settings.Options.HalfSamplePairs, _settings.Options.Seed);

    /// <summary>The outer folds of the panel-size curve.</summary>
    public IReadOnlyList<OuterFold> CurveFolds => _folds ??= StratifiedFolds.Draw(_panel.Outcome, _panel.Subject,
        Enumerable.Range(0, _panel.SampleCount).ToArray(), _settings.Options.CurveFolds, _settings.Options.CurveFoldRepeats,
        _settings.Options.Seed);

    /// <summary>All repeats of the main screen, assembled in repeat order.</summary>
    public RepeatImportances MainRepeats(Action<int>? repeatDone, CancellationToken cancellation)
    {
        int repeatCount = _settings.RepeatCount;
        var all = new RepeatImportances(repeatCount, _matrix.FeatureCount, _settings.DecoyCount);
        for (int r = 0; r < repeatCount; r++)
        {
            cancellation.ThrowIfCancellationRequested();
            var one = (RepeatUnitResult)Obtain(new WorkUnit(WorkUnitKind.Repeat, r), cancellation);
            all.CopyRepeatFrom(one.Row, 0, r);
            repeatDone?.Invoke(r + 1);
        }
        return all;
    }

    public InnerScreenResult CurveFoldScreen(int fold, CancellationToken cancellation = default) =>
        (InnerScreenResult)Obtain(new WorkUnit(WorkUnitKind.CurveFold, fold), cancellation);

    public InnerScreenResult CohortScreen(int cohort, CancellationToken cancellation = default) =>
        (InnerScreenResult)Obtain(new WorkUnit(WorkUnitKind.CohortScreen, cohort), cancellation);

    public InnerScreenResult HeldOutScreen(int cohort, CancellationToken cancellation = default) =>
        (InnerScreenResult)Obtain(new WorkUnit(WorkUnitKind.HeldOutScreen, cohort), cancellation);

    /// <summary>The unit's result from the store, or computed (and then saved).</summary>
    public WorkUnitResult Obtain(WorkUnit unit, CancellationToken cancellation)
    {
        if (_store is not null && _store.TryLoad(unit, out var stored))
        {
            ReusedCount++;
            return stored;
        }
        if (!_computeMissing)
            throw new InvalidOperationException($"Work unit {unit.Name} is in none of the stored parts.");
        var result = Compute(unit, cancellation);
        ComputedCount++;
        _store?.Save(unit, result);
        return result;
    }

    private WorkUnitResult Compute(WorkUnit unit, CancellationToken cancellation)
    {
        var options = _settings.Options;
        switch (unit.Kind)
        {
            case WorkUnitKind.Repeat:
                {
                    var row = new RepeatImportances(1, _matrix.FeatureCount, _settings.DecoyCount);
                    RepeatScreen.RunOne(_matrix, _panel.Outcome, _panel.Subject, Halves[unit.Index], _settings, options.Seed,
                        unit.Index, row, 0);
                    return new RepeatUnitResult(row);
                }
            case WorkUnitKind.CurveFold:
                {
                    var fold = CurveFolds[unit.Index];
                    return InnerScreen(fold.TrainingRows, PanelSizeEstimator.InnerSeed(options, fold), cancellation);
                }
            case WorkUnitKind.CohortScreen:
                return InnerScreen(CohortAnalysis.RowsOfCohorts(_panel)[unit.Index], CohortAnalysis.CohortScreenSeed(options, unit.Index), cancellation);
            case WorkUnitKind.HeldOutScreen:
                return InnerScreen(CohortAnalysis.TrainingRowsWithout(_panel, unit.Index), CohortAnalysis.HeldOutSeed(options, unit.Index), cancellation);
            default:
                throw new ArgumentOutOfRangeException(nameof(unit));
        }
    }

    /// <summary>
    /// A smaller screen on some of the samples, with the same decoys and shortlist rule as the main
    /// screen (fewer repeats): the building block of the curve and the cohort checks, so what they
    /// measure is the procedure whose panel is locked.
    /// </summary>
    private InnerScreenResult InnerScreen(int[] rows, ulong seed, CancellationToken cancellation)
    {
        var repeats = RepeatScreen.Run(_matrix, _panel.Outcome, _panel.Subject, rows, _settings, seed,
            _settings.Options.CurveInnerPairs, _settings.DecoyCount, repeatDone: null, cancellation);
        var plan = DecoyPlan.For(_matrix.FeatureCount, _settings.DecoyCount, seed);
        var direct = DirectTestEvidence.Compute(_panel, rows, plan, _settings.InteractionScan, _settings.Options.ThreadCount);
        var decoys = DecoyEvidence.From(repeats, direct);
        var features = ScreenAggregation.Summarise(repeats, _matrix.FeatureNames, decoys, [], direct);
        var order = ScreenAggregation.OrderOf(features);
        var (shortlist, _) = ShortlistSelection.Apply(features, order, decoys, _settings.Options);
        return new InnerScreenResult(order, CohortAnalysis.MeanCorrected(repeats), shortlist);
    }
}
