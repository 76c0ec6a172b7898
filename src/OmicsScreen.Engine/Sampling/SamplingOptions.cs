using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Sampling;

/// <summary>How each tree chooses its in-bag samples; out-of-bag samples are the eligible rows left out.</summary>
public sealed record SamplingOptions
{
    public SampleDrawing Drawing { get; init; } = SampleDrawing.Bootstrap;

    /// <summary>Fraction of rows (or groups) drawn by <see cref="SampleDrawing.Subsample"/>; 0.632 matches the expected distinct share of a bootstrap.</summary>
    public double SubsampleFraction { get; init; } = 0.632;

    /// <summary>
    /// Draw the same number of samples from every class: the size of the smallest class, with
    /// replacement for bootstrap, or that size times the fraction without replacement for subsampling
    /// (balanced random forest, Chen, Liaw &amp; Breiman 2004, UC Berkeley tech. report 666).
    /// </summary>
    public bool ClassBalanced { get; init; }

    /// <summary>
    /// When set, whole groups (subjects) are drawn and left out together, so replicates of one
    /// subject never sit on both sides of the in-bag/out-of-bag line (Karpievitch et al. 2009,
    /// PLoS ONE 4(9):e7087).
    /// </summary>
    public SampleGrouping? Groups { get; init; }

    public static SamplingOptions Default { get; } = new();

    /// <summary>Throws when the options contradict each other or do not fit a panel of sampleCount rows.</summary>
    public void Validate(int sampleCount)
    {
        if (Drawing == SampleDrawing.Subsample && !(SubsampleFraction > 0 && SubsampleFraction <= 1))
            throw new ArgumentException("The subsample fraction must lie in (0, 1].");
        if (Groups is not null && ClassBalanced)
            throw new ArgumentException("Class-balanced drawing of whole groups is not supported.");
        if (Groups is not null && Groups.SampleLevels.Length != sampleCount)
            throw new ArgumentException("The grouping must have one level per sample.");
    }
}
