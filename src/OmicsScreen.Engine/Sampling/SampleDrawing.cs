namespace OmicsScreen.Engine.Sampling;

/// <summary>How the samples of one tree are drawn from the eligible training rows.</summary>
public enum SampleDrawing
{
    /// <summary>As many draws as there are eligible rows (or groups), with replacement (Breiman 2001).</summary>
    Bootstrap,
    /// <summary>
    /// A fraction of the rows (or groups) without replacement; avoids the bias of bootstrap
    /// importance towards features with many cut points (Strobl et al. 2007, BMC Bioinformatics 8:25).
    /// </summary>
    Subsample,
}
