using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Groups shortlisted markers that stand in for one another: two markers are linked when their
/// Spearman |rho| reaches the threshold, and a group is a connected set of links (single
/// linkage), so a lab sees which assays are near-duplicates.
/// </summary>
internal static class RedundancyGroups
{
    /// <summary>
    /// Group number (1-based, numbered in shortlist order) of each shortlisted feature. Missing cells
    /// are left out pairwise; below-detection cells rank below every measured value.
    /// </summary>
    public static int[] Assign(FeatureMatrix matrix, IReadOnlyList<int> shortlisted, double threshold, out double[,] correlations)
    {
        int count = shortlisted.Count;
        var values = new double[count][];
        for (int i = 0; i < count; i++) values[i] = RankableValues(matrix, shortlisted[i]);
        correlations = new double[count, count];
        var parent = new int[count];
        for (int i = 0; i < count; i++) parent[i] = i;
        for (int i = 0; i < count; i++)
        {
            correlations[i, i] = 1;
            for (int j = i + 1; j < count; j++)
            {
                double rho = Correlation.Spearman(values[i], values[j]);
                correlations[i, j] = correlations[j, i] = rho;
                if (Math.Abs(rho) >= threshold) Union(parent, i, j);
            }
        }
        var groupOfRoot = new Dictionary<int, int>();
        var groups = new int[count];
        for (int i = 0; i < count; i++)
        {
            int root = Find(parent, i);
            if (!groupOfRoot.TryGetValue(root, out int group)) groupOfRoot[root] = group = groupOfRoot.Count + 1;
            groups[i] = group;
        }
        return groups;
    }

    private static double[] RankableValues(FeatureMatrix matrix, int feature)
    {
        var column = matrix.Column(feature);
        var values = new double[matrix.SampleCount];
        for (int s = 0; s < values.Length; s++)
        {
            values[s] = matrix.State(feature, s) switch
            {
                CellState.Missing => double.NaN,
                CellState.BelowDetection => double.NegativeInfinity,
                _ => column[s],
            };
        }
        return values;
    }

    private static int Find(int[] parent, int i)
    {
        while (parent[i] != i) i = parent[i] = parent[parent[i]];
        return i;
    }

    private static void Union(int[] parent, int a, int b)
    {
        int ra = Find(parent, a), rb = Find(parent, b);
        if (ra == rb) return;
        // The lower index becomes the root, so group numbers follow shortlist order.
        if (ra < rb) parent[rb] = ra; else parent[ra] = rb;
    }
}
