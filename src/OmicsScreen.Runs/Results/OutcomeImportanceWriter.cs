using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Tables;

namespace OmicsScreen.Runs.Results;

/// <summary>
/// Writes one regression or survival forest's importances per feature as a TSV, most important
/// first by impurity importance: the mean variance decrease (measured) or log-rank statistic
/// (follow-up) per tree with its share of the total, and the out-of-bag permutation importance
/// (rise in squared error, or drop in Harrell's C) with its standard error over trees.
/// </summary>
public static class OutcomeImportanceWriter
{
    /// <summary>The header of a measured outcome's file; how an earlier one is recognised before it is replaced.</summary>
    public const string MeasuredHeaderLine = "rank\tfeature\tmean_variance_decrease\tshare_of_total\tpermutation_mse_rise\tpermutation_se\n";

    /// <summary>The header of a time-to-event outcome's file.</summary>
    public const string FollowUpHeaderLine = "rank\tfeature\tmean_log_rank_statistic\tshare_of_total\tpermutation_concordance_drop\tpermutation_se\n";

    private sealed record Row(int Rank, string Feature, double Impurity, double Share, double Permutation, double PermutationSe);

    public static void Write(TextWriter writer, OutcomeKind kind, IReadOnlyList<string> featureNames, int[] ranked,
        double[] impurity, double[] share, double[] permutation, double[] permutationStandardError)
    {
        bool measured = kind == OutcomeKind.Measured;
        var table = new TsvTableWriter<Row>(
        [
            TsvColumn<Row>.Integer("rank", r => r.Rank),
            TsvColumn<Row>.Text("feature", r => r.Feature),
            TsvColumn<Row>.Number(measured ? "mean_variance_decrease" : "mean_log_rank_statistic", r => r.Impurity, NumberFormat.Significant(6)),
            TsvColumn<Row>.Number("share_of_total", r => r.Share, NumberFormat.Significant(6)),
            TsvColumn<Row>.Number(measured ? "permutation_mse_rise" : "permutation_concordance_drop", r => r.Permutation, NumberFormat.Significant(6)),
            TsvColumn<Row>.Number("permutation_se", r => r.PermutationSe, NumberFormat.Significant(6)),
        ]);
        table.Write(writer, ranked.Select((f, i) => new Row(i + 1, featureNames[f], impurity[f], share[f], permutation[f], permutationStandardError[f])));
    }
}
