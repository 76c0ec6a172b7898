using OmicsScreen.Engine.Parallelism;
using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Binning;

/// <summary>
/// Quantises every feature of a panel into at most <see cref="MaxValueBins"/> ordered value bins
/// plus the two reserved codes (missing, below detection), one byte per cell.
/// </summary>
/// <remarks>
/// A feature with at most maxValueBins distinct measured values gets one bin per value, so split
/// search over codes finds exactly the split that sorting raw values would. Otherwise the cut
/// points are sample quantiles (at ranks b·m/B, moved forward past ties), as in histogram tree
/// learners (Ke et al. 2017, "LightGBM", NeurIPS).
/// </remarks>
public sealed class BinMapper
{
    /// <summary>Codes set aside after the value bins: missing, then below detection.</summary>
    public const int ReservedCodes = 2;

    /// <summary>256 byte codes minus the reserved ones.</summary>
    public const int MaxValueBins = 256 - ReservedCodes;

    public BinMapper(int maxValueBins = MaxValueBins)
    {
        if (maxValueBins is < 2 or > MaxValueBins)
            throw new ArgumentOutOfRangeException(nameof(maxValueBins), $"Use 2 to {MaxValueBins} value bins.");
        MaxBins = maxValueBins;
    }

    public int MaxBins { get; }

    /// <summary>Bins every feature; features are independent, so they are binned in parallel.</summary>
    public BinnedMatrix Bin(FeatureMatrix matrix, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int featureCount = matrix.FeatureCount;
        int sampleCount = matrix.SampleCount;
        var codes = CodeBlocks.Allocate(featureCount, sampleCount);
        var bins = new FeatureBins[featureCount];
        var parallel = WorkerThreads.Options(threadCount);
        int chunkCount = (featureCount + FeaturesPerChunk - 1) / FeaturesPerChunk;
        Parallel.For(0, chunkCount, parallel,
            () => new BinScratch(sampleCount, MaxBins),
            (c, _, scratch) =>
            {
                int first = c * FeaturesPerChunk;
                int end = Math.Min(featureCount, first + FeaturesPerChunk);
                // The chunk's bounds are gathered in scratch, then kept in one array for all its features.
                int used = 0;
                for (int feature = first; feature < end; feature++)
                {
                    var column = codes[feature];
                    var (boundCount, isExact) = BinFeature(matrix.Column(feature), matrix.States(feature),
                        column.Store.AsSpan(column.Start, sampleCount), scratch.Bounds.AsSpan(used, MaxBins), scratch.Cuts, scratch.Sorter);
                    scratch.BoundCounts[feature - first] = boundCount;
                    scratch.IsExact[feature - first] = isExact;
                    used += boundCount;
                }
                var store = scratch.Bounds.AsSpan(0, used).ToArray();
                int start = 0;
                for (int feature = first; feature < end; feature++)
                {
                    int boundCount = scratch.BoundCounts[feature - first];
                    bins[feature] = new FeatureBins(store, start, boundCount, scratch.IsExact[feature - first]);
                    start += boundCount;
                }
                return scratch;
            },
            _ => { });
        var sources = new int[featureCount];
        for (int f = 0; f < featureCount; f++) sources[f] = f;
        return new BinnedMatrix(matrix.FeatureNames, sampleCount, codes, bins, sources, new bool[featureCount]);
    }

    /// <summary>Features per task: on a wide panel a feature is a few microseconds of work.</summary>
    private const int FeaturesPerChunk = 64;

    /// <summary>One thread's buffers: the sort's, the quantile cuts, and a chunk's bounds before they are kept.</summary>
    private sealed class BinScratch(int sampleCount, int maxBins)
    {
        public readonly FloatRadixSort Sorter = new(sampleCount);
        public readonly int[] Cuts = new int[maxBins];
        public readonly float[] Bounds = new float[FeaturesPerChunk * maxBins];
        public readonly int[] BoundCounts = new int[FeaturesPerChunk];
        public readonly bool[] IsExact = new bool[FeaturesPerChunk];
    }

