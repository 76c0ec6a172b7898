using System.Globalization;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The report's "Cohorts" section: how strongly the samples carry their cohort, whether outcome and
/// cohort can be told apart, which markers the cohort explains, each top marker's AUC cohort by
/// cohort, how far the cohorts' own screens agree, and how the markers fare in a cohort never seen.
/// It says what the cohort tables and the console summary say, in sentences.
/// </summary>
internal static class CohortReportSection
{
    public const string Heading = "Cohorts";
    public const string ConfoundedHeading = "Outcome and cohort cannot be separated";

    public static void Write(HtmlBuilder html, ScreenResult result, CohortResult cohorts)
    {
        html.BeginSection(Heading);
        html.Paragraph(Summary(cohorts));
        html.Paragraph(Association(cohorts));
        if (cohorts.Confounded)
            html.Caution(ConfoundedHeading, cohorts.Measure == CohortEffectMeasure.Auc
            ?
            [
                Invariant($"Outcome and cohort are strongly associated (Cramér's V {cohorts.OutcomeCohortAssociation:0.00}): most samples of some classes come from some cohorts. ")
                    + "In this design no method can tell a disease marker from a marker of cohort, centre or batch; the flags below cannot settle it either.",
                "Treat every marker as unconfirmed until it is measured in cohorts where cases and controls come from the same centres and batches.",
            ]
            :
            [
                Invariant($"Outcome and cohort are strongly associated ({CohortMeasureWords.AssociationName(cohorts.Measure)} {cohorts.OutcomeCohortAssociation:0.00}): the outcome differs so much between cohorts that the cohort nearly fixes it. ")
                    + "In this design no method can tell a marker of the outcome from a marker of cohort, centre or batch; the flags below cannot settle it either.",
                "Treat every marker as unconfirmed until it is measured in cohorts whose outcomes span the same range within the same centres and batches.",
            ]);
        WriteFlags(html, result, cohorts);
        WriteForestPlots(html, result, cohorts);
        WriteConcordance(html, cohorts);
        WriteHeldOut(html, result, cohorts);
        html.EndSection();
    }

    public static string Summary(CohortResult cohorts)
    {
        string enough = EnoughText(cohorts.Measure);
        string screened = cohorts.ScreenedCohorts.Count == cohorts.Cohorts.Count
            ? "every cohort had " + enough + " for a screen of its own"
            : Invariant($"{cohorts.ScreenedCohorts.Count} of them had {enough} for a screen of their own");
        return Invariant($"Cohort column {cohorts.CohortColumn}: {cohorts.Cohorts.Count} cohorts ({string.Join(", ", cohorts.Cohorts)}); {screened}. ")
            + Invariant($"A forest predicting the cohort from all features reaches an out-of-bag accuracy of {cohorts.CohortPredictionAccuracy:0.00}, against {cohorts.LargestCohortShare:0.00} for always guessing the largest cohort. ")
            + (cohorts.CohortPredictionAccuracy > cohorts.LargestCohortShare
                ? "The further the first figure is above the second, the more the cohorts differ across many features (centre, batch or population effects), and the more the marker flags below matter."
                : "The features predict the cohort no better than that guess, so there is little sign of systematic differences between cohorts.");
    }

    /// <summary>What makes a cohort large enough for a screen of its own, by outcome kind (CohortMembership's rule).</summary>
    public static string EnoughText(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "enough samples (20 with a measured outcome)",
        CohortEffectMeasure.HazardRatioPerSd => "enough events (10)",
        _ => "enough samples of each class",
    };

    public static string Association(CohortResult cohorts) =>
        AssociationMeasure(cohorts)
            + (cohorts.Confounded
                ? "That is too strong an association to separate the two (see the warning below)."
                : "The association is weak enough that within-cohort comparisons can separate a marker of outcome from a marker of cohort.");

