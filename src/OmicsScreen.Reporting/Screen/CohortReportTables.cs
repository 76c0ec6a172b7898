using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The tables of the report's cohort section: flagged markers inside and outside the shortlist,
/// the concordance of the cohorts' own screens, and leave-one-cohort-out validation. They hold the
/// same figures as the cohort TSV tables (<see cref="CohortTables"/>), rounded for reading.
/// </summary>
internal static class CohortReportTables
{
    public const string ShortlistFlagsCaption = "Shortlisted markers flagged by the cohort check";
    public const string OutsideArtefactsCaption = "Features outside the shortlist flagged as cohort artefacts";
    public const string ConcordanceCaption = "Agreement between the cohorts' own screens";
    public const string HeldOutCaption = "Leave-one-cohort-out validation";

    /// <summary>Features outside the shortlist listed by name; the rest are only counted.</summary>
    public const int OutsideArtefactLimit = 10;

    /// <summary>The shortlist entries whose cohort check raised a flag, in shortlist order.</summary>
    public static List<(ShortlistEntry Entry, MarkerHeterogeneity Marker)> FlaggedShortlist(ScreenResult result, CohortResult cohorts)
    {
        var flagged = new List<(ShortlistEntry, MarkerHeterogeneity)>();
        foreach (var entry in result.Shortlist)
            if (cohorts.Marker(entry.Forest.FeatureIndex) is { Flag: not CohortFlag.None } marker) flagged.Add((entry, marker));
        return flagged;
    }

    /// <summary>Features flagged as cohort artefacts that the shortlist left out, with their position in the screen order.</summary>
    public static List<(int Position, MarkerHeterogeneity Marker)> ArtefactsOutsideShortlist(ScreenResult result, CohortResult cohorts)
    {
        var shortlisted = new HashSet<int>();
        foreach (var entry in result.Shortlist) shortlisted.Add(entry.Forest.FeatureIndex);
        var artefacts = new List<(int, MarkerHeterogeneity)>();
        // Markers are held in the screen's order, so the index is the screen position less one.
        for (int i = 0; i < cohorts.Markers.Count; i++)
        {
            var marker = cohorts.Markers[i];
            if (marker.Flag == CohortFlag.CohortArtefact && !shortlisted.Contains(marker.FeatureIndex)) artefacts.Add((i + 1, marker));
        }
        return artefacts;
    }

    public static HtmlTable ShortlistFlags(IReadOnlyList<(ShortlistEntry Entry, MarkerHeterogeneity Marker)> flagged)
    {
        string name = flagged.Count > 0 ? CohortMeasureWords.Short(flagged[0].Marker.Measure) : "AUC";
        var table = new HtmlTable(ShortlistFlagsCaption,
        [
            new("Rank", ColumnAlignment.Numeric),
            new("Feature"),
            new("Flag"),
            new(name + ", all samples [95% CI]"),
            new("Within-cohort " + name + " [95% CI]"),
            new("I²", ColumnAlignment.Numeric),
            new("tau²", ColumnAlignment.Numeric),
            new("Cohort it separates"),
            new("Separation AUC", ColumnAlignment.Numeric),
        ])
        { FirstColumnIsRowHeader = false };
        foreach (var (entry, marker) in flagged)
            table.AddRow(
                ReportNumber.Integer(entry.Rank),
                marker.Feature,
                FlagWords(marker.Flag),
                Auc(marker.AllSamplesEffect, marker.AllSamplesInterval),
                marker.WithinCohort is not null ? Auc(marker.WithinCohortEffect, marker.WithinCohortInterval) : ReportNumber.Missing,
                I2(marker.WithinCohort),
                Tau2(marker.WithinCohort),
                marker.SeparatedCohort,
                ReportNumber.Fixed(marker.CohortSeparation, 2));
        return table;
    }