    /// <summary>
    /// Finds one feature's bins and writes its codes. Returns the number of upper bounds written
    /// to <paramref name="bounds"/> (room for <see cref="MaxBins"/>; the last is +infinity) and
    /// whether the bins are exact.
    /// </summary>
    /// <remarks>
    /// The measured values' order-preserving keys are sorted together with their sample numbers
    /// (<see cref="FloatRadixSort"/>), and each sample's code is read off the sorted run: with
    /// exact bins the code is the number of distinct values below the sample's, counted in the
    /// same walk that writes the bounds; with quantile bins the cuts are positions in the sorted
    /// run and every sample between two cuts gets the same code. Both equal
    /// <see cref="FeatureBins.CodeOf"/> (the first bin whose upper bound is at least the value)
    /// because each bound lies in [value before the cut, value after it) (<see cref="Midpoint"/>).
    /// There is no binary search per cell, whose unpredictable branches once cost most of the time.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal (int BoundCount, bool IsExact) BinFeature(ReadOnlySpan<float> values, ReadOnlySpan<CellState> states,
        Span<byte> codes, Span<float> bounds, Span<int> cuts, FloatRadixSort sorter)
    {
        var keys = sorter.Keys;
        var samples = sorter.Samples;
        int measuredCount = 0;
        if (states.IsEmpty)
        {
            for (int s = 0; s < values.Length; s++)
            {
                float value = values[s];
                if (float.IsNaN(value)) continue;
                keys[measuredCount] = FloatRadixSort.KeyOf(value);
                samples[measuredCount++] = s;
            }
        }
        else
        {
            for (int s = 0; s < values.Length; s++)
            {
                float value = values[s];
                if (states[s] != CellState.Measured || float.IsNaN(value)) continue;
                keys[measuredCount] = FloatRadixSort.KeyOf(value);
                samples[measuredCount++] = s;
            }
        }
        sorter.Sort(measuredCount);
        var sortedKeys = sorter.SortedKeys;
        var sortedSamples = sorter.SortedSamples;

        int boundCount = ExactBins(sortedKeys, sortedSamples, codes, bounds);
        bool isExact = boundCount > 0;
        if (!isExact)
        {
            int cutCount = QuantileCuts(sortedKeys, MaxBins, cuts);
            int from = 0;
            for (int bin = 0; bin <= cutCount; bin++)
            {
                int to = bin < cutCount ? cuts[bin] : sortedKeys.Length;
                if (bin < cutCount)
                    bounds[bin] = Midpoint(FloatRadixSort.ValueOf(sortedKeys[to - 1]), FloatRadixSort.ValueOf(sortedKeys[to]));
                for (int i = from; i < to; i++) codes[sortedSamples[i]] = (byte)bin;
                from = to;
            }
            bounds[cutCount] = float.PositiveInfinity;
            boundCount = cutCount + 1;
        }
        if (measuredCount < values.Length)
        {
            // Reserved codes, as FeatureBins.CodeOf gives them: missing (or NaN) after the value bins, then below detection.
            byte missing = (byte)boundCount, belowDetection = (byte)(boundCount + 1);
            for (int s = 0; s < values.Length; s++)
            {
                var state = states.IsEmpty ? CellState.Measured : states[s];
                if (state == CellState.BelowDetection) codes[s] = belowDetection;
                else if (state == CellState.Missing || float.IsNaN(values[s])) codes[s] = missing;
            }
        }
        return (boundCount, isExact);
    }

    /// <summary>
    /// One bin per distinct value, bounds at the midpoints between neighbours, codes written in
    /// the same walk; 0 when there are more distinct values than <see cref="MaxBins"/> (the codes
    /// written so far are then overwritten by the quantile bins).
    /// </summary>
    private int ExactBins(ReadOnlySpan<uint> sortedKeys, ReadOnlySpan<int> sortedSamples, Span<byte> codes, Span<float> bounds)
    {
        int bin = 0;
        if (sortedKeys.Length > 0)
        {
            float previous = FloatRadixSort.ValueOf(sortedKeys[0]);
            codes[sortedSamples[0]] = 0;
            for (int i = 1; i < sortedKeys.Length; i++)
            {
                float value = FloatRadixSort.ValueOf(sortedKeys[i]);
                // Float comparison, not key comparison: -0 and +0 are one value.
                if (value != previous)
                {
                    if (bin == MaxBins - 1) return 0;
                    bounds[bin++] = Midpoint(previous, value);
                    previous = value;
                }
                codes[sortedSamples[i]] = (byte)bin;
            }
        }
        bounds[bin] = float.PositiveInfinity;
        return bin + 1;
    }

    /// <summary>
    /// Positions in the sorted values where a new bin starts: the sample quantiles at ranks
    /// b·m/B for b = 1..B-1, each moved forward past ties so equal values never straddle two
    /// bins, dropped when it meets the previous cut or the end. Returns the number of cuts.
    /// </summary>
    private static int QuantileCuts(ReadOnlySpan<uint> sortedKeys, int binCount, Span<int> cuts)
    {
        int cutCount = 0;
        int lastCut = 0;
        int count = sortedKeys.Length;
        for (int b = 1; b < binCount; b++)
        {
            int cut = (int)((long)b * count / binCount);
            if (cut <= lastCut) continue;
            while (cut < count && FloatRadixSort.ValueOf(sortedKeys[cut]) == FloatRadixSort.ValueOf(sortedKeys[cut - 1])) cut++;
            if (cut >= count) break;
            cuts[cutCount++] = cut;
            lastCut = cut;
        }
        return cutCount;
    }

    /// <summary>
    /// A bound b with lower &lt;= b &lt; upper: the midpoint when float can hold it strictly below
    /// upper, else lower itself (adjacent floats, or an infinite upper value).
    /// </summary>
    internal static float Midpoint(float lower, float upper)
    {
        float middle = (float)(((double)lower + upper) * 0.5);
        return middle >= upper || middle < lower || float.IsNaN(middle) ? lower : middle;
    }
}
