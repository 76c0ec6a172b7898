using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Covariates;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// covariate_association.tsv: one row per shortlisted marker and covariate with the association
/// (Spearman's rho or Kruskal-Wallis epsilon-squared, p, BH q over all pairs), the marker's
/// permutation importance marginal and conditional on the covariate (in the outcome kind's loss,
/// named in importance_loss), and whether it tracks it.
/// </summary>
public static class CovariateTrackingTables
{
    public const string FileName = "covariate_association.tsv";

    private sealed record Row(MarkerCovariateAssociation Association, MarkerTracking Marker, int Covariate, bool Tracks);

    public static int Write(TextWriter writer, CovariateTracking tracking)
    {
        var rows = new List<Row>();
        foreach (var association in tracking.Associations)
        {
            var marker = tracking.Markers.First(m => m.Feature == association.Feature);
            int covariate = IndexOf(tracking.Covariates, association.Covariate);
            rows.Add(new Row(association, marker, covariate, marker.Tracks.Contains(association.Covariate)));
        }
        var columns = new List<TsvColumn<Row>>
        {
            TsvColumn<Row>.Text("feature", r => r.Association.Marker),
            TsvColumn<Row>.Text("covariate", r => r.Association.Covariate),
            TsvColumn<Row>.Text("test", r => r.Association.Test),
            TsvColumn<Row>.Number("effect", r => r.Association.Effect, NumberFormat.Fixed(4)),
            TsvColumn<Row>.Number("p_value", r => r.Association.PValue, NumberFormat.Significant(3)),
            TsvColumn<Row>.Number("q_value", r => r.Association.QValue, NumberFormat.Significant(3)),
            TsvColumn<Row>.Number("marginal_importance", r => r.Marker.Marginal, NumberFormat.Significant(4)),
            TsvColumn<Row>.Number("conditional_importance", r => r.Marker.Conditional[r.Covariate], NumberFormat.Significant(4)),
            TsvColumn<Row>.Number("decoy_marginal_threshold", _ => tracking.MarginalThreshold, NumberFormat.Significant(4)),
            TsvColumn<Row>.Number("decoy_conditional_threshold", r => tracking.ConditionalThresholds[r.Covariate], NumberFormat.Significant(4)),
            TsvColumn<Row>.Text("importance_loss", _ => tracking.Loss),
            TsvColumn<Row>.Text("tracks", r => r.Tracks ? "yes" : "no"),
        };
        return new TsvTableWriter<Row>(columns).Write(writer, rows);
    }

    private static int IndexOf(IReadOnlyList<string> names, string name)
    {
        for (int i = 0; i < names.Count; i++)
            if (string.Equals(names[i], name, StringComparison.Ordinal)) return i;
        throw new ArgumentException("The association names a covariate the tracking does not list.");
    }
}
