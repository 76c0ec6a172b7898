namespace OmicsScreen.Engine.Metrics;

/// <summary>
/// Area under the ROC curve in its Mann-Whitney form: the probability that a random positive
/// scores above a random negative, ties counting one half (Hanley &amp; McNeil 1982, Radiology
/// 143:29-36). Computed from mid-ranks: AUC = (R_pos - n_pos(n_pos+1)/2) / (n_pos·n_neg).
/// </summary>
public static class MannWhitneyAuc
{
    /// <summary>NaN when either group is empty; samples with a NaN score are skipped.</summary>
    public static double Compute(ReadOnlySpan<double> scores, ReadOnlySpan<bool> isPositive)
    {
        if (scores.Length != isPositive.Length) throw new ArgumentException("One label per score is needed.");
        var order = new List<int>(scores.Length);
        for (int i = 0; i < scores.Length; i++) if (!double.IsNaN(scores[i])) order.Add(i);
        var sortedScores = new double[order.Count];
        var sortedIndex = order.ToArray();
        for (int i = 0; i < sortedIndex.Length; i++) sortedScores[i] = scores[sortedIndex[i]];
        Array.Sort(sortedScores, sortedIndex);

        double positiveRankSum = 0;
        long positives = 0;
        int start = 0;
        // Invariant: ranks 1..start are assigned; a tie block [start, end) shares the mid-rank.
        while (start < sortedScores.Length)
        {
            int end = start + 1;
            while (end < sortedScores.Length && sortedScores[end] == sortedScores[start]) end++;
            double midRank = (start + 1 + end) * 0.5;
            for (int k = start; k < end; k++)
                if (isPositive[sortedIndex[k]]) { positiveRankSum += midRank; positives++; }
            start = end;
        }
        long negatives = sortedScores.Length - positives;
        if (positives == 0 || negatives == 0) return double.NaN;
        return (positiveRankSum - positives * (positives + 1) * 0.5) / ((double)positives * negatives);
    }
}
