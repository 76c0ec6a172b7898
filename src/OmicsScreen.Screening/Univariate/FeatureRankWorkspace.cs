using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Univariate;

/// <summary>
/// Per-thread scratch that sorts one feature's usable values within a scope once and then answers
/// every class-against-rest contrast from that single sort in O(N) each.
/// </summary>
/// <remarks>
/// Below-detection cells are loaded as negative infinity: they are known only to lie under the
/// assay's limit, so they form one tie below every measured value of the feature (the limits of
/// different samples are not compared). Missing cells, and measured cells holding NaN, are left out.
/// Buffers are sized once for the largest scope and reused for every feature.
/// Each usable cell is packed into one 64-bit sort key: the float's bits mapped to an unsigned
/// integer in the same order (sign bit flipped for positives, all bits flipped for negatives)
/// in the high half, the class code in the low half. One primitive array sorts without moving a
/// parallel item array, and equal values stay adjacent (ordered by class, which no statistic
/// depends on). A measured cell holding negative infinity would tie with the censored cells.
/// </remarks>
internal sealed class FeatureRankWorkspace
{
    private const ulong ValueMask = 0xFFFF_FFFF_0000_0000UL;

    private readonly ulong[] _packed;
    private readonly int[] _classCounts;

    public FeatureRankWorkspace(int maxSampleCount, int classCount)
    {
        _packed = new ulong[maxSampleCount];
        _classCounts = new int[classCount];
    }

    /// <summary>Usable (measured or below-detection) values loaded.</summary>
    public int UsableCount { get; private set; }
    public int MissingCount { get; private set; }
    public int BelowDetectionCount { get; private set; }
    /// <summary>Sum of (t^3 - t) over runs of tied values, for the Mann-Whitney variance.</summary>
    public double TieTerm { get; private set; }

    /// <summary>Gathers the scope's cells of one feature, sorts them with their class codes and computes the tie term.</summary>
    public void Load(ReadOnlySpan<float> column, ReadOnlySpan<CellState> states, ReadOnlySpan<int> sampleClasses,
        ReadOnlySpan<int> scopeSamples)
    {
        Array.Clear(_classCounts);
        int usable = 0, missing = 0, censored = 0;
        bool hasStates = !states.IsEmpty;
        foreach (int sample in scopeSamples)
        {
            var state = hasStates ? states[sample] : CellState.Measured;
            float value;
            if (state == CellState.BelowDetection)
            {
                value = float.NegativeInfinity;
                censored++;
            }
            else
            {
                value = column[sample];
                if (state == CellState.Missing || float.IsNaN(value))
                {
                    missing++;
                    continue;
                }
            }
            int classCode = sampleClasses[sample];
            _packed[usable] = ((ulong)OrderedBits(value) << 32) | (uint)classCode;
            _classCounts[classCode]++;
            usable++;
        }
        UsableCount = usable;
        MissingCount = missing;
        BelowDetectionCount = censored;
        _packed.AsSpan(0, usable).Sort();

        double tieTerm = 0;
        for (int start = 0; start < usable;)
        {
            int end = RunEnd(start);
            double runLength = end - start;
            tieTerm += runLength * runLength * runLength - runLength;
            start = end;
        }
        TieTerm = tieTerm;
    }

