using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Effects;

/// <summary>
/// How often two columns split directly one below the other on a forest's root-to-leaf paths,
/// against what their own split counts predict: over every parent-child pair of split nodes, the
/// count of pairs {parent on a, child on b} or {parent on b, child on a}, set against
/// (parents on a x children on b + parents on b x children on a) / all parent-child pairs.
/// </summary>
/// <remarks>
/// Why adjacent splits: a greedy tree finds an interaction one marker at a time. A split on a
/// makes b informative in both children when the two act together (an XOR or product pattern,
/// where b alone separates nothing), so b then wins the next split whenever it is among the
/// candidates; a marker acting on its own is as likely below a as anywhere else. Reading whole
/// paths instead drowns this in the long paths of fully grown trees. <see cref="Score"/> is the
/// Poisson deviate (observed - expected) / sqrt(expected), so pairs of rarely split columns
/// score near 0 rather than by a noisy ratio. (Wright, Ziegler &amp; König 2016, BMC
/// Bioinformatics 17:145, show importance alone misses such pairs; from memory.)
/// </remarks>
public sealed class AdjacentSplits
{
    private readonly double[] _parents;
    private readonly double[] _children;
    private readonly double[] _pairs;
    private readonly double _edges;

    private AdjacentSplits(double[] parents, double[] children, double[] pairs, double edges)
    {
        _parents = parents;
        _children = children;
        _pairs = pairs;
        _edges = edges;
    }

    /// <summary>How many columns are tracked; indices are positions in the tracked list.</summary>
    public int TrackedCount => _parents.Length;

    /// <summary>Parent-child pairs of split nodes in the whole forest.</summary>
    public double EdgeCount => _edges;

    /// <summary>Split nodes on tracked column a that have a split node as child, counted once per such child.</summary>
    public double ParentCount(int a) => _parents[a];

    /// <summary>Split nodes on tracked column b whose parent is a split node (every non-root split).</summary>
    public double ChildCount(int b) => _children[b];

    /// <summary>Parent-child pairs with the parent on a and the child on b.</summary>
    public double Directed(int a, int b) => _pairs[a * _parents.Length + b];

    /// <summary>Pairs of adjacent splits on a and b, in either order.</summary>
    public double Observed(int a, int b) => a == b ? Directed(a, a) : Directed(a, b) + Directed(b, a);

    /// <summary>What the two columns' own parent and child counts predict for <see cref="Observed"/>.</summary>
    public double Expected(int a, int b) =>
        _edges == 0 ? 0 : a == b ? _parents[a] * _children[a] / _edges : (_parents[a] * _children[b] + _parents[b] * _children[a]) / _edges;

    /// <summary>(observed - expected) / sqrt(expected); 0 when nothing is expected.</summary>
    public double Score(int a, int b)
    {
        double expected = Expected(a, b);
        return expected > 0 ? (Observed(a, b) - expected) / Math.Sqrt(expected) : 0;
    }

    /// <param name="trees">The forest's trees.</param>
    /// <param name="trackedColumns">Matrix columns to track, each once.</param>
    /// <param name="columnCount">Columns of the matrix the trees were grown on.</param>
    /// <param name="maxParentDepth">Only parents at depth below this count (the root is depth 0).</param>
    public static AdjacentSplits Measure(IReadOnlyList<SplitTopology> trees, IReadOnlyList<int> trackedColumns, int columnCount,
        int maxParentDepth = int.MaxValue)
    {
        ArgumentNullException.ThrowIfNull(trees);
        ArgumentNullException.ThrowIfNull(trackedColumns);
        int tracked = trackedColumns.Count;
        var local = new int[columnCount];
        Array.Fill(local, -1);
        for (int i = 0; i < tracked; i++)
        {
            if (local[trackedColumns[i]] >= 0) throw new ArgumentException("A column is tracked twice.");
            local[trackedColumns[i]] = i;
        }
        var parents = new double[tracked];
        var children = new double[tracked];
        var pairs = new double[tracked * tracked];
        double edges = 0;
        // Counts are integers summed in tree and node order: the result does not depend on threads.
        foreach (var tree in trees)
        {
            var features = tree.Features;
            var left = tree.LeftChildren;
            var right = tree.RightChildren;
            var depth = new int[features.Length];
            for (int node = 0; node < features.Length; node++)
            {
                if (features[node] < 0) continue;
                depth[left[node]] = depth[right[node]] = depth[node] + 1;
                if (depth[node] >= maxParentDepth) continue;
                int parent = local[features[node]];
                for (int side = 0; side < 2; side++)
                {
                    int child = side == 0 ? left[node] : right[node];
                    if (features[child] < 0) continue;
                    edges++;
                    int below = local[features[child]];
                    if (parent >= 0) parents[parent]++;
                    if (below >= 0) children[below]++;
                    if (parent >= 0 && below >= 0) pairs[parent * tracked + below]++;
                }
            }
        }
        return new AdjacentSplits(parents, children, pairs, edges);
    }
}
