using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Binning;

/// <summary>
/// The plain binning that <see cref="BinMapper"/> must equal bound for bound and code for code:
/// per feature, a comparison sort of the measured values, bounds from the sorted values, then a
/// binary search per cell (<see cref="FeatureBins.CodeOf"/>). It is the engine's first binning
/// (commit d2db6d6), kept for tests and as the yardstick of issue 15's speed goal for binning.
/// </summary>
internal static class ReferenceBinning
{
    public static (byte[][] Codes, FeatureBins[] Bins) Bin(FeatureMatrix matrix, int maxBins = BinMapper.MaxValueBins)
    {
        var codes = new byte[matrix.FeatureCount][];
        var bins = new FeatureBins[matrix.FeatureCount];
        var sorted = new float[matrix.SampleCount];
        for (int feature = 0; feature < matrix.FeatureCount; feature++)
        {
            codes[feature] = new byte[matrix.SampleCount];
            bins[feature] = BinFeature(matrix.Column(feature), matrix.States(feature), codes[feature], sorted, maxBins);
        }
        return (codes, bins);
    }

    private static FeatureBins BinFeature(ReadOnlySpan<float> values, ReadOnlySpan<CellState> states, Span<byte> codes, Span<float> sortScratch, int maxBins)
    {
        int measuredCount = 0;
        for (int s = 0; s < values.Length; s++)
            if ((states.IsEmpty || states[s] == CellState.Measured) && !float.IsNaN(values[s])) sortScratch[measuredCount++] = values[s];
        var sorted = sortScratch[..measuredCount];
        sorted.Sort();
        int distinctCount = 0;
        for (int i = 0; i < sorted.Length; i++)
            if (i == 0 || sorted[i] != sorted[i - 1]) distinctCount++;
        var bins = distinctCount <= maxBins ? ExactBins(sorted, distinctCount) : QuantileBins(sorted, maxBins);
        for (int s = 0; s < values.Length; s++)
            codes[s] = bins.CodeOf(values[s], states.IsEmpty ? CellState.Measured : states[s]);
        return bins;
    }

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

    private static float Midpoint(float lower, float upper) => BinMapper.Midpoint(lower, upper);
}
