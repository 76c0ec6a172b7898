namespace OmicsScreen.TestSupport.Calibration;

/// <summary>How a calibration panel turns a feature's standardised value z into the value an assay would report.</summary>
public enum CellDistribution
{
    /// <summary>mu + sigma z: intensities already on a log scale, or a protein assay's linear readout.</summary>
    Normal,

    /// <summary>exp(mu + sigma z): abundances, log-normal as most omics intensities are (common practice).</summary>
    LogNormal,

    /// <summary>
    /// mu + sigma t with t a Student t draw of 2 degrees of freedom in place of the feature's own
    /// normal noise: infinite variance, so a few samples sit far out, as with outlying runs.
    /// </summary>
    HeavyTailed,
}
