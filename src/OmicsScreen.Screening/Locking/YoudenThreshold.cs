namespace OmicsScreen.Screening.Locking;

/// <summary>
/// The probability threshold that maximises Youden's J = sensitivity + specificity - 1
/// (Youden 1950, Cancer 3:32-35), for the rule "positive when the score is at least the threshold".
/// </summary>
/// <remarks>
/// Only thresholds equal to an observed score change the calls, so those are the candidates.
/// Among thresholds with the same J the one nearest 0.5 wins (then the lower), so an
/// uninformative score leaves the ordinary majority-vote threshold. Samples with a NaN score
/// (never out of bag) take no part.
/// </remarks>
public static class YoudenThreshold
{
    public const double Neutral = 0.5;

    public static double Choose(ReadOnlySpan<double> scores, ReadOnlySpan<bool> positive)
    {
        if (scores.Length != positive.Length) throw new ArgumentException("One truth value is needed per score.");
        int count = 0, positives = 0;
        for (int i = 0; i < scores.Length; i++)
        {
            if (double.IsNaN(scores[i])) continue;
            count++;
            if (positive[i]) positives++;
        }
        int negatives = count - positives;
        if (positives == 0 || negatives == 0) return Neutral;

        var order = new int[count];
        var values = new double[count];
        int k = 0;
        for (int i = 0; i < scores.Length; i++)
        {
            if (double.IsNaN(scores[i])) continue;
            order[k] = i;
            values[k++] = scores[i];
        }
        Array.Sort(values, order);

        // Walking the scores downwards: before a block of equal scores, truePositives and
        // falsePositives count the samples strictly above it; after it, those at or above it,
        // which is what the threshold equal to that score calls positive.
        // J = TP/P - FP/N, compared exactly as the integer TP·N - FP·P so equal J are seen as equal.
        long bestScaledJ = long.MinValue;
        double bestThreshold = Neutral;
        int truePositives = 0, falsePositives = 0;
        int at = count - 1;
        while (at >= 0)
        {
            double threshold = values[at];
            while (at >= 0 && values[at] == threshold)
            {
                if (positive[order[at]]) truePositives++;
                else falsePositives++;
                at--;
            }
            long scaledJ = (long)truePositives * negatives - (long)falsePositives * positives;
            if (scaledJ > bestScaledJ || (scaledJ == bestScaledJ && Closer(threshold, bestThreshold)))
            {
                bestScaledJ = scaledJ;
                bestThreshold = threshold;
            }
        }
        return bestThreshold;
    }

    private static bool Closer(double candidate, double incumbent)
    {
        double a = Math.Abs(candidate - Neutral), b = Math.Abs(incumbent - Neutral);
        return a < b || (a == b && candidate < incumbent);
    }
}
