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
        var codes = new byte[featureCount][];
        var bins = new FeatureBins[featureCount];
        var parallel = WorkerThreads.Options(threadCount);
        // Chunks of features per task: on a wide panel a feature is a few microseconds of work.
        const int chunk = 64;
        int chunkCount = (featureCount + chunk - 1) / chunk;
        Parallel.For(0, chunkCount, parallel,
            () => new BinScratch(matrix.SampleCount),
            (c, _, scratch) =>
            {
                int end = Math.Min(featureCount, (c + 1) * chunk);
                for (int feature = c * chunk; feature < end; feature++)
                {
                    codes[feature] = new byte[matrix.SampleCount];
                    bins[feature] = BinFeature(matrix.Column(feature), matrix.States(feature), codes[feature], scratch.Values, scratch.Samples, scratch.Sorter);
                }
                return scratch;
            },
            _ => { });
        var sources = new int[featureCount];
        for (int f = 0; f < featureCount; f++) sources[f] = f;
        return new BinnedMatrix(matrix.FeatureNames, matrix.SampleCount, codes, bins, sources, new bool[featureCount]);
    }

    /// <summary>One thread's sort buffers: measured values and, parallel to them, their samples, and the sort's own.</summary>
    private sealed class BinScratch(int sampleCount)
    {
        public readonly float[] Values = new float[sampleCount];
        public readonly int[] Samples = new int[sampleCount];
        public readonly FloatRadixSort Sorter = new(sampleCount);
    }

    /// <summary>
    /// Finds one feature's bins and writes its codes; the scratch spans hold at least one entry per sample.
    /// </summary>
    /// <remarks>
    /// The measured values are sorted together with their sample numbers (a radix sort, see
    /// <see cref="FloatRadixSort"/>), so once the bounds are
    /// known each sample's code is read off by one walk up the sorted values (the bin advances
    /// while the value exceeds its upper bound), instead of a binary search per cell, whose
    /// unpredictable branches cost most of the binning time. The walk gives exactly the code
    /// <see cref="FeatureBins.CodeOf"/> gives: the first bin whose upper bound is at least the value.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal FeatureBins BinFeature(ReadOnlySpan<float> values, ReadOnlySpan<CellState> states, Span<byte> codes,
        Span<float> sortScratch, Span<int> sampleScratch, FloatRadixSort sorter)
    {
        int measuredCount = 0;
        for (int s = 0; s < values.Length; s++)
        {
            if (IsMeasured(values[s], states, s))
            {
                sortScratch[measuredCount] = values[s];
                sampleScratch[measuredCount++] = s;
            }
            else codes[s] = 0; // set below, once the bins (and so the reserved codes) are known
        }
        var sorted = sortScratch[..measuredCount];
        var sortedSamples = sampleScratch[..measuredCount];
        sorter.Sort(sorted, sortedSamples);

        int distinctCount = 0;
        for (int i = 0; i < sorted.Length; i++)
            if (i == 0 || sorted[i] != sorted[i - 1]) distinctCount++;

        var bins = distinctCount <= MaxBins ? ExactBins(sorted, distinctCount) : QuantileBins(sorted, MaxBins);
        var bounds = bins.UpperBounds;
        int bin = 0;
        // Invariant: bounds[bin - 1] < sorted[i] (the values rise), so the first bound at least
        // sorted[i] is found by moving forward; the last bound is +infinity, so bin stays in range.
        for (int i = 0; i < sorted.Length; i++)
        {
            float value = sorted[i];
            while (value > bounds[bin]) bin++;
            codes[sortedSamples[i]] = (byte)bin;
        }
        if (measuredCount < values.Length)
            for (int s = 0; s < values.Length; s++)
                if (!IsMeasured(values[s], states, s))
                    codes[s] = bins.CodeOf(values[s], states.IsEmpty ? CellState.Measured : states[s]);
        return bins;
    }

    private static bool IsMeasured(float value, ReadOnlySpan<CellState> states, int sample) =>
        (states.IsEmpty || states[sample] == CellState.Measured) && !float.IsNaN(value);

    private static FeatureBins ExactBins(ReadOnlySpan<float> sorted, int distinctCount)
    {
        var bounds = new float[Math.Max(1, distinctCount)];
        int bin = 0;
        for (int i = 1; i < sorted.Length; i++)
            if (sorted[i] != sorted[i - 1]) bounds[bin++] = Midpoint(sorted[i - 1], sorted[i]);
        bounds[^1] = float.PositiveInfinity;
        return new FeatureBins(bounds, isExact: true);
    }

    private static FeatureBins QuantileBins(ReadOnlySpan<float> sorted, int binCount)
    {
        var bounds = new List<float>(binCount);
        int lastCut = 0;
        int count = sorted.Length;
        for (int b = 1; b < binCount; b++)
        {
            int cut = (int)((long)b * count / binCount);
            if (cut <= lastCut) continue;
            // Move the cut past ties so equal values never straddle two bins.
            while (cut < count && sorted[cut] == sorted[cut - 1]) cut++;
            if (cut >= count) break;
            bounds.Add(Midpoint(sorted[cut - 1], sorted[cut]));
            lastCut = cut;
        }
        bounds.Add(float.PositiveInfinity);
        return new FeatureBins(bounds.ToArray(), isExact: false);
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
