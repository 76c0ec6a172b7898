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
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = threadCount > 0 ? threadCount : Environment.ProcessorCount };
        Parallel.For(0, featureCount, parallel,
            () => new float[matrix.SampleCount],
            (feature, _, sorted) =>
            {
                codes[feature] = new byte[matrix.SampleCount];
                bins[feature] = BinFeature(matrix.Column(feature), matrix.States(feature), codes[feature], sorted);
                return sorted;
            },
            _ => { });
        var sources = new int[featureCount];
        for (int f = 0; f < featureCount; f++) sources[f] = f;
        return new BinnedMatrix(matrix.FeatureNames, matrix.SampleCount, codes, bins, sources, new bool[featureCount]);
    }

    /// <summary>Finds one feature's bins and writes its codes; sortScratch holds at least one value per sample.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal FeatureBins BinFeature(ReadOnlySpan<float> values, ReadOnlySpan<CellState> states, Span<byte> codes, Span<float> sortScratch)
    {
        int measuredCount = 0;
        for (int s = 0; s < values.Length; s++)
            if (IsMeasured(values[s], states, s)) sortScratch[measuredCount++] = values[s];
        var sorted = sortScratch[..measuredCount];
        sorted.Sort();

        int distinctCount = 0;
        for (int i = 0; i < sorted.Length; i++)
            if (i == 0 || sorted[i] != sorted[i - 1]) distinctCount++;

        var bins = distinctCount <= MaxBins ? ExactBins(sorted, distinctCount) : QuantileBins(sorted, MaxBins);
        for (int s = 0; s < values.Length; s++)
        {
            var state = states.IsEmpty ? CellState.Measured : states[s];
            codes[s] = bins.CodeOf(values[s], state);
        }
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