    /// <summary>
    /// Rank sum, DeLong variance and medians of <paramref name="contrastClass"/> against every other
    /// loaded class, walking the sorted runs of ties once.
    /// </summary>
    /// <remarks>
    /// For a run of tied values spanning sorted positions [start, end), the pooled midrank is
    /// R = (start + 1 + end) / 2. A class member of the run has within-class midrank
    /// C + (c + 1) / 2, with C class members before the run and c in it, so its DeLong component is
    /// V10 = (R - C - (c + 1)/2) / n0 (Sun &amp; Xu 2014); likewise V01 = 1 - (R - D - (r + 1)/2) / n1
    /// for the r reference members with D before. Components are constant within a run, so their
    /// variances accumulate with run weights (West 1979 weighted update).
    /// </remarks>
    public ContrastSummary Contrast(int contrastClass)
    {
        int classCount = _classCounts[contrastClass];
        int restCount = UsableCount - classCount;
        var classMedian = new MedianTracker(classCount);
        var restMedian = new MedianTracker(restCount);
        var classComponents = new WeightedMoments();
        var restComponents = new WeightedMoments();
        double rankSum = 0;
        int classBefore = 0, restBefore = 0;
        // Invariant: classBefore and restBefore count the class and reference members at sorted positions [0, start).
        for (int start = 0; start < UsableCount;)
        {
            int end = RunEnd(start);
            int classInRun = 0;
            for (int k = start; k < end; k++)
                if ((int)(uint)_packed[k] == contrastClass) classInRun++;
            int restInRun = end - start - classInRun;
            double midrank = (start + 1 + end) * 0.5;
            double value = ValueOf(_packed[start]);
            if (classInRun > 0)
            {
                rankSum += classInRun * midrank;
                if (restCount > 0) classComponents.Add((midrank - classBefore - (classInRun + 1) * 0.5) / restCount, classInRun);
                classMedian.Offer(classBefore, classInRun, value);
            }
            if (restInRun > 0)
            {
                if (classCount > 0) restComponents.Add(1.0 - (midrank - restBefore - (restInRun + 1) * 0.5) / classCount, restInRun);
                restMedian.Offer(restBefore, restInRun, value);
            }
            classBefore += classInRun;
            restBefore += restInRun;
            start = end;
        }
        double variance = classCount >= 2 && restCount >= 2
            ? classComponents.SampleVariance / classCount + restComponents.SampleVariance / restCount
            : double.NaN;
        return new ContrastSummary(classCount, restCount, rankSum, variance,
            classMedian.Median, classMedian.BelowDetection, restMedian.Median, restMedian.BelowDetection);
    }

    private int RunEnd(int start)
    {
        int end = start + 1;
        ulong value = _packed[start] & ValueMask;
        while (end < UsableCount && (_packed[end] & ValueMask) == value) end++;
        return end;
    }

    /// <summary>
    /// Maps a non-NaN float to an unsigned integer with the same order (IEEE 754 total order of
    /// the bit patterns once the sign is handled); -0 is folded onto +0 so equal values tie.
    /// </summary>
    private static uint OrderedBits(float value)
    {
        uint bits = BitConverter.SingleToUInt32Bits(value == 0 ? 0f : value);
        return (bits & 0x8000_0000u) != 0 ? ~bits : bits | 0x8000_0000u;
    }

    private static double ValueOf(ulong packed)
    {
        uint ordered = (uint)(packed >> 32);
        uint bits = (ordered & 0x8000_0000u) != 0 ? ordered & 0x7FFF_FFFFu : ~ordered;
        return BitConverter.UInt32BitsToSingle(bits);
    }

    /// <summary>Picks the middle order statistics of one group as its runs go by in ascending order.</summary>
    private struct MedianTracker(int groupCount)
    {
        private readonly int _lowerIndex = (groupCount - 1) / 2;
        private readonly int _upperIndex = groupCount / 2;
        private double _lower = double.NaN;
        private double _upper = double.NaN;

        /// <summary>A run holding the group's order statistics [before, before + count) at <paramref name="value"/>.</summary>
        public void Offer(int before, int count, double value)
        {
            if (_lowerIndex >= before && _lowerIndex < before + count) _lower = value;
            if (_upperIndex >= before && _upperIndex < before + count) _upper = value;
        }

        public readonly bool BelowDetection =>
            double.IsNegativeInfinity(_lower) || double.IsNegativeInfinity(_upper);

        /// <summary>Mean of the two middle values (one value twice for an odd count); NaN if empty or censored.</summary>
        public readonly double Median => BelowDetection ? double.NaN : 0.5 * (_lower + _upper);
    }

    /// <summary>Weighted mean and sum of squared deviations, updated one weighted value at a time (West 1979).</summary>
    private struct WeightedMoments
    {
        private double _weight;
        private double _mean;
        private double _squares;

        public void Add(double value, int weight)
        {
            _weight += weight;
            double delta = value - _mean;
            _mean += delta * weight / _weight;
            _squares += weight * delta * (value - _mean);
        }

        /// <summary>Variance with divisor (total weight - 1), the sample variance of the expanded values.</summary>
        public readonly double SampleVariance => _squares / (_weight - 1);
    }
}
