using OmicsScreen.Engine.Metrics;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// The outcome kind's score of one prediction per scored sample: AUC of the probability of the
/// positive class (two classes), accuracy of the hits averaged over fold repeats (more classes), R² = 1 - SSE/SST about the samples' own mean (as scikit-learn's r2_score), or
/// Harrell's C of a risk score; optionally over a resample of the samples (positions, repeats allowed).
/// </summary>
internal sealed class PooledScore
{
    private readonly OutcomeKind _kind;
    private readonly bool _severalClasses;
    private readonly bool[] _isPositive = [];
    private readonly double[] _values = [];
    private readonly double[] _times = [];
    private readonly bool[] _events = [];

    public PooledScore(Panel panel, int[] samples)
    {
        _kind = panel.Kind;
        _severalClasses = panel.Kind == OutcomeKind.Classes && panel.Outcome.ClassCount > 2;
        switch (_kind)
        {
            case OutcomeKind.Classes:
                var classes = panel.Outcome.SampleClasses;
                _isPositive = new bool[samples.Length];
                for (int k = 0; k < samples.Length; k++) _isPositive[k] = classes[samples[k]] == panel.Outcome.PositiveClass;
                break;
            case OutcomeKind.Measured:
                var values = panel.Measured!.Values;
                _values = new double[samples.Length];
                for (int k = 0; k < samples.Length; k++) _values[k] = values[samples[k]];
                break;
            default:
                var times = panel.FollowUp!.Times;
                var events = panel.FollowUp.Events;
                (_times, _events) = (new double[samples.Length], new bool[samples.Length]);
                for (int k = 0; k < samples.Length; k++) (_times[k], _events[k]) = (times[samples[k]], events[samples[k]]);
                break;
        }
    }

    /// <summary>Each scored sample's class against the positive one (classes only).</summary>
    public bool[] IsPositive => _isPositive;

    public double Of(double[] predictions) => Of(predictions, null);

    /// <summary>The score over the samples at <paramref name="picks"/> (all, in order, when null).</summary>
    public double Of(double[] predictions, int[]? picks)
    {
        int n = picks?.Length ?? predictions.Length;
        var p = new double[n];
        for (int k = 0; k < n; k++) p[k] = predictions[picks is null ? k : picks[k]];
        switch (_kind)
        {
            case OutcomeKind.Classes when _severalClasses:
            {
                // The predictions are each sample's hits averaged over the fold repeats: their mean is the accuracy.
                double hits = 0;
                for (int k = 0; k < n; k++) hits += p[k];
                return n > 0 ? hits / n : double.NaN;
            }
            case OutcomeKind.Classes:
            {
                var positive = new bool[n];
                for (int k = 0; k < n; k++) positive[k] = _isPositive[picks is null ? k : picks[k]];
                return MannWhitneyAuc.Compute(p, positive);
            }
            case OutcomeKind.Measured:
            {
                var y = new double[n];
                for (int k = 0; k < n; k++) y[k] = _values[picks is null ? k : picks[k]];
                return SquaredErrorFit.Of(y, p).RSquared;
            }
            default:
            {
                var (t, e) = (new double[n], new bool[n]);
                for (int k = 0; k < n; k++) (t[k], e[k]) = (_times[picks is null ? k : picks[k]], _events[picks is null ? k : picks[k]]);
                var estimate = HarrellConcordance.Estimate(t, e, p);
                return estimate.ComparablePairs == 0 ? double.NaN : estimate.Concordance;
            }
        }
    }
}
