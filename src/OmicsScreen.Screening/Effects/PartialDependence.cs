using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Effects;

/// <summary>
/// Partial dependence (Friedman 2001, Ann. Statist. 29:1189, sec. 8.2) and individual conditional
/// expectation curves (Goldstein et al. 2015, J. Comput. Graph. Stat. 24:44) of a forest on one
/// marker, computed on the binned panel the forest was grown on.
/// </summary>
/// <remarks>
/// A tree sees a marker only through its bin code, so setting the marker to any value of one bin
/// gives the same prediction: the grid is a set of bin codes, each labelled by the median of the
/// measured values that fall in it. With more occupied bins than grid points, the grid takes the
/// bins at evenly spaced quantiles of the samples' measured values, so it follows where the data
/// are. Every sample's curve sums its trees in tree order, and samples are split among threads
/// with each result stored by sample, so the curve does not depend on the thread count.
/// </remarks>
public static class PartialDependence
{
    public const int DefaultGridPoints = 24;

    public static EffectCurve Compute(IReadOnlyList<TreeLeafValues> trees, FeatureMatrix raw, BinnedMatrix binned, int feature,
        int maxGridPoints = DefaultGridPoints, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(trees);
        ArgumentNullException.ThrowIfNull(raw);
        ArgumentNullException.ThrowIfNull(binned);
        if (trees.Count == 0) throw new ArgumentException("Partial dependence needs at least one tree.");
        if (raw.SampleCount != binned.SampleCount) throw new ArgumentException("The raw and binned panels must hold the same samples.");
        if (maxGridPoints < 2) throw new ArgumentOutOfRangeException(nameof(maxGridPoints), "A curve needs at least two grid points.");
        var (codes, values) = Grid(raw, binned, feature, maxGridPoints);
        int gridCount = codes.Length, sampleCount = binned.SampleCount;
        var individual = new double[sampleCount * gridCount];
        if (gridCount > 0)
        {
            Parallel.For(0, sampleCount, WorkerThreads.Options(threadCount), sample =>
            {
                var row = individual.AsSpan(sample * gridCount, gridCount);
                for (int t = 0; t < trees.Count; t++)
                {
                    var (topology, nodeValues) = (trees[t].Topology, trees[t].NodeValues);
                    for (int g = 0; g < gridCount; g++) row[g] += nodeValues[topology.LeafOf(binned, sample, feature, codes[g])];
                }
                for (int g = 0; g < gridCount; g++) row[g] /= trees.Count;
            });
        }
        var average = new double[gridCount];
        var lower = new double[gridCount];
        var upper = new double[gridCount];
        var column = new double[sampleCount];
        for (int g = 0; g < gridCount; g++)
        {
            double sum = 0;
            for (int s = 0; s < sampleCount; s++) { column[s] = individual[s * gridCount + g]; sum += column[s]; }
            average[g] = sum / sampleCount;
            Array.Sort(column);
            lower[g] = Quantile.OfSorted(column, 0.10, QuantileDefinition.Linear);
            upper[g] = Quantile.OfSorted(column, 0.90, QuantileDefinition.Linear);
        }
        return new EffectCurve(feature, values, average, lower, upper, individual);
    }

    /// <summary>The occupied value bins of the feature (at most maxGridPoints, at evenly spaced sample quantiles) and their median values.</summary>
    internal static (byte[] Codes, double[] Values) Grid(FeatureMatrix raw, BinnedMatrix binned, int feature, int maxGridPoints)
    {
        var bins = binned.Bins(feature);
        var codes = binned.Codes(feature);
        var measured = new List<(byte Code, double Value)>();
        for (int s = 0; s < raw.SampleCount; s++)
            if (raw.State(feature, s) == CellState.Measured && codes[s] < bins.ValueBinCount) measured.Add((codes[s], raw.Value(feature, s)));
        if (measured.Count == 0) return ([], []);
        measured.Sort((a, b) => a.Value.CompareTo(b.Value));
        var chosen = new SortedSet<byte>();
        var occupied = measured.Select(m => m.Code).Distinct().Count();
        if (occupied <= maxGridPoints) foreach (var m in measured) chosen.Add(m.Code);
        else
            for (int g = 0; g < maxGridPoints; g++)
                chosen.Add(measured[(int)Math.Round(g * (measured.Count - 1.0) / (maxGridPoints - 1))].Code);
        var gridCodes = chosen.ToArray();
        var gridValues = new double[gridCodes.Length];
        for (int g = 0; g < gridCodes.Length; g++)
            gridValues[g] = Quantile.MedianOfSorted(measured.Where(m => m.Code == gridCodes[g]).Select(m => m.Value).ToArray());
        return (gridCodes, gridValues);
    }
}
