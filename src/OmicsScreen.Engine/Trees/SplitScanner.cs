using System.Runtime.Intrinsics;
using System.Runtime.CompilerServices;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// Finds the best split of one feature from a filled <see cref="NodeHistogram"/>: every cut
/// between adjacent non-empty value bins, crossed with every side for the missing and
/// below-detection groups that the node holds.
/// </summary>
/// <remarks>
/// Binary outcomes, the common case, take a path with the two class weights in locals; any
/// class count takes the general path. Both visit candidates in the same order and compute the
/// same score, so they choose the same split.
/// </remarks>
internal sealed class SplitScanner
{
    private readonly double[] _left;

    /// <summary>One block's four scores.</summary>
    private readonly double[] _cutScores = new double[4];

    public SplitScanner(int classCount) => _left = new double[classCount + 1];

    /// <summary>
    /// Replaces best when this feature has a split of strictly higher score (so ties keep the
    /// earlier candidate). nodeTotals holds the node's class weights then its row count.
    /// </summary>
    public void Scan(NodeHistogram histogram, int feature, int valueBinCount, ReadOnlySpan<double> nodeTotals,
        int minLeafSize, ref SplitCandidate best)
    {
        bool hasMissing = histogram.MissingRows > 0;
        bool hasBelow = histogram.BelowDetectionRows > 0;
        // Combination bit 0: missing goes left; bit 1: below detection goes left. Only groups the
        // node holds are placed; an absent group follows the larger child (set when recorded).
        for (int combination = 0; combination < 4; combination++)
        {
            bool missingLeft = (combination & 1) != 0;
            bool belowLeft = (combination & 2) != 0;
            if ((missingLeft && !hasMissing) || (belowLeft && !hasBelow)) continue;
            if (histogram.ValueEntryCount == 0)
            {
                // Only unmeasured cells here: the one split is missing versus below detection.
                if (combination == 1 && hasBelow)
                {
                    var left = _left.AsSpan();
                    histogram.Missing.CopyTo(left);
                    ConsiderGeneral(left, nodeTotals, minLeafSize, feature, (byte)(valueBinCount - 1),
                        hasMissing, hasBelow, missingLeft, belowLeft, ref best);
                }
                continue;
            }
            if (histogram.ClassCount == 2) ScanBinary(histogram, feature, nodeTotals, minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
            else ScanGeneral(histogram, feature, nodeTotals, minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
        }
    }

    /// <summary>
    /// <see cref="Scan"/> for a packed two-class histogram: the same candidates in the same order
    /// with the same scores (the packed sums are the double sums exactly), so the same split.
    /// </summary>
    public void ScanPacked(PackedBinaryHistogram histogram, int feature, int valueBinCount, ReadOnlySpan<double> nodeTotals,
        int minLeafSize, ref SplitCandidate best)
    {
        bool hasMissing = histogram.Missing != 0;
        bool hasBelow = histogram.BelowDetection != 0;
        for (int combination = 0; combination < 4; combination++)
        {
            bool missingLeft = (combination & 1) != 0;
            bool belowLeft = (combination & 2) != 0;
            if ((missingLeft && !hasMissing) || (belowLeft && !hasBelow)) continue;
            if (histogram.ValueEntryCount == 0)
            {
                if (combination == 1 && hasBelow)
                {
                    var left = _left.AsSpan();
                    ulong missing = histogram.Missing;
                    left[0] = PackedBinaryHistogram.Class0(missing);
                    left[1] = PackedBinaryHistogram.Class1(missing);
                    left[2] = PackedBinaryHistogram.Rows(missing);
                    ConsiderGeneral(left, nodeTotals, minLeafSize, feature, (byte)(valueBinCount - 1),
                        hasMissing, hasBelow, missingLeft, belowLeft, ref best);
                }
                continue;
            }
            ulong placed = (missingLeft ? histogram.Missing : 0) + (belowLeft ? histogram.BelowDetection : 0);
            ScanPackedCuts(histogram, placed, feature, nodeTotals, minLeafSize, hasMissing, hasBelow, missingLeft, belowLeft, ref best);
        }
    }

    /// <remarks>
    /// Same candidates and score as <see cref="ScanBinary"/>; the left sums at each cut are one
    /// packed word, the histogram's running sum plus the placed groups. Cuts are scored four at a time: the words are read out as exact
    /// doubles (a 21-bit integer or'ed into the mantissa of 2^52, minus 2^52) and scored with
    /// the scalar formula's operations in the same order (no fused multiply-add), so every lane
    /// equals the scalar score bit for bit. Only a block holding a score above the best so far
    /// is then walked in order, keeping the first of tied candidates as the scalar scan does.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ScanPackedCuts(PackedBinaryHistogram histogram, ulong placed, int feature, ReadOnlySpan<double> nodeTotals,
        int minLeafSize, bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        var cumulative = histogram.CumulativeEntries;
        var codes = histogram.ValueCodes;
        double total0 = nodeTotals[0], total1 = nodeTotals[1], totalRows = nodeTotals[2];
        double bestScore = best.Score;
        int j = 0;
        if (Vector256.IsHardwareAccelerated && codes.Length >= 8)
        {
            var scores = _cutScores.AsSpan();
            var mask = Vector256.Create(PackedBinaryHistogram.FieldMask);
            var magicBits = Vector256.Create(0x4330000000000000UL);
            var magic = Vector256.Create(4503599627370496.0); // 2^52
            var minLeaf = Vector256.Create((double)minLeafSize);
            var vTotal0 = Vector256.Create(total0);
            var vTotal1 = Vector256.Create(total1);
            var vTotalRows = Vector256.Create(totalRows);
            var minusInfinity = Vector256.Create(double.NegativeInfinity);
            var placedGroups = Vector256.Create(placed);
            for (; j + 4 <= codes.Length; j += 4)
            {
                var words = Vector256.Create<ulong>(cumulative.Slice(j, 4)) + placedGroups;
                var left0 = Vector256.AsDouble((words & mask) | magicBits) - magic;
                var left1 = Vector256.AsDouble(((words >>> PackedBinaryHistogram.FieldBits) & mask) | magicBits) - magic;
                var leftRows = Vector256.AsDouble((words >>> PackedBinaryHistogram.RowShift) | magicBits) - magic;
                var rightRows = vTotalRows - leftRows;
                var right0 = vTotal0 - left0;
                var right1 = vTotal1 - left1;
                var leftWeight = left0 + left1;
                var rightWeight = right0 + right1;
                var valid = Vector256.GreaterThanOrEqual(leftRows, minLeaf) & Vector256.GreaterThanOrEqual(rightRows, minLeaf)
                    & Vector256.GreaterThan(leftWeight, Vector256<double>.Zero) & Vector256.GreaterThan(rightWeight, Vector256<double>.Zero);
                var score = (left0 * left0 + left1 * left1) / leftWeight + (right0 * right0 + right1 * right1) / rightWeight;
                score = Vector256.ConditionalSelect(valid, score, minusInfinity);
                if (!Vector256.GreaterThanAny(score, Vector256.Create(bestScore))) continue;
                score.CopyTo(scores);
                for (int lane = 0; lane < 4; lane++)
                {
                    if (!(scores[lane] > bestScore)) continue;
                    bestScore = scores[lane];
                    ulong word = cumulative[j + lane] + placed;
                    double rows = PackedBinaryHistogram.Rows(word);
                    best = Record(feature, codes[j + lane], bestScore, rows, totalRows - rows, hasMissing, hasBelow, missingLeft, belowLeft);
                }
            }
        }
        for (; j < codes.Length; j++)
        {
            ulong left = cumulative[j] + placed; // the placed groups plus value codes[0..j]
            double leftRows = PackedBinaryHistogram.Rows(left);
            double rightRows = totalRows - leftRows;
            if (leftRows < minLeafSize || rightRows < minLeafSize) continue;
            double left0 = PackedBinaryHistogram.Class0(left), left1 = PackedBinaryHistogram.Class1(left);
            double right0 = total0 - left0, right1 = total1 - left1;
            if (left0 + left1 <= 0 || right0 + right1 <= 0) continue;
            double score = GiniImpurity.SplitScore(left0, left1, right0, right1);
            if (!(score > bestScore)) continue;
            bestScore = score;
            best = Record(feature, codes[j], score, leftRows, rightRows, hasMissing, hasBelow, missingLeft, belowLeft);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void ScanBinary(NodeHistogram histogram, int feature, ReadOnlySpan<double> nodeTotals, int minLeafSize,
        bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        var entries = histogram.Entries;
        var codes = histogram.ValueCodes;
        double total0 = nodeTotals[0], total1 = nodeTotals[1], totalRows = nodeTotals[2];
        double left0 = 0, left1 = 0, leftRows = 0;
        if (missingLeft) Add(histogram.Missing, ref left0, ref left1, ref leftRows);
        if (belowLeft) Add(histogram.BelowDetection, ref left0, ref left1, ref leftRows);
        double bestScore = best.Score;
        // Invariant: after step j, (left0, left1, leftRows) hold the placed groups plus value codes[0..j].
        for (int j = 0; j < codes.Length; j++)
        {
            int at = codes[j] * 3;
            left0 += entries[at];
            left1 += entries[at + 1];
            leftRows += entries[at + 2];
            double rightRows = totalRows - leftRows;
            if (leftRows < minLeafSize || rightRows < minLeafSize) continue;
            double right0 = total0 - left0, right1 = total1 - left1;
            double leftWeight = left0 + left1, rightWeight = right0 + right1;
            if (leftWeight <= 0 || rightWeight <= 0) continue;
            double score = GiniImpurity.SplitScore(left0, left1, right0, right1);
            if (!(score > bestScore)) continue;
            bestScore = score;
            best = Record(feature, codes[j], score, leftRows, rightRows, hasMissing, hasBelow, missingLeft, belowLeft);
        }
    }

    private void ScanGeneral(NodeHistogram histogram, int feature, ReadOnlySpan<double> nodeTotals, int minLeafSize,
        bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        var left = _left.AsSpan();
        left.Clear();
        if (missingLeft) Add(left, histogram.Missing);
        if (belowLeft) Add(left, histogram.BelowDetection);
        var codes = histogram.ValueCodes;
        // Invariant: after step j, left holds the placed groups plus value codes[0..j].
        for (int j = 0; j < codes.Length; j++)
        {
            Add(left, histogram.Entry(codes[j]));
            ConsiderGeneral(left, nodeTotals, minLeafSize, feature, codes[j], hasMissing, hasBelow, missingLeft, belowLeft, ref best);
        }
    }

    private static void ConsiderGeneral(ReadOnlySpan<double> left, ReadOnlySpan<double> nodeTotals, int minLeafSize,
        int feature, byte binThreshold, bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft, ref SplitCandidate best)
    {
        int classCount = nodeTotals.Length - 1;
        double leftRows = left[classCount];
        double rightRows = nodeTotals[classCount] - leftRows;
        if (leftRows < minLeafSize || rightRows < minLeafSize) return;
        double leftWeight = 0, rightWeight = 0;
        for (int c = 0; c < classCount; c++)
        {
            leftWeight += left[c];
            rightWeight += nodeTotals[c] - left[c];
        }
        if (leftWeight <= 0 || rightWeight <= 0) return;
        double score = GiniImpurity.SplitScore(left[..classCount], nodeTotals[..classCount], leftWeight, rightWeight);
        if (!(score > best.Score)) return;
        best = Record(feature, binThreshold, score, leftRows, rightRows, hasMissing, hasBelow, missingLeft, belowLeft);
    }

    internal static SplitCandidate Record(int feature, byte binThreshold, double score, double leftRows, double rightRows,
        bool hasMissing, bool hasBelow, bool missingLeft, bool belowLeft)
    {
        bool largerLeft = leftRows >= rightRows;
        var routing = UnmeasuredRouting.BothRight;
        if (hasMissing ? missingLeft : largerLeft) routing |= UnmeasuredRouting.MissingLeft;
        if (hasBelow ? belowLeft : largerLeft) routing |= UnmeasuredRouting.BelowDetectionLeft;
        return new SplitCandidate
        {
            Feature = feature,
            BinThreshold = binThreshold,
            Routing = routing,
            Score = score,
            LeftRowCount = (int)leftRows,
            RightRowCount = (int)rightRows,
        };
    }

    private static void Add(ReadOnlySpan<double> entry, ref double weight0, ref double weight1, ref double rows)
    {
        weight0 += entry[0];
        weight1 += entry[1];
        rows += entry[2];
    }

    private static void Add(Span<double> target, ReadOnlySpan<double> source)
    {
        for (int i = 0; i < target.Length; i++) target[i] += source[i];
    }
}
