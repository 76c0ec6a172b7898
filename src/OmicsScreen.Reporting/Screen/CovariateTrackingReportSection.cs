using System.Globalization;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Covariates;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The report's "Markers that track a covariate" section: which shortlisted markers lose their
/// importance once compared only among samples of similar covariate values, with the association
/// and importance figures of covariate_association.tsv.
/// </summary>
internal static class CovariateTrackingReportSection
{
    public const string Heading = "Markers that track a covariate";

    public static void Write(HtmlBuilder html, CovariateTracking tracking)
    {
        html.BeginSection(Heading);
        html.Paragraph(Summary(tracking));
        var table = new HtmlTable("Shortlisted markers against each covariate",
        [
            new HtmlTableColumn("Feature"),
            new HtmlTableColumn("Covariate"),
            new HtmlTableColumn("Association"),
            new HtmlTableColumn("q", ColumnAlignment.Numeric),
            new HtmlTableColumn("Importance", ColumnAlignment.Numeric),
            new HtmlTableColumn("Within covariate strata", ColumnAlignment.Numeric),
            new HtmlTableColumn("Tracks it"),
        ]);
        foreach (var association in tracking.Associations)
        {
            var marker = tracking.Markers.First(m => m.Feature == association.Feature);
            int c = 0;
            while (c < tracking.Covariates.Count && tracking.Covariates[c] != association.Covariate) c++;
            table.AddRow(association.Marker, association.Covariate,
                association.Test == "spearman" ? "rho " + ReportNumber.Fixed(association.Effect, 2) : "ε² " + ReportNumber.Fixed(association.Effect, 3),
                ReportNumber.Significant(association.QValue, 2), ReportNumber.Significant(marker.Marginal, 3),
                ReportNumber.Significant(marker.Conditional[c], 3), marker.Tracks.Contains(association.Covariate) ? "yes" : "no");
        }
        html.Table(table);
        html.EndSection();
    }

    public static string Summary(CovariateTracking tracking)
    {
        var tracked = tracking.Markers.Where(m => m.Tracks.Count > 0).ToList();
        string verdict = tracked.Count == 0
            ? Invariant($"None of the {tracking.Markers.Count} shortlisted markers only tracks {AddedValueReportSection.CovariateList(tracking.Covariates)}.")
            : Invariant($"{tracked.Count} of the {tracking.Markers.Count} shortlisted markers only track a covariate: ")
              + string.Join("; ", tracked.Select(m => m.Marker + " tracks " + AddedValueReportSection.CovariateList(m.Tracks))) + ". "
              + "Their link to the outcome runs through the covariate: among samples of similar covariate values they predict nothing beyond it.";
        return verdict + " "
            + "A marker tracks a covariate when it is associated with it (q at most 0.10) and its importance (out-of-bag permutation importance, " + LossWords(tracking.Loss) + ", in a forest on the shortlist and as many permuted copies as decoys) "
            + "beats the decoys' but, when its values are permuted only among samples of similar covariate values (Strobl et al. 2008; a categorical covariate's levels, a numeric covariate cut at its quantiles into groups of about 8 samples), "
            + "falls to the decoys' level, to within 1.645 standard errors of 0, or below a fifth of its importance. "
            + "Association is Spearman's rho for a numeric covariate and Kruskal-Wallis epsilon-squared for a categorical one, with Benjamini-Hochberg q over all marker-covariate pairs; "
            + "an association alone does not make a marker a proxy.";
    }

    /// <summary>The importance's loss in words, as the screen's permutation importance of the outcome kind measures it.</summary>
    public static string LossWords(string loss) => loss switch
    {
        "squared_error_rise" => "rise in squared error",
        "concordance_drop" => "drop in Harrell's C",
        _ => "Brier score increase",
    };

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
