namespace OmicsScreen.Engine.Forests;

/// <summary>Votes of every tree for every sample, with the majority class and vote fractions.</summary>
public sealed class ForestPrediction
{
    private readonly int[] _votes;
    private readonly int[] _predictedClasses;

    internal ForestPrediction(int[] votes, int[] predictedClasses, int classCount, int treeCount)
    {
        _votes = votes;
        _predictedClasses = predictedClasses;
        ClassCount = classCount;
        TreeCount = treeCount;
    }

    public int ClassCount { get; }
    public int TreeCount { get; }
    public int SampleCount => _predictedClasses.Length;

    /// <summary>Votes, sample-major: ClassCount entries per sample.</summary>
    public ReadOnlySpan<int> Votes => _votes;

    /// <summary>Majority vote per sample; ties broken by <see cref="VoteTieBreaker"/>.</summary>
    public ReadOnlySpan<int> PredictedClasses => _predictedClasses;

    /// <summary>The fraction of trees voting for the class.</summary>
    public double Probability(int sample, int classCode) => (double)_votes[sample * ClassCount + classCode] / TreeCount;
}
