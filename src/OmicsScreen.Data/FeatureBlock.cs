using System.Globalization;

namespace OmicsScreen.Data;

/// <summary>
/// Block <see cref="Index"/> (1-based) of <see cref="Count"/> contiguous, nearly equal blocks of a
/// matrix file's feature columns: how a panel too wide for one node's memory is screened a slice
/// at a time, each node reading only its own columns.
/// </summary>
public readonly record struct FeatureBlock(int Index, int Count)
{
    /// <summary>The half-open range [first, end) of feature positions (in file order) this block keeps out of <paramref name="featureCount"/>.</summary>
    public (int First, int End) Range(int featureCount) =>
        ((int)((long)(Index - 1) * featureCount / Count), (int)((long)Index * featureCount / Count));

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");
}
