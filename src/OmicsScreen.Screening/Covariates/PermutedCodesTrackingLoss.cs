using OmicsScreen.Screening.Importance;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// A tracking loss whose scorer reads the out-of-bag rows' codes of the permuted feature from a
/// buffer: the permutation importance's own permutation (<see cref="PermutedCodes"/>) for the
/// marginal rise, the caller's donors for the within-strata one (measured and follow-up outcomes).
/// </summary>
internal abstract class PermutedCodesTrackingLoss : TrackingTreeLoss
{
    private byte[] _codes = [];

    /// <summary>The loaded tree's loss increase when its out-of-bag rows read <paramref name="codes"/> for the feature.</summary>
    protected abstract double RiseWith(int feature, ReadOnlySpan<byte> codes);

    /// <summary>Grows the codes buffer to the loaded tree's out-of-bag rows; called by <see cref="TrackingTreeLoss.Begin"/>.</summary>
    protected void EnsureCapacity(int rows)
    {
        if (_codes.Length < rows) _codes = new byte[rows];
    }

    public sealed override double MarginalRise(int feature)
    {
        var codes = _codes.AsSpan(0, Rows.Length);
        PermutedCodes.Fill(Matrix, feature, Rows, TreeSeed, codes);
        return RiseWith(feature, codes);
    }

    public sealed override double RiseWithDonors(int feature, ReadOnlySpan<int> donors)
    {
        var rows = Rows;
        var codes = _codes.AsSpan(0, rows.Length);
        var source = Matrix.Codes(feature);
        for (int i = 0; i < codes.Length; i++) codes[i] = source[rows[donors[i]]];
        return RiseWith(feature, codes);
    }
}
