using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Effects;

/// <summary>
/// Partial dependence of a forest on two markers at once (Friedman 2001, Ann. Statist. 29:1189,
/// sec. 8.2): for each pair of grid values, every sample's prediction with both markers replaced,
/// averaged over samples. Grids are those of <see cref="PartialDependence"/> (occupied bins at
/// evenly spaced quantiles, labelled by their median value), with fewer points per axis.
/// </summary>
/// <remarks>
/// Samples are split among threads and each sample's sums are stored in its own row; the average
/// then adds the rows in sample order, so the surface does not depend on the thread count.
/// </remarks>
public static class PairPartialDependence
{
    public const int DefaultGridPoints = 10;

    public static EffectSurface Compute(IReadOnlyList<TreeLeafValues> trees, FeatureMatrix raw, BinnedMatrix binned, int first, int second,
        int maxGridPoints = DefaultGridPoints, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(trees);
        ArgumentNullException.ThrowIfNull(raw);
        ArgumentNullException.ThrowIfNull(binned);
        if (trees.Count == 0) throw new ArgumentException("Partial dependence needs at least one tree.");
        if (first == second) throw new ArgumentException("A two-marker surface needs two different markers.");
        if (maxGridPoints < 2) throw new ArgumentOutOfRangeException(nameof(maxGridPoints), "A surface needs at least two grid points per axis.");
        var (firstCodes, firstValues) = PartialDependence.Grid(raw, binned, first, maxGridPoints);
        var (secondCodes, secondValues) = PartialDependence.Grid(raw, binned, second, maxGridPoints);
        int cells = firstCodes.Length * secondCodes.Length, sampleCount = binned.SampleCount;
        var perSample = new double[sampleCount * cells];
        if (cells > 0)
        {
            Parallel.For(0, sampleCount, WorkerThreads.Options(threadCount), sample =>
            {
                var row = perSample.AsSpan(sample * cells, cells);
                for (int t = 0; t < trees.Count; t++)
                {
                    var topology = trees[t].Topology;
                    var values = trees[t].NodeValues;
                    for (int i = 0; i < firstCodes.Length; i++)
                        for (int j = 0; j < secondCodes.Length; j++)
                            row[i * secondCodes.Length + j] += values[LeafOf(topology, binned, sample, first, firstCodes[i], second, secondCodes[j])];
                }
            });
        }
        var average = new double[cells];
        for (int s = 0; s < sampleCount; s++)
            for (int c = 0; c < cells; c++) average[c] += perSample[s * cells + c];
        for (int c = 0; c < cells; c++) average[c] /= (double)sampleCount * trees.Count;
        return new EffectSurface(first, second, firstValues, secondValues, average);
    }

    /// <summary>The leaf a sample reaches with its codes of two features replaced.</summary>
    private static int LeafOf(SplitTopology topology, BinnedMatrix matrix, int sample, int first, byte firstCode, int second, byte secondCode)
    {
        var features = topology.Features;
        int node = 0;
        while (features[node] >= 0)
        {
            int feature = features[node];
            byte code = feature == first ? firstCode : feature == second ? secondCode : matrix.Codes(feature)[sample];
            node = topology.GoesLeft(node, code) ? topology.LeftChildren[node] : topology.RightChildren[node];
        }
        return node;
    }
}
