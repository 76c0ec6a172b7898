using System.Globalization;
using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Reporting.Univariate;

/// <summary>
/// Writes a <see cref="UnivariateTable"/> as TSV: one row per feature and contrast, over all
/// samples or within each cohort (then with a cohort column).
/// </summary>
/// <remarks>
/// Columns: feature, [cohort], contrast, reference, direction, contrast_samples, reference_samples,
/// median_&lt;contrast&gt;, median_&lt;reference&gt;, median_note, log2_median_ratio, auc, auc_se,
/// auc_low&lt;level&gt;, auc_high&lt;level&gt;, rank_test_u, rank_test_p, rank_test_q, missing_pct,
/// below_detection_pct. For a two-class outcome the median columns are named after the two classes
/// (the table has one contrast, so the names hold for every row); for more classes each row is one
/// class against the rest, and they are median_contrast and median_rest. Medians keep 6
/// significant digits (raw intensities span many orders of magnitude); AUCs and their interval 4
/// decimals; p and q 4 significant digits (small p-values keep their exponent); U is exact;
/// percentages 2 decimals. A median that is missing or below detection is "NA", and median_note
/// says which and why.
/// </remarks>
public static class UnivariateTableWriter
{
    /// <summary>Writes the rows over all samples; returns the number of data rows.</summary>
    public static int WriteAllSamples(TextWriter writer, UnivariateTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        return new TsvTableWriter<MarkerStatistics>(Columns(table, includeCohort: false)).Write(writer, table.AllSamples);
    }

    /// <summary>Writes the rows within each cohort (cohort-major); a table without cohorts gives only the header.</summary>
    public static int WritePerCohort(TextWriter writer, UnivariateTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        return new TsvTableWriter<MarkerStatistics>(Columns(table, includeCohort: true)).Write(writer, table.PerCohort);
    }

    /// <summary>The column definitions, for callers that write a selection of rows (for example the shortlist only).</summary>
    public static IReadOnlyList<TsvColumn<MarkerStatistics>> Columns(UnivariateTable table, bool includeCohort)
    {
        ArgumentNullException.ThrowIfNull(table);
        var (contrastMedian, referenceMedian) = MedianHeaders(table);
        string level = IntervalLevelText(table);
        var columns = new List<TsvColumn<MarkerStatistics>> { TsvColumn<MarkerStatistics>.Text("feature", static row => row.Feature) };
        if (includeCohort) columns.Add(TsvColumn<MarkerStatistics>.Text("cohort", static row => row.Cohort));
        columns.AddRange(
        [
            TsvColumn<MarkerStatistics>.Text("contrast", static row => row.ContrastClass),
            TsvColumn<MarkerStatistics>.Text("reference", static row => row.ReferenceGroup),
            TsvColumn<MarkerStatistics>.Text("direction", static row => DirectionText(row.Direction)),
            TsvColumn<MarkerStatistics>.Integer("contrast_samples", static row => row.ClassSampleCount),
            TsvColumn<MarkerStatistics>.Integer("reference_samples", static row => row.RestSampleCount),
            TsvColumn<MarkerStatistics>.Number(contrastMedian, static row => row.ClassMedian, NumberFormat.Significant(6)),
            TsvColumn<MarkerStatistics>.Number(referenceMedian, static row => row.RestMedian, NumberFormat.Significant(6)),
            TsvColumn<MarkerStatistics>.Text("median_note", MedianNote),
            TsvColumn<MarkerStatistics>.Number("log2_median_ratio", static row => row.Log2MedianRatio, NumberFormat.Fixed(4)),
            TsvColumn<MarkerStatistics>.Number("auc", static row => row.Auc, NumberFormat.Fixed(4)),
            TsvColumn<MarkerStatistics>.Number("auc_se", static row => row.AucStandardError, NumberFormat.Fixed(4)),
            TsvColumn<MarkerStatistics>.Number("auc_low" + level, static row => row.AucInterval.Lower, NumberFormat.Fixed(4)),
            TsvColumn<MarkerStatistics>.Number("auc_high" + level, static row => row.AucInterval.Upper, NumberFormat.Fixed(4)),
            TsvColumn<MarkerStatistics>.Number("rank_test_u", static row => row.U, NumberFormat.RoundTrip),
            TsvColumn<MarkerStatistics>.Number("rank_test_p", static row => row.PValue, NumberFormat.Significant(4)),
            TsvColumn<MarkerStatistics>.Number("rank_test_q", static row => row.QValue, NumberFormat.Significant(4)),
            TsvColumn<MarkerStatistics>.Number("missing_pct", static row => row.MissingPercent, NumberFormat.Fixed(2)),
            TsvColumn<MarkerStatistics>.Number("below_detection_pct", static row => row.BelowDetectionPercent, NumberFormat.Fixed(2)),
        ]);
        return columns;
    }

    /// <summary>Why a median or the log2 ratio is missing; empty when both medians and the ratio are present.</summary>
    internal static string MedianNote(MarkerStatistics row)
    {
        if (row.ClassMedianBelowDetection && row.RestMedianBelowDetection) return "both_medians_below_detection";
        if (row.ClassMedianBelowDetection) return "contrast_median_below_detection";
        if (row.RestMedianBelowDetection) return "reference_median_below_detection";
        return row.RatioUnavailable switch
        {
            RatioUnavailableReason.NoValues => "no_values",
            RatioUnavailableReason.NonPositiveMedian => "non_positive_median",
            RatioUnavailableReason.MedianBelowDetection => "median_below_detection",
            _ => string.Empty,
        };
    }

    private static string DirectionText(EffectDirection direction) => direction switch
    {
        EffectDirection.Higher => "higher",
        EffectDirection.Lower => "lower",
        EffectDirection.NoDifference => "no_difference",
        _ => "undetermined",
    };

    private static (string Contrast, string Reference) MedianHeaders(UnivariateTable table)
    {
        var rows = table.AllSamples.Count > 0 ? table.AllSamples : table.PerCohort;
        bool twoClass = table.Contrasts.Count == 1 && rows.Count > 0 && rows[0].ReferenceGroup != UnivariateScreen.RestGroupName;
        return twoClass
            ? ("median_" + table.Contrasts[0], "median_" + rows[0].ReferenceGroup)
            : ("median_contrast", "median_rest");
    }

    // "95" for a 95% interval; a non-integer level keeps its decimals ("97.5").
    private static string IntervalLevelText(UnivariateTable table)
    {
        var rows = table.AllSamples.Count > 0 ? table.AllSamples : table.PerCohort;
        double level = rows.Count > 0 ? rows[0].AucInterval.Level : UnivariateOptions.Default.ConfidenceLevel;
        return Math.Round(level * 100, 6).ToString("0.######", CultureInfo.InvariantCulture);
    }
}
