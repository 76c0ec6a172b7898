using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>
/// Redundancy groups on hand-made columns whose Spearman rho is worked by hand with Spearman's
/// (1904) formula for untied ranks, rho = 1 - 6 sum d^2 / (n (n^2 - 1)), n = 5 (n(n^2-1) = 120).
/// </summary>
public sealed class RedundancyGroupsTests
{
    private static readonly float[] A = [1, 2, 3, 4, 5];
    private static readonly float[] B = [2, 1, 4, 3, 5];      // with A: sum d^2 = 4, rho = 1 - 24/120 = 0.8
    private static readonly float[] C = [10, 8, 6, 4, 2];     // with A: -1; with B: -0.8
    private static readonly float[] D = [3, 5, 1, 2, 4];      // with A: sum d^2 = 22, rho = -0.1; with B: -0.4; with C: 0.1
    private static readonly float[] F = [1, 2, 3, 5, 4];      // with A: sum d^2 = 2, rho = 0.9; with B: sum d^2 = 8, rho = 0.6

    private static FeatureMatrix Matrix(params (string Name, float[] Values, CellState[]? States)[] features) =>
        new(features.Select(f => f.Name).ToArray(), ["s1", "s2", "s3", "s4", "s5"],
            features.Select(f => f.Values).ToArray(), features.Select(f => f.States).ToArray());

    private static readonly FeatureMatrix Columns = Matrix(("A", A, null), ("B", B, null), ("C", C, null), ("D", D, null), ("F", F, null));
    private const int IndexA = 0, IndexB = 1, IndexC = 2, IndexD = 3, IndexF = 4;

    [Fact]
    public void Markers_linked_by_rho_form_groups_numbered_in_shortlist_order()
    {
        // At 0.79: A-B (0.8), A-C (|-1|), B-C (|-0.8|) are linked; D links to nothing.
        var groups = RedundancyGroups.Assign(Columns, [IndexD, IndexA, IndexB, IndexC], 0.79, out var rho);
        Assert.Equal([1, 2, 2, 2], groups);
        Assert.Equal(-0.1, rho[0, 1], 12);
        Assert.Equal(0.8, rho[1, 2], 12);
        Assert.Equal(-1.0, rho[1, 3], 12);
        Assert.Equal(-0.8, rho[2, 3], 12);
        Assert.Equal(1.0, rho[2, 2]);
        Assert.Equal(rho[3, 1], rho[1, 3]);
    }

    [Fact]
    public void A_higher_threshold_splits_the_group_and_a_negative_rho_counts_by_its_size()
    {
        // At 0.9 only A-C (|-1|) remains: B stands alone.
        Assert.Equal([1, 2, 3, 2], RedundancyGroups.Assign(Columns, [IndexD, IndexA, IndexB, IndexC], 0.9, out _));
    }

    [Fact]
    public void Single_linkage_joins_markers_through_a_chain()
    {
        // F-A 0.9 and A-B 0.8 are links, F-B (0.6) is not; single linkage still puts all three together.
        Assert.Equal([1, 1, 1], RedundancyGroups.Assign(Columns, [IndexF, IndexB, IndexA], 0.79, out var rho));
        Assert.Equal(0.6, rho[0, 1], 12);
        // At 0.85 only F-A is left.
        Assert.Equal([1, 2, 2], RedundancyGroups.Assign(Columns, [IndexB, IndexF, IndexA], 0.85, out _));
    }

    [Fact]
    public void Below_detection_ranks_under_every_value_and_missing_cells_are_left_out_pairwise()
    {
        // G is A with its smallest sample below detection (its stored number is ignored): the same
        // ranks as A, rho = 1. H is B with sample 5 missing: on samples 1-4, A = 1 2 3 4 and
        // B = 2 1 4 3, sum d^2 = 4, rho = 1 - 24/(4 x 15) = 0.6.
        var matrix = Matrix(("A", A, null),
            ("G", [99, 2, 3, 4, 5], [CellState.BelowDetection, CellState.Measured, CellState.Measured, CellState.Measured, CellState.Measured]),
            ("H", [2, 1, 4, 3, -50], [CellState.Measured, CellState.Measured, CellState.Measured, CellState.Measured, CellState.Missing]));
        var groups = RedundancyGroups.Assign(matrix, [0, 1, 2], 0.95, out var rho);
        Assert.Equal(1.0, rho[0, 1], 12);
        Assert.Equal(0.6, rho[0, 2], 12);
        Assert.Equal([1, 1, 2], groups);
    }

    [Fact]
    public void An_empty_shortlist_has_no_groups()
    {
        Assert.Empty(RedundancyGroups.Assign(Columns, [], 0.8, out var rho));
        Assert.Equal((0, 0), (rho.GetLength(0), rho.GetLength(1)));
    }
}
