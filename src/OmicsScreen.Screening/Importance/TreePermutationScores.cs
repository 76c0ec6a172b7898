namespace OmicsScreen.Screening.Importance;

/// <summary>
/// One tree's permutation scores for the features it was scored on; every other feature scores
/// exactly 0 for that tree. Kept per tree so that trees scored on any thread are summed in tree order.
/// </summary>
internal sealed class TreePermutationScores(int[] features, double[] accuracyDrops, double[] brierIncreases)
{
    public static TreePermutationScores Empty { get; } = new([], [], []);

    public int[] Features { get; } = features;
    public double[] AccuracyDrops { get; } = accuracyDrops;
    public double[] BrierIncreases { get; } = brierIncreases;
}
