namespace OmicsScreen.Screening.Effects;

/// <summary>
/// How a forest's prediction moves with one marker: partial dependence (Friedman 2001) over a
/// grid of the marker's observed values, with the spread of the individual conditional
/// expectation curves (Goldstein, Kapelner, Bleich &amp; Pitkin 2015) around it.
/// </summary>
/// <param name="Feature">The marker's feature index.</param>
/// <param name="GridValues">Grid points in the marker's units, increasing: the median measured value of each grid bin.</param>
/// <param name="Average">Partial dependence at each grid point: the mean over samples of the forest's prediction with the marker set to that point.</param>
/// <param name="Lower">The 10th percentile over samples of the individual curves at each grid point.</param>
/// <param name="Upper">The 90th percentile over samples of the individual curves at each grid point.</param>
/// <param name="Individual">Individual curves, sample-major: Individual[s * grid + g].</param>
public sealed record EffectCurve(int Feature, double[] GridValues, double[] Average, double[] Lower, double[] Upper, double[] Individual)
{
    public int GridCount => GridValues.Length;

    public int SampleCount => Individual.Length / Math.Max(1, GridValues.Length);

    /// <summary>Largest minus smallest partial dependence over the grid.</summary>
    public double Range => Average.Length == 0 ? 0 : Average.Max() - Average.Min();
}
