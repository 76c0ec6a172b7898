using OmicsScreen.Engine.Binning;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// The tracking forest of one outcome kind, scored one tree at a time with the kind's own
/// out-of-bag permutation loss, read through the permutation importance's own scorer: the Brier
/// score increase for classes, the rise in squared error for a measured outcome, the drop in
/// Harrell's C for follow-up. Each feature is scored twice per tree: with the importance's own
/// permutation of the out-of-bag rows (marginal), and with a permutation the caller draws within
/// a covariate's strata (conditional, Strobl et al. 2008, BMC Bioinformatics 9:307).
/// </summary>
internal abstract class TrackingTreeLoss
{
    /// <summary>Name of the loss in tables and JSON.</summary>
    public abstract string LossName { get; }

    public abstract BinnedMatrix Matrix { get; }

    public abstract int TreeCount { get; }

    /// <summary>Loads tree t and scores its baseline; false when it has no out-of-bag row to score (it then adds 0).</summary>
    public abstract bool Begin(int tree);

    /// <summary>The loaded tree's out-of-bag rows; donor positions index into them.</summary>
    public abstract ReadOnlySpan<int> Rows { get; }

    /// <summary>The features the loaded tree splits on; every other feature's loss is exactly 0.</summary>
    public abstract int[] SplitFeatures { get; }

    /// <summary>The seed of the loaded tree's permutations, as the permutation importance derives it.</summary>
    public abstract ulong TreeSeed { get; }

    /// <summary>Loss increase with the feature permuted among the out-of-bag rows by the permutation importance's own stream.</summary>
    public abstract double MarginalRise(int feature);

    /// <summary>Loss increase when out-of-bag row i reads the feature's code of row <paramref name="donors"/>[i] (positions in <see cref="Rows"/>).</summary>
    public abstract double RiseWithDonors(int feature, ReadOnlySpan<int> donors);
}
