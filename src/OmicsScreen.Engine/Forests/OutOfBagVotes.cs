using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Forests;

/// <summary>
/// Out-of-bag votes of a forest (Breiman 1996, "Out-of-bag estimation"): each sample is voted on
/// only by the trees not grown on it, which gives an out-of-sample error without a test set.
/// </summary>
/// <remarks>
/// Errors count only samples with at least one out-of-bag vote. The error curve is the error
/// after the first t trees, for every t, tracked incrementally: adding a vote for class c can
/// only move a sample's winner to c, so each vote costs O(1).
/// </remarks>
public sealed class OutOfBagVotes
{
    private readonly int[] _votes;
    private readonly int[] _predicted;
    private readonly double[] _errorCurve;
    private readonly double[] _perClassError;

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public OutOfBagVotes(Forest forest, ClassOutcome outcome)
    {
        ArgumentNullException.ThrowIfNull(forest);
        ArgumentNullException.ThrowIfNull(outcome);
        if (outcome.SampleCount != forest.SampleCount) throw new ArgumentException("The outcome must have one class per sample.");
        int classCount = forest.ClassCount;
        int sampleCount = forest.SampleCount;
        ClassCount = classCount;
        PositiveClass = outcome.PositiveClass;
        var truth = outcome.SampleClasses;
        var tieBreaker = new VoteTieBreaker(forest.Options.Seed, forest.Options.Repeat, sampleCount, classCount);
        _votes = new int[sampleCount * classCount];
        _predicted = new int[sampleCount];
        Array.Fill(_predicted, -1);
        _errorCurve = new double[forest.TreeCount];
        int voted = 0, wrong = 0;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var outOfBag = forest.OutOfBag(t);
            var rows = outOfBag.Rows;
            var classes = outOfBag.PredictedClasses;
            for (int k = 0; k < rows.Length; k++)
            {
                int sample = rows[k];
                int vote = classes[k];
                int at = sample * classCount;
                _votes[at + vote]++;
                int previous = _predicted[sample];
                int winner = previous < 0 || tieBreaker.Beats(sample, vote, _votes[at + vote], previous, _votes[at + previous])
                    ? vote : previous;
                if (previous < 0) voted++;
                else if (previous != truth[sample]) wrong--;
                if (winner != truth[sample]) wrong++;
                _predicted[sample] = winner;
            }
            _errorCurve[t] = voted > 0 ? (double)wrong / voted : double.NaN;
        }
        VotedSampleCount = voted;
        Error = voted > 0 ? (double)wrong / voted : double.NaN;

        var votedByClass = new int[classCount];
        var wrongByClass = new int[classCount];
        for (int s = 0; s < sampleCount; s++)
        {
            if (_predicted[s] < 0) continue;
            votedByClass[truth[s]]++;
            if (_predicted[s] != truth[s]) wrongByClass[truth[s]]++;
        }
        _perClassError = new double[classCount];
        for (int c = 0; c < classCount; c++)
            _perClassError[c] = votedByClass[c] > 0 ? (double)wrongByClass[c] / votedByClass[c] : double.NaN;

        if (classCount == 2)
        {
            var scores = new double[sampleCount];
            var positive = new bool[sampleCount];
            for (int s = 0; s < sampleCount; s++)
            {
                scores[s] = Probability(s, PositiveClass);
                positive[s] = truth[s] == PositiveClass;
            }
            Auc = MannWhitneyAuc.Compute(scores, positive);
        }
    }

    public int ClassCount { get; }
    public int PositiveClass { get; }
    /// <summary>Samples with at least one out-of-bag vote.</summary>
    public int VotedSampleCount { get; }
    /// <summary>Fraction of voted samples whose majority out-of-bag vote is wrong.</summary>
    public double Error { get; }
    /// <summary>Per true class, the fraction of its voted samples misclassified.</summary>
    public ReadOnlySpan<double> PerClassError => _perClassError;
    /// <summary>Out-of-bag AUC of the positive class's vote fraction; null unless the outcome is binary.</summary>
    public double? Auc { get; }
    /// <summary>Out-of-bag error after the first t+1 trees, for every t.</summary>
    public ReadOnlySpan<double> ErrorCurve => _errorCurve;
    /// <summary>Votes, sample-major: ClassCount entries per sample.</summary>
    public ReadOnlySpan<int> Votes => _votes;
    /// <summary>Majority out-of-bag class per sample, -1 for samples never out of bag.</summary>
    public ReadOnlySpan<int> PredictedClasses => _predicted;

    public int VoteCount(int sample)
    {
        int total = 0;
        for (int c = 0; c < ClassCount; c++) total += _votes[sample * ClassCount + c];
        return total;
    }

    /// <summary>The fraction of a sample's out-of-bag votes for a class; NaN without votes.</summary>
    public double Probability(int sample, int classCode)
    {
        int total = VoteCount(sample);
        return total > 0 ? (double)_votes[sample * ClassCount + classCode] / total : double.NaN;
    }
}
