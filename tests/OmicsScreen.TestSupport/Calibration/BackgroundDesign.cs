namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// The features of a calibration panel before any outcome is planted: blocks that share a latent
/// factor, a cell distribution and an optional detection limit.
/// </summary>
/// <remarks>
/// Standardised value of feature f in block b: z = sqrt(rho) u_b + sqrt(1 - rho) e_f, u_b and e_f
/// standard normal (e_f Student t with 2 degrees of freedom for <see cref="CellDistribution.HeavyTailed"/>),
/// so two members of a block correlate rho on the standardised (log) scale. A feature a planted
/// design needs on its own has no latent term: z = e_f.
/// </remarks>
public sealed record BackgroundDesign
{
    public required int FeatureCount { get; init; }

    /// <summary>Features per latent block; 1 makes every feature independent.</summary>
    public int BlockSize { get; init; } = 1;

    /// <summary>rho, the correlation of two members of a block on the standardised scale.</summary>
    public double BlockCorrelation { get; init; }

    public CellDistribution Distribution { get; init; } = CellDistribution.LogNormal;

    /// <summary>
    /// The detection limit in standardised units: cells with z below it are left-censored
    /// (<see cref="OmicsScreen.Engine.Panels.CellState.BelowDetection"/>, value = the limit on the
    /// measured scale); null for no limit.
    /// </summary>
    public double? DetectionLimit { get; init; }

    public void Validate()
    {
        if (FeatureCount < 1) throw new ArgumentException("A background needs at least one feature.");
        if (BlockSize < 1) throw new ArgumentException("A block holds at least one feature.");
        if (!(BlockCorrelation >= 0 && BlockCorrelation < 1)) throw new ArgumentException("The block correlation must lie in [0, 1).");
    }
}
