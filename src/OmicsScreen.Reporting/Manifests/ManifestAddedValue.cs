using OmicsScreen.Screening.Covariates;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// What the panel adds over the clinical covariates (the manifest's and `screen --json`'s entry;
/// added_value.tsv has the same numbers): pooled out-of-fold scores of the covariates alone, the
/// panel alone and both, and the gain with its paired interval; a value that does not exist is null.
/// </summary>
public sealed record ManifestAddedValue
{
    /// <summary>auc, r_squared or concordance: the panel-size curve's score.</summary>
    public required string Metric { get; init; }
    public required IReadOnlyList<string> Covariates { get; init; }
    public double? CovariatesAlone { get; init; }
    public double? PanelAlone { get; init; }
    public double? CovariatesAndPanel { get; init; }
    public double? Gain { get; init; }
    public double? GainLow95 { get; init; }
    public double? GainHigh95 { get; init; }
    public double? GainP { get; init; }

    /// <summary>delong (DeLong et al. 1988, paired) or bootstrap (paired percentile bootstrap over samples).</summary>
    public required string IntervalMethod { get; init; }
    public required int Samples { get; init; }
    public required int OuterFolds { get; init; }
    public required int FoldRepeats { get; init; }
    public required int FoldsWithoutPanel { get; init; }

    public static ManifestAddedValue Of(AddedValue value) => new()
    {
        Metric = value.Metric,
        Covariates = value.Covariates,
        CovariatesAlone = NullWhenNaN(value.CovariatesAlone),
        PanelAlone = NullWhenNaN(value.PanelAlone),
        CovariatesAndPanel = NullWhenNaN(value.CovariatesAndPanel),
        Gain = NullWhenNaN(value.Gain),
        GainLow95 = NullWhenNaN(value.GainInterval.Lower),
        GainHigh95 = NullWhenNaN(value.GainInterval.Upper),
        GainP = NullWhenNaN(value.GainPValue),
        IntervalMethod = value.IntervalMethod,
        Samples = value.SampleCount,
        OuterFolds = value.FoldCount,
        FoldRepeats = value.FoldRepeats,
        FoldsWithoutPanel = value.FoldsWithoutPanel,
    };

    private static double? NullWhenNaN(double value) => double.IsNaN(value) ? null : value;
}
