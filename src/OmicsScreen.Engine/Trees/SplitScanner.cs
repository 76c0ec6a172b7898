namespace OmicsScreen.Engine.Trees;

/// <summary>
/// Finds the best split of one feature from a filled <see cref="NodeHistogram"/>: every cut
/// between adjacent non-empty value bins, crossed with every side for the missing and
/// below-detection groups that the node holds.
/// </summary>
internal sealed class SplitScanner
{
    private readonly double[] _left;

    public SplitScanner(int classCount) => _left = new double[classCount + 1];

    /// <summary>
    /// Replaces best when this feature has a split of strictly higher score (so ties keep the
    /// earlier candidate). nodeTotals holds the node's class weights then its row count.
    /// </summary>
    public void Scan(NodeHistogram histogram, int feature, int valueBinCount, ReadOnlySpan<double> nodeTotals,
        int minLeafSize, ref SplitCandidate best)
    {
        int classCount = histogram.ClassCount;
        var totalWeights = nodeTotals[..classCount];
        double totalRows = nodeTotals[classCount];
        double totalWeight = GiniImpurity.Total(totalWeights);
        bool hasMissing = histogram.MissingRows > 0;
        bool hasBelow = histogram.BelowDetectionRows > 0;
        int valueEntries = histogram.ValueEntryCount;
        var left = _left.AsSpan();

        // Combination bit 0: missing goes left; bit 1: below detection goes left. Only groups the
        // node holds are placed; an absent group follows the larger child (set when recorded).
        for (int combination = 0; combination < 4; combination++)
        {
            bool missingLeft = (combination & 1) != 0;
            bool belowLeft = (combination & 2) != 0;
            if ((missingLeft && !hasMissing) || (belowLeft && !hasBelow)) continue;
            left.Clear();
            if (missingLeft) Add(left, histogram.Missing);
            if (belowLeft) Add(left, histogram.BelowDetection);

            if (valueEntries == 0)
            {
                // Only unmeasured cells here: the one split is missing versus below detection.
                if (combination == 1 && hasBelow)
                    Consider(left, totalWeights, totalRows, totalWeight, minLeafSize, feature,
                        (byte)(valueBinCount - 1), hasMissing, hasBelow, missingLeft, belowLeft, ref best);
                continue;
            }
            // Invariant: after step j, left holds the placed groups plus value bins 0..j.
            for (int j = 0; j < valueEntries; j++)
            {
                Add(left, histogram.ValueEntry(j));
                Consider(left, totalWeights, totalRows, totalWeight, minLeafSize, feature,
                    histogram.ValueCode(j), hasMissing, hasBelow, missingLeft, belowLeft, ref best);
            }
        }
    }

    private static void Consider(ReadOnlySpan<double> left, ReadOnlySpan<double> totalWeights, double totalRows,
        double totalWeight, int minLeafSize, int feature, byte binThreshold, bool hasMissing, bool hasBelow,
        bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        int classCount = totalWeights.Length;
        double leftRows = left[classCount];
        double rightRows = totalRows - leftRows;
        if (leftRows < minLeafSize || rightRows < minLeafSize) return;
        double leftWeight = GiniImpurity.Total(left[..classCount]);
        double rightWeight = totalWeight - leftWeight;
        if (leftWeight <= 0 || rightWeight <= 0) return;
        double score = GiniImpurity.SplitScore(left[..classCount], totalWeights, leftWeight, rightWeight);
        if (!(score > best.Score)) return;
        bool largerLeft = leftRows >= rightRows;
        var routing = UnmeasuredRouting.BothRight;
        if (hasMissing ? missingLeft : largerLeft) routing |= UnmeasuredRouting.MissingLeft;
        if (hasBelow ? belowLeft : largerLeft) routing |= UnmeasuredRouting.BelowDetectionLeft;
        best = new SplitCandidate
        {
            Feature = feature,
            BinThreshold = binThreshold,
            Routing = routing,
            Score = score,
            LeftRowCount = (int)leftRows,
            RightRowCount = (int)rightRows,
        };
    }

    private static void Add(Span<double> target, ReadOnlySpan<double> source)
    {
        for (int i = 0; i < target.Length; i++) target[i] += source[i];
    }
}
