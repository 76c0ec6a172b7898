using OmicsScreen.Engine.Binning;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The plain, obviously correct split search the fast one is tested against: every feature,
/// every bin threshold, every side for missing and below-detection cells, each partition
/// counted afresh from the rows. Quadratic and slow; for tests only.
/// </summary>
internal static class ReferenceSplitFinder
{
    /// <summary>The highest Gini proxy score of any split with at least minLeafSize rows per side.</summary>
    public static double BestScore(BinnedMatrix matrix, ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses,
        ReadOnlySpan<double> rowWeights, int classCount, int minLeafSize)
    {
        double best = double.NegativeInfinity;
        for (int feature = 0; feature < matrix.FeatureCount; feature++)
        {
            var bins = matrix.Bins(feature);
            for (int threshold = 0; threshold < bins.ValueBinCount; threshold++)
                for (int routing = 0; routing < 4; routing++)
                {
                    double score = Score(matrix.Codes(feature), bins, (byte)threshold, (UnmeasuredRouting)routing,
                        rows, rowClasses, rowWeights, classCount, minLeafSize);
                    if (score > best) best = score;
                }
        }
        return best;
    }

    /// <summary>The proxy score of one split, or -infinity when a side is too small or weightless.</summary>
    public static double Score(ReadOnlySpan<byte> codes, FeatureBins bins, byte threshold, UnmeasuredRouting routing,
        ReadOnlySpan<int> rows, ReadOnlySpan<int> rowClasses, ReadOnlySpan<double> rowWeights, int classCount, int minLeafSize)
    {
        var left = new double[classCount];
        var right = new double[classCount];
        int leftRows = 0, rightRows = 0;
        for (int i = 0; i < rows.Length; i++)
        {
            if (BranchRule.GoesLeft(codes[rows[i]], threshold, bins.MissingCode, routing)) { left[rowClasses[i]] += rowWeights[i]; leftRows++; }
            else { right[rowClasses[i]] += rowWeights[i]; rightRows++; }
        }
        if (leftRows < minLeafSize || rightRows < minLeafSize) return double.NegativeInfinity;
        double leftWeight = left.Sum(), rightWeight = right.Sum();
        if (leftWeight <= 0 || rightWeight <= 0) return double.NegativeInfinity;
        var total = new double[classCount];
        for (int c = 0; c < classCount; c++) total[c] = left[c] + right[c];
        return GiniImpurity.SplitScore(left, total, leftWeight, rightWeight);
    }
}