    private static string AssociationMeasure(CohortResult cohorts) => cohorts.Measure switch
    {
        // Cramér's V of the class x cohort table (Cramér 1946) with Pearson's chi-square test of independence.
        CohortEffectMeasure.Auc => Invariant($"Outcome and cohort: Cramér's V {cohorts.OutcomeCohortAssociation:0.00} (0 means the class mix is the same in every cohort, 1 that the cohort fixes the class), chi-square test {PValue(cohorts.OutcomeCohortPValue)}. "),
        // Correlation ratio of the outcome's ranks (Pearson 1903) with the Kruskal-Wallis (1952) test.
        CohortEffectMeasure.SpearmanRho => Invariant($"Outcome and cohort: eta {cohorts.OutcomeCohortAssociation:0.00}, the correlation ratio of the outcome's ranks on cohort (0 means the outcome is spread alike in every cohort, 1 that the cohort fixes it; with two classes it equals Cramér's V), Kruskal-Wallis test {PValue(cohorts.OutcomeCohortPValue)}. "),
        // Correlation ratio of the null model's martingale residuals, with the k-sample log-rank test.
        _ => Invariant($"Outcome and cohort: eta {cohorts.OutcomeCohortAssociation:0.00}, the correlation ratio on cohort of each sample's event minus its expected events (martingale residuals under no marker; 0 means every cohort has the same survival, 1 that the cohort fixes it), log-rank test across cohorts {PValue(cohorts.OutcomeCohortPValue)}. "),
    };

    private static void WriteFlags(HtmlBuilder html, ScreenResult result, CohortResult cohorts)
    {
        html.BeginSection("Markers explained by cohort");
        html.Paragraph(cohorts.Measure == CohortEffectMeasure.Auc ? ClassFlagRules : KindFlagRules(cohorts.Measure));
        WriteFlagTables(html, result, cohorts);
    }

    /// <summary>The flag rules for the other kinds, in the measure's words.</summary>
    private static string KindFlagRules(CohortEffectMeasure measure)
    {
        string name = CohortMeasureWords.Short(measure), none = CohortMeasureWords.NullText(measure);
        return $"Each marker's effect within each cohort is its {CohortMeasureWords.Long(measure)} ({CohortMeasureWords.IntervalSource(measure)}). "
            + $"A marker is flagged as a cohort artefact when its {name} over all samples differs from {none}, it separates one cohort from the others "
            + $"(one-cohort-against-the-rest AUC of at least 0.75), and the pooled within-cohort {name} interval contains {none}. "
            + $"It is flagged as heterogeneous when Cochran's Q test of its within-cohort effects survives Benjamini-Hochberg adjustment across all features at the screen's level and {SpreadText(measure)}. "
            + $"Within-cohort {name} is the DerSimonian & Laird (1986) random-effects pooling of the per-cohort values; tau² is the between-cohort variance on the pooled scale.";
    }

    private static string SpreadText(CohortEffectMeasure measure) => CohortMeasureWords.SpreadText(measure);

    private const string ClassFlagRules = "A marker is flagged as a cohort artefact when it differs between classes over all samples, separates one cohort from the others "
            + "(one-cohort-against-the-rest AUC of at least 0.75), and shows no consistent class difference within cohorts (the pooled within-cohort AUC interval spans 0.5). "
            + "It is flagged as heterogeneous when its within-cohort AUC varies between cohorts far more than chance allows (I² of at least 75%; Higgins & Thompson 2002). "
            + "Within-cohort AUC is the DerSimonian & Laird (1986) random-effects pooling of the per-cohort AUCs; tau² is the between-cohort variance of the AUC.";

    private static void WriteFlagTables(HtmlBuilder html, ScreenResult result, CohortResult cohorts)
    {
        var flagged = CohortReportTables.FlaggedShortlist(result, cohorts);
        if (result.Shortlist.Count == 0) html.Paragraph("Shortlisted markers flagged: none (nothing was shortlisted).");
        else if (flagged.Count == 0) html.Paragraph("Shortlisted markers flagged: none. No shortlisted marker is flagged as a cohort artefact or as heterogeneous across cohorts.");
        else html.Table(CohortReportTables.ShortlistFlags(flagged));

        var outside = CohortReportTables.ArtefactsOutsideShortlist(result, cohorts);
        if (outside.Count == 0) html.Paragraph("Features outside the shortlist flagged as cohort artefacts: none.");
        else
        {
            html.Paragraph(Invariant($"Features outside the shortlist flagged as cohort artefacts: {outside.Count}. ")
                + "They were not shortlisted; they are listed so that nobody carries them forward from another analysis. All are in cohort_markers.tsv.");
            html.Table(CohortReportTables.OutsideArtefacts(outside));
        }
        html.EndSection();
    }

