using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Reporting.Univariate;

/// <summary>
/// Writes the per-marker statistics of a measured outcome or of follow-up as TSV, one row per
/// feature in panel order (marker_statistics.tsv of a screen of that kind).
/// </summary>
/// <remarks>
/// Measured: feature, direction, samples, spearman_rho, rho_low95, rho_high95, p_value, q_value,
/// missing_pct, below_detection_pct. Follow-up: feature, direction, samples, events, concordance,
/// concordance_se, concordance_low95, concordance_high95, hazard_ratio_per_sd, hazard_ratio_low95,
/// hazard_ratio_high95, cox_model_converged, p_value (Cox score test), q_value, missing_pct,
/// below_detection_pct. rho and C keep 4 decimals, hazard ratios 4 significant digits, p and q 4
/// significant digits, percentages 2 decimals.
/// </remarks>
public static class OutcomeMarkerTableWriter
{
    private static readonly NumberFormat Probability = NumberFormat.Significant(4);

    public static int WriteMeasured(TextWriter writer, IReadOnlyList<MeasuredOutcomeMarker> markers)
    {
        ArgumentNullException.ThrowIfNull(markers);
        var columns = new List<TsvColumn<MeasuredOutcomeMarker>>
        {
            TsvColumn<MeasuredOutcomeMarker>.Text("feature", static m => m.FeatureName),
            TsvColumn<MeasuredOutcomeMarker>.Text("direction", static m => m.Direction),
            TsvColumn<MeasuredOutcomeMarker>.Integer("samples", static m => m.Pairs),
            TsvColumn<MeasuredOutcomeMarker>.Number("spearman_rho", static m => m.Rho, NumberFormat.Fixed(4)),
            TsvColumn<MeasuredOutcomeMarker>.Number("rho_low95", static m => m.Interval.Lower, NumberFormat.Fixed(4)),
            TsvColumn<MeasuredOutcomeMarker>.Number("rho_high95", static m => m.Interval.Upper, NumberFormat.Fixed(4)),
            TsvColumn<MeasuredOutcomeMarker>.Number("p_value", static m => m.PValue, Probability),
            TsvColumn<MeasuredOutcomeMarker>.Number("q_value", static m => m.QValue, Probability),
            TsvColumn<MeasuredOutcomeMarker>.Number("missing_pct", static m => m.MissingPercent, NumberFormat.Fixed(2)),
            TsvColumn<MeasuredOutcomeMarker>.Number("below_detection_pct", static m => m.BelowDetectionPercent, NumberFormat.Fixed(2)),
        };
        return new TsvTableWriter<MeasuredOutcomeMarker>(columns).Write(writer, markers);
    }

    public static int WriteFollowUp(TextWriter writer, IReadOnlyList<FollowUpMarker> markers)
    {
        ArgumentNullException.ThrowIfNull(markers);
        var columns = new List<TsvColumn<FollowUpMarker>>
        {
            TsvColumn<FollowUpMarker>.Text("feature", static m => m.FeatureName),
            TsvColumn<FollowUpMarker>.Text("direction", static m => m.Direction),
            TsvColumn<FollowUpMarker>.Integer("samples", static m => m.Samples),
            TsvColumn<FollowUpMarker>.Integer("events", static m => m.Events),
            TsvColumn<FollowUpMarker>.Number("concordance", static m => m.Concordance.Concordance, NumberFormat.Fixed(4)),
            TsvColumn<FollowUpMarker>.Number("concordance_se", static m => m.Concordance.StandardError, NumberFormat.Fixed(4)),
            TsvColumn<FollowUpMarker>.Number("concordance_low95", static m => m.Concordance.Interval.Lower, NumberFormat.Fixed(4)),
            TsvColumn<FollowUpMarker>.Number("concordance_high95", static m => m.Concordance.Interval.Upper, NumberFormat.Fixed(4)),
            TsvColumn<FollowUpMarker>.Number("hazard_ratio_per_sd", static m => m.HazardRatioPerSd, NumberFormat.Significant(4)),
            TsvColumn<FollowUpMarker>.Number("hazard_ratio_low95", static m => m.HazardRatioInterval.Lower, NumberFormat.Significant(4)),
            TsvColumn<FollowUpMarker>.Number("hazard_ratio_high95", static m => m.HazardRatioInterval.Upper, NumberFormat.Significant(4)),
            TsvColumn<FollowUpMarker>.Text("cox_model_converged", static m => m.ModelConverged ? "yes" : "no"),
            TsvColumn<FollowUpMarker>.Number("p_value", static m => m.PValue, Probability),
            TsvColumn<FollowUpMarker>.Number("q_value", static m => m.QValue, Probability),
            TsvColumn<FollowUpMarker>.Number("missing_pct", static m => m.MissingPercent, NumberFormat.Fixed(2)),
            TsvColumn<FollowUpMarker>.Number("below_detection_pct", static m => m.BelowDetectionPercent, NumberFormat.Fixed(2)),
        };
        return new TsvTableWriter<FollowUpMarker>(columns).Write(writer, markers);
    }
}
