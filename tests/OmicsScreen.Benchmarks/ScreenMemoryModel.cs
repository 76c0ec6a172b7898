namespace OmicsScreen.Benchmarks;

/// <summary>
/// Resident memory of one process running a screen (or a part of one: every part holds the whole
/// matrix), added up from what it holds, with the per-item sizes calibrated on the scaling series.
/// </summary>
/// <remarks>
/// Held throughout: the raw float32 matrix (4 n p bytes), the binned codes (n p bytes), each
/// feature's bin upper bounds (4 bytes per value bin, at most min(n, 254) bins) and a fixed cost per
/// feature (names, array headers, bin objects). During a repeat: the permuted-copy and decoy codes of the
/// corrected forest (n bytes per added column, plus the per-feature cost), and up to two grown
/// forests on the half; the reference forest on all rows is kept to the end. Per thread: the
/// tree builder's buffers, 4 bytes per column and about 36 bytes per row.
/// Trees grown to purity have at most 2 x distinct in-bag rows - 1 nodes, about 1.26 x rows. The
/// node count depends on how well the classes separate, and the simulated panels separate well,
/// so the estimate uses that upper bound rather than their node counts.
/// </remarks>
public sealed record ScreenMemoryModel(double RuntimeBytes, double BytesPerFeature, double BytesPerTreeNode)
{
    /// <summary>Nodes per tree grown to purity on the given rows: 2 x 0.632 x rows (distinct draws of a bootstrap, Efron 1983).</summary>
    public static double PureTreeNodes(double rows) => 2 * (1 - Math.Exp(-1)) * rows;

    /// <summary>Raw matrix, codes, bin bounds and per-feature cost of a panel.</summary>
    public double DataBytes(double samples, double features) =>
        features * (5 * samples + 4 * Math.Min(samples, 254) + BytesPerFeature);

    /// <summary>The parts of a screen process's peak: the panel, the corrected forest's extra columns, forests, thread buffers.</summary>
    public IReadOnlyList<MemoryItem> ScreenPeak(int samples, int features, int decoys, int trees, int threads)
    {
        double half = samples / 2.0;
        double added = features + (double)decoys;
        return
        [
            new("runtime", RuntimeBytes),
            new("raw float32 matrix", 4.0 * samples * features),
            new("binned codes", (double)samples * features),
            new("bin bounds and per-feature cost", features * (4 * Math.Min(samples, 254) + BytesPerFeature)),
            new("permuted-copy and decoy codes", added * (samples + BytesPerFeature)),
            new("reference forest (all rows)", trees * PureTreeNodes(samples) * BytesPerTreeNode),
            new("two forests on a half", 2.0 * trees * PureTreeNodes(half) * BytesPerTreeNode),
            new("thread buffers", threads * (4 * (features + added) + 36.0 * samples)),
        ];
    }
}
