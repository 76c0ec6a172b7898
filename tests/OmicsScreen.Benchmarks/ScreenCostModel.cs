using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Counts the forests a default screen grows on a panel of a given shape, with their training
/// rows and columns, and prices them with a <see cref="ForestCostModel"/>.
/// </summary>
/// <remarks>
/// From ScreenRunner, RepeatScreen, PanelSizeEstimator and ScreenSettings:
/// reference forest: all n rows, p columns.
/// each of 2 x pairs repeats: a forest on the half (n/2 rows, p columns) with its out-of-bag
/// permutation importance, and the corrected-importance forest on the same half with p real
/// columns, p permuted copies and d decoys (d = p up to the automatic decoy limit, else 0), trying
/// floor(sqrt(2p + d)) per split.
/// each of folds x fold repeats outer folds (m = n (folds - 1) / folds training rows): an inner
/// screen of 2 x inner pairs repeats like the above on m/2 rows without decoys, then for every
/// panel size k on the grid two forests (selection-aware and optimistic order) on m rows and k columns.
/// Binning and the univariate statistics run once per node; they are priced separately. Each
/// corrected-importance forest first builds its permuted copy (and decoy) columns on one thread.
/// </remarks>
public static class ScreenCostModel
{
    public static IReadOnlyList<ScreenWorkUnit> Units(int sampleCount, int featureCount, ScreenOptions options,
        ForestCostModel cost)
    {
        int trees = options.TreesPerForest;
        int decoys = Decoys(featureCount, options);
        var units = new List<ScreenWorkUnit>
        {
            new("reference", 1, cost.Train(trees, sampleCount, featureCount), 0),
        };
        double half = sampleCount / 2.0;
        double repeatCost = RepeatCost(cost, trees, half, featureCount, decoys);
        // Permuted copies and decoys are copied over all n rows of the matrix, whatever rows the forest uses.
        double repeatSerial = cost.PermutedCopies.At(sampleCount, featureCount + (double)decoys);
        for (int r = 0; r < 2 * options.HalfSamplePairs; r++) units.Add(new("repeat", 2, repeatCost, repeatSerial));

        if (options.CurveFolds > 0)
        {
            double foldRows = sampleCount * (options.CurveFolds - 1.0) / options.CurveFolds;
            int innerRepeats = 2 * options.CurveInnerPairs;
            double foldCost = innerRepeats * RepeatCost(cost, trees, foldRows / 2, featureCount, 0);
            var sizes = PanelSizeEstimator.SizeGrid(Math.Min(options.CurveMaxPanelSize, featureCount));
            foreach (int size in sizes) foldCost += 2 * cost.Train(trees, foldRows, size);
            int foldForests = 2 * innerRepeats + 2 * sizes.Length;
            double foldSerial = innerRepeats * cost.PermutedCopies.At(sampleCount, featureCount);
            for (int f = 0; f < options.CurveFolds * options.CurveFoldRepeats; f++)
                units.Add(new("curve fold", foldForests, foldCost, foldSerial));
        }
        return units;
    }

    /// <summary>Decoys of the run, as ScreenSettings resolves them.</summary>
    public static int Decoys(int featureCount, ScreenOptions options) => ScreenSettings.DecoyCountFor(options, featureCount);

    /// <summary>One half-sample repeat: the plain forest with its permutation importance, and the corrected-importance forest.</summary>
    private static double RepeatCost(ForestCostModel cost, int trees, double rows, int featureCount, int decoys) =>
        cost.Train(trees, rows, featureCount) + cost.Permutation(trees, rows, featureCount)
        + cost.Train(trees, rows, 2.0 * featureCount + decoys);

    /// <summary>
    /// The largest wall time of any node when the units are dealt to nodes longest first, each to
    /// the least loaded node (Graham 1969, within 4/3 of the best split).
    /// </summary>
    public static double LargestNodeLoad(IReadOnlyList<ScreenWorkUnit> units, int nodeCount, int cores)
    {
        var costs = new double[units.Count];
        for (int i = 0; i < costs.Length; i++) costs[i] = units[i].WallSeconds(cores);
        Array.Sort(costs);
        var loads = new double[nodeCount];
        for (int i = costs.Length - 1; i >= 0; i--)
        {
            int least = 0;
            for (int node = 1; node < nodeCount; node++) if (loads[node] < loads[least]) least = node;
            loads[least] += costs[i];
        }
        double largest = 0;
        foreach (double load in loads) largest = Math.Max(largest, load);
        return largest;
    }
}