    public static HtmlTable OutsideArtefacts(IReadOnlyList<(int Position, MarkerHeterogeneity Marker)> artefacts)
    {
        int shown = Math.Min(OutsideArtefactLimit, artefacts.Count);
        string caption = shown < artefacts.Count
            ? OutsideArtefactsCaption + " (first " + ReportNumber.Integer(shown) + " of " + ReportNumber.Integer(artefacts.Count) + ")"
            : OutsideArtefactsCaption;
        string name = artefacts.Count > 0 ? CohortMeasureWords.Short(artefacts[0].Marker.Measure) : "AUC";
        var table = new HtmlTable(caption,
        [
            new("Order", ColumnAlignment.Numeric),
            new("Feature"),
            new(name + ", all samples [95% CI]"),
            new("Within-cohort " + name + " [95% CI]"),
            new("Cohort it separates"),
            new("Separation AUC", ColumnAlignment.Numeric),
        ])
        { FirstColumnIsRowHeader = false };
        for (int i = 0; i < shown; i++)
        {
            var (position, marker) = artefacts[i];
            table.AddRow(
                ReportNumber.Integer(position),
                marker.Feature,
                Auc(marker.AllSamplesEffect, marker.AllSamplesInterval),
                marker.WithinCohort is not null ? Auc(marker.WithinCohortEffect, marker.WithinCohortInterval) : ReportNumber.Missing,
                marker.SeparatedCohort,
                ReportNumber.Fixed(marker.CohortSeparation, 2));
        }
        return table;
    }

    public static HtmlTable Concordance(CohortResult cohorts)
    {
        var table = new HtmlTable(ConcordanceCaption,
        [
            new("Cohort A"),
            new("Cohort B"),
            new("Spearman rho", ColumnAlignment.Numeric),
            new("Top-10 overlap", ColumnAlignment.Numeric),
            new("Top-20 overlap", ColumnAlignment.Numeric),
            new("Top-50 overlap", ColumnAlignment.Numeric),
            new("Rank-biased overlap", ColumnAlignment.Numeric),
        ])
        { FirstColumnIsRowHeader = false };
        foreach (var pair in cohorts.Concordance)
            table.AddRow(pair.First, pair.Second, ReportNumber.Fixed(pair.Spearman, 2), ReportNumber.Percent(pair.Top10Overlap, 0),
                ReportNumber.Percent(pair.Top20Overlap, 0), ReportNumber.Percent(pair.Top50Overlap, 0), ReportNumber.Fixed(pair.RankBiasedOverlap, 2));
        return table;
    }

    public static HtmlTable HeldOut(CohortResult cohorts)
    {
        bool measured = cohorts.Measure == CohortEffectMeasure.SpearmanRho;
        string score = CohortMeasureWords.HeldOutScore(cohorts.Measure);
        var table = new HtmlTable(HeldOutCaption,
        [
            new("Held-out cohort"),
            new("Samples", ColumnAlignment.Numeric),
            new("Panel size", ColumnAlignment.Numeric),
            measured ? new(score, ColumnAlignment.Numeric) : new(score + " [95% CI]"),
            new(measured ? "Mean squared error" : cohorts.Measure == CohortEffectMeasure.HazardRatioPerSd ? "Error (1 - C)" : "Error", ColumnAlignment.Numeric),
        ]);
        foreach (var held in cohorts.HeldOut)
            table.AddRow(held.Cohort, ReportNumber.Integer(held.SampleCount), ReportNumber.Integer(held.PanelSize),
                measured ? ReportNumber.Fixed(held.Score, 3) : Auc(held.Score, held.ScoreInterval),
                measured ? ReportNumber.Significant(held.Error, 3) : ReportNumber.Fixed(held.Error, 3));
        return table;
    }

    public static string FlagWords(CohortFlag flag) => flag switch
    {
        CohortFlag.CohortArtefact => "cohort artefact",
        CohortFlag.Heterogeneous => "heterogeneous",
        _ => "none",
    };

    public static string Auc(double auc, ConfidenceInterval interval) =>
        double.IsFinite(auc)
            ? ReportNumber.Fixed(auc, 3) + " [" + ReportNumber.Fixed(interval.Lower, 3) + ", " + ReportNumber.Fixed(interval.Upper, 3) + "]"
            : ReportNumber.Missing;

    public static string I2(MetaAnalysisResult? within) => within is null ? ReportNumber.Missing : ReportNumber.Percent(within.I2, 0);

    public static string Tau2(MetaAnalysisResult? within) => within is null ? ReportNumber.Missing : ReportNumber.Significant(within.Tau2, 2);
}