    private static void WriteForestPlots(HtmlBuilder html, ScreenResult result, CohortResult cohorts)
    {
        int count = Math.Min(CohortReportCharts.ForestPlotMarkerLimit, result.Shortlist.Count);
        if (count == 0) return;
        html.BeginSection("Top markers cohort by cohort");
        var measure = cohorts.Measure;
        html.Paragraph(measure == CohortEffectMeasure.Auc
            ? "Each row is one cohort: the square is the marker's AUC there (its area grows with the cohort's weight in the pooled estimate) and the line its 95% DeLong interval. "
                + "The diamond is the random-effects pooled within-cohort AUC (DerSimonian & Laird 1986). The dashed line at 0.5 is no difference between classes. "
                + "A marker worth validating sits on the same side of 0.5 in every cohort."
            : $"Each row is one cohort: the square is the marker's {CohortMeasureWords.Long(measure)} there (its area grows with the cohort's weight in the pooled estimate) and the line its 95% interval "
                + $"({CohortMeasureWords.IntervalSource(measure)}). The diamond is the random-effects pooled within-cohort value (DerSimonian & Laird 1986). "
                + $"The dashed line at {CohortMeasureWords.NullText(measure)} is no effect. A marker worth validating sits on the same side of it in every cohort.");
        for (int i = 0; i < count; i++)
        {
            var entry = result.Shortlist[i];
            if (cohorts.Marker(entry.Forest.FeatureIndex) is not { } marker) continue;
            html.Figure(CohortReportCharts.CohortAuc(marker), ForestCaption(entry.Rank, marker));
        }
        html.EndSection();
    }

    public static string ForestCaption(int rank, MarkerHeterogeneity marker)
    {
        string name = CohortMeasureWords.Short(marker.Measure);
        string caption = Invariant($"Shortlist rank {rank}: {marker.Feature}, {name} in each cohort. ");
        caption += marker.WithinCohort is { } within
            ? Invariant($"Heterogeneity: I² = {ReportNumber.Percent(within.I2, 0)} (Higgins & Thompson 2002), tau² = {ReportNumber.Significant(within.Tau2, 2)}, Cochran's Q {PValue(within.QPValue)} (DerSimonian & Laird 1986).")
            : $"Fewer than two cohorts had {(marker.Measure == CohortEffectMeasure.Auc ? "an AUC" : "a " + name)}, so there is no pooled estimate or heterogeneity.";
        if (marker.Flag != CohortFlag.None) caption += " Flagged: " + CohortReportTables.FlagWords(marker.Flag) + ".";
        return caption;
    }

    private static void WriteConcordance(HtmlBuilder html, CohortResult cohorts)
    {
        html.BeginSection("Do the cohorts' own screens agree?");
        if (cohorts.Concordance.Count == 0)
        {
            html.Paragraph("Fewer than two cohorts had " + EnoughText(cohorts.Measure) + " for a screen of their own, so their screens could not be compared.");
            html.EndSection();
            return;
        }
        html.Paragraph("Each cohort large enough was screened on its own. For every pair: the Spearman correlation of mean corrected importance over all features, "
            + "the share of features the two top-10, top-20 and top-50 lists have in common, and rank-biased overlap of the two orders "
            + "(Webber, Moffat & Zobel 2010; persistence 0.9, extrapolated, over the first 100 features), which weighs agreement at the top most. "
            + "Low agreement with good markers in the shortlist usually means small cohorts rather than different biology.");
        html.Table(CohortReportTables.Concordance(cohorts));
        if (cohorts.ScreenedCohorts.Count >= CohortReportCharts.HeatMapMinimumCohorts)
            html.Figure(CohortReportCharts.Concordance(cohorts),
                "Spearman correlation of mean corrected importance between the screened cohorts' own screens; vermillion is agreement, blue disagreement.");
        html.EndSection();
    }

