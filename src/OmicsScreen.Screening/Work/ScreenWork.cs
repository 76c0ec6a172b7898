using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
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
    private readonly ScreenContext _context;
    private readonly Panel _panel;
    private readonly BinnedMatrix _matrix;
    private readonly ScreenSettings _settings;
    private readonly IWorkUnitStore? _store;
    private readonly bool _computeMissing;
    private int[][]? _halves;
    private IReadOnlyList<OuterFold>? _folds;

    /// <param name="computeMissing">False when every unit must come from the store (merging parts); a missing one is then an error.</param>
    public ScreenWork(ScreenContext context, IWorkUnitStore? store, bool computeMissing = true)
    {
        _context = context;
        (_panel, _matrix, _settings) = (context.Panel, context.Matrix, context.Settings);
        _store = store;
        _computeMissing = computeMissing;
    }

    /// <summary>Units taken from the store so far.</summary>
    public int ReusedCount { get; private set; }

    /// <summary>Units computed so far.</summary>
    public int ComputedCount { get; private set; }

    /// <summary>The half-samples of the main screen's repeats, drawn once from the run seed.</summary>
    private int[][] Halves => _halves ??= HalfSamplePairs.Draw(_context.ScreenOutcome.Strata, _panel.Subject,
        Enumerable.Range(0, _panel.SampleCount).ToArray(), _settings.Options.HalfSamplePairs, _settings.Options.Seed);

    /// <summary>The outer folds of the panel-size curve.</summary>
    public IReadOnlyList<OuterFold> CurveFolds => _folds ??= StratifiedFolds.Draw(_context.ScreenOutcome.Strata, _panel.Subject,
        Enumerable.Range(0, _panel.SampleCount).ToArray(), _settings.Options.CurveFolds, _settings.Options.CurveFoldRepeats,
        _settings.Options.Seed);

    /// <summary>All repeats of the main screen, assembled in repeat order; progress reported per repeat.</summary>
    public RepeatImportances MainRepeats()
    {
        int repeatCount = _settings.RepeatCount;
        var all = new RepeatImportances(repeatCount, _matrix.FeatureCount, _settings.DecoyCount);
        for (int r = 0; r < repeatCount; r++)
        {
            var one = (RepeatUnitResult)Obtain(new WorkUnit(WorkUnitKind.Repeat, r));
            all.CopyRepeatFrom(one.Row, 0, r);
            _context.Report(ScreenStage.Repeats, r + 1, repeatCount);
        }
        return all;
    }

    public InnerScreenResult CurveFoldScreen(int fold) => (InnerScreenResult)Obtain(new WorkUnit(WorkUnitKind.CurveFold, fold));

    public InnerScreenResult CohortScreen(int cohort) => (InnerScreenResult)Obtain(new WorkUnit(WorkUnitKind.CohortScreen, cohort));

    public InnerScreenResult HeldOutScreen(int cohort) => (InnerScreenResult)Obtain(new WorkUnit(WorkUnitKind.HeldOutScreen, cohort));

    /// <summary>
    /// The unit's result from the store, or computed (and then saved). Every unit, inner screens
    /// included, stops between repeats when the context's cancellation is requested.
    /// </summary>
    public WorkUnitResult Obtain(WorkUnit unit)
    {
        var cancellation = _context.Cancellation;
        cancellation.ThrowIfCancellationRequested();
        if (_store is not null && _store.TryLoad(unit, out var stored))
        {
            ReusedCount++;
            return stored;
        }
        if (!_computeMissing)
            throw new InvalidOperationException($"Work unit {unit.Name} is in none of the stored parts.");
        var result = Compute(unit);
        ComputedCount++;
        _store?.Save(unit, result);
        return result;
    }

    private WorkUnitResult Compute(WorkUnit unit)
    {
        var options = _settings.Options;
        switch (unit.Kind)
        {
            case WorkUnitKind.Repeat:
                {
                    var row = new RepeatImportances(1, _matrix.FeatureCount, _settings.DecoyCount);
                    RepeatScreen.RunOne(_context, Halves[unit.Index], RandomStreams.ScreenRepeat(options.Seed, unit.Index), row, 0);
                    return new RepeatUnitResult(row);
                }
            case WorkUnitKind.CurveFold:
                {
                    var fold = CurveFolds[unit.Index];
                    return InnerScreen(fold.TrainingRows, PanelSizeEstimator.InnerSeed(options, fold));
                }
            case WorkUnitKind.CohortScreen:
                return InnerScreen(CohortMembership.RowsOf(_panel)[unit.Index], RandomStreams.CohortScreenSeed(options.Seed, unit.Index));
            case WorkUnitKind.HeldOutScreen:
                return InnerScreen(CohortMembership.TrainingRowsWithout(_panel, unit.Index), RandomStreams.HeldOutScreenSeed(options.Seed, unit.Index));
            default:
                throw new ArgumentOutOfRangeException(nameof(unit));
        }
    }

    /// <summary>
    /// A smaller screen on some of the samples, with the same decoys and shortlist rule as the main
    /// screen (fewer repeats): the building block of the curve and the cohort checks, so what they
    /// measure is the procedure whose panel is locked.
    /// </summary>
    private InnerScreenResult InnerScreen(int[] rows, ulong seed)
    {
        var repeats = RepeatScreen.Run(_context, rows, seed, _settings.Options.CurveInnerPairs);
        var plan = DecoyPlan.For(_matrix.FeatureCount, _settings.DecoyCount, seed);
        var direct = DirectTestEvidence.Compute(_context, rows, plan);
        var decoys = DecoyEvidence.From(repeats, direct);
        var features = ScreenAggregation.Summarise(repeats, _matrix.FeatureNames, decoys, [], direct);
        var order = ScreenAggregation.OrderOf(features);
        var (shortlist, _) = ShortlistSelection.Apply(features, order, decoys, _settings.Options);
        return new InnerScreenResult(order, MeanCorrected(repeats), shortlist);
    }

    /// <summary>Each feature's corrected importance averaged over the repeats.</summary>
    private static double[] MeanCorrected(RepeatImportances repeats)
    {
        var mean = new double[repeats.FeatureCount];
        for (int r = 0; r < repeats.RepeatCount; r++)
            for (int f = 0; f < repeats.FeatureCount; f++) mean[f] += repeats.Corrected[r * repeats.FeatureCount + f] / repeats.RepeatCount;
        return mean;
    }
}