    private static void WriteHeldOut(HtmlBuilder html, ScreenResult result, CohortResult cohorts)
    {
        html.BeginSection("A cohort never seen");
        if (cohorts.HeldOut.Count == 0)
        {
            html.Paragraph("No cohort could be held out: leaving one out needs " + EnoughText(cohorts.Measure) + " both in it and in the rest.");
            html.EndSection();
            return;
        }
        html.Paragraph("Each cohort in turn is left out; the screen runs on the others, a forest on its top markers is trained there and scored on the cohort it never saw. "
            + cohorts.Measure switch
            {
                CohortEffectMeasure.SpearmanRho => "R² is one minus the squared error over the held-out cohort's own spread about its mean (0: no better than that mean; it depends on how widely the outcome varies in that cohort); the mean squared error is beside it.",
                CohortEffectMeasure.HazardRatioPerSd => "C is Harrell's concordance of the forest's mortality with the held-out cohort's follow-up, with its infinitesimal-jackknife 95% interval.",
                _ => "AUC intervals are DeLong's; the error is the share misclassified by majority vote.",
            });
        html.Table(CohortReportTables.HeldOut(cohorts));
        html.Paragraph(HeldOutComparison(result.PanelSize, cohorts.HeldOut));
        html.EndSection();
    }

    /// <summary>
    /// One sentence setting the held-out cohorts beside the selection-aware panel-size estimate at the
    /// recommended size. A cohort counts as clearly worse only when the selection-aware estimate lies outside
    /// its own 95% interval (above it for the AUC), so a small cohort's wide interval is not read as a failure.
    /// </summary>
    public static string HeldOutComparison(PanelSizeCurve? curve, IReadOnlyList<HeldOutCohort> heldOut)
    {
        PanelSizePoint? recommended = null;
        if (curve is not null)
            foreach (var point in curve.Points)
                if (point.PanelSize == curve.RecommendedSize) recommended = point;
        if (curve is null || recommended is null)
            return "The panel-size curve was not computed for this run, so the held-out cohorts cannot be set beside its selection-aware estimate.";

        double lowestAuc = double.PositiveInfinity, highestAuc = double.NegativeInfinity;
        double lowestError = double.PositiveInfinity, highestError = double.NegativeInfinity;
        var worse = new List<string>();
        foreach (var held in heldOut)
        {
            lowestError = Math.Min(lowestError, held.Error);
            highestError = Math.Max(highestError, held.Error);
            if (!double.IsFinite(held.Score)) continue;
            lowestAuc = Math.Min(lowestAuc, held.Score);
            highestAuc = Math.Max(highestAuc, held.Score);
            if (held.ScoreInterval.Upper < recommended.SelectionAwareAuc) worse.Add(held.Cohort);
        }
        if (curve.Metric is "r_squared" or "concordance" && double.IsFinite(lowestAuc))
        {
            string score = curve.Metric == "r_squared" ? "R²" : "concordance";
            string judged = curve.Metric == "r_squared"
                ? "R² has no interval here, so read a cohort well below the estimate as a warning rather than a verdict."
                : worse.Count == 0
                    ? "no held-out cohort's 95% interval lies below that estimate, so the markers carry over to a centre they were not chosen on about as well as to new samples from the same centres."
                    : "the 95% interval of " + string.Join(", ", worse) + " lies below it, so the markers carry over less well to that centre than to new samples from the same centres.";
            return Invariant($"Held-out-cohort {score} runs from {lowestAuc:0.000} to {highestAuc:0.000}, against the selection-aware cross-validated {score} of {recommended.SelectionAwareAuc:0.000} at the recommended {curve.RecommendedSize} markers; ")
                + judged;
        }
        if (curve.Metric == "auc" && double.IsFinite(lowestAuc))
            return Invariant($"Held-out-cohort AUCs run from {lowestAuc:0.000} to {highestAuc:0.000}, against the selection-aware cross-validated AUC of {recommended.SelectionAwareAuc:0.000} at the recommended {curve.RecommendedSize} markers; ")
                + (worse.Count == 0
                    ? "no held-out cohort's 95% interval lies below that estimate, so the markers carry over to a centre they were not chosen on about as well as to new samples from the same centres."
                    : "the 95% interval of " + string.Join(", ", worse) + " lies below it, so the markers carry over less well to that centre than to new samples from the same centres.");
        return Invariant($"Held-out-cohort errors run from {lowestError:0.000} to {highestError:0.000}, against the selection-aware cross-validated error of {recommended.SelectionAwareError:0.000} at the recommended {curve.RecommendedSize} markers; ")
            + "a clearly higher error in a cohort means the markers carry over less well to a new centre than to new samples from the same centres.";
    }

    /// <summary>A p-value for reading: two significant digits, and "&lt; 0.001" below that (common practice in reporting).</summary>
    public static string PValue(double p) =>
        double.IsFinite(p) && p < 0.001 ? "p < 0.001" : "p = " + ReportNumber.Significant(p, 2);

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
