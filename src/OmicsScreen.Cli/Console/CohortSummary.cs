using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Console;

/// <summary>Prints the cohort check of a screen on the console (its tables are written by <c>CohortTableFiles</c>).</summary>
internal static class CohortSummary
{
    public static void Print(TextWriter output, ScreenResult result, CohortResult cohorts)
    {
        output.WriteLine();
        output.WriteLine(FormattableString.Invariant(
            $"Cohort check ({cohorts.CohortColumn}: {cohorts.Cohorts.Count} cohorts): the features predict the cohort with out-of-bag accuracy {cohorts.CohortPredictionAccuracy:0.00} (largest cohort {cohorts.LargestCohortShare:0.00}); outcome-cohort association {AssociationSymbol(cohorts.Measure)} = {cohorts.OutcomeCohortAssociation:0.00}."));
        if (cohorts.Confounded)
            output.WriteLine(cohorts.Measure == CohortEffectMeasure.Auc
                ? "  Outcome and cohort are strongly associated (most cases come from some cohorts): no method can separate a disease marker from a cohort marker in this design."
                : "  Outcome and cohort are strongly associated (the cohort nearly fixes the outcome): no method can separate a marker of the outcome from a cohort marker in this design.");
        var flagged = result.Shortlist.Select(e => (e, m: cohorts.Marker(e.Forest.FeatureIndex))).Where(x => x.m is { Flag: not CohortFlag.None }).ToList();
        if (flagged.Count == 0)
        {
            output.WriteLine("  No shortlisted marker is flagged as a cohort artefact or as heterogeneous across cohorts.");
        }
        else
        {
            var table = new TextTable("rank", "marker", "flag", "within-cohort " + CohortMeasureWords.Short(cohorts.Measure), "I2", "separates");
            foreach (var (e, m) in flagged)
                table.Add(e.Rank.ToString(System.Globalization.CultureInfo.InvariantCulture), e.Forest.Feature, CohortTables.FlagText(m!.Flag),
                    m.WithinCohort is null ? "" : FormattableString.Invariant($"{m.WithinCohortEffect:0.000}"), FormattableString.Invariant($"{m.WithinCohort?.I2:0.00}"),
                    FormattableString.Invariant($"{m.SeparatedCohort} ({m.CohortSeparation:0.00})"));
            table.WriteTo(output);
        }
        var shortlisted = result.Shortlist.Select(e => e.Forest.FeatureIndex).ToHashSet();
        var artefactsOutside = cohorts.Markers.Where(m => m.Flag == CohortFlag.CohortArtefact && !shortlisted.Contains(m.FeatureIndex)).ToList();
        const int named = 5;
        if (artefactsOutside.Count > 0)
            output.WriteLine($"  Not shortlisted but flagged as cohort artefacts (see cohort_markers.tsv): "
                + string.Join(", ", artefactsOutside.Take(named).Select(m => FormattableString.Invariant($"{TextTable.Printable(m.Feature)} (separates {TextTable.Printable(m.SeparatedCohort)}, AUC {m.CohortSeparation:0.00})")))
                + (artefactsOutside.Count > named ? $", and {artefactsOutside.Count - named} more." : "."));
        foreach (var h in cohorts.HeldOut)
            output.WriteLine(FormattableString.Invariant(
                $"  held out {h.Cohort} ({h.SampleCount} samples, {h.PanelSize} markers chosen on the others): {HeldOutScore(cohorts.Measure, h)}"));
    }

    /// <summary>V for classes (Cramér's), eta for the other kinds (the correlation ratio; see OutcomeCohortAssociation).</summary>
    private static string AssociationSymbol(CohortEffectMeasure measure) => measure == CohortEffectMeasure.Auc ? "V" : "eta";

    private static string HeldOutScore(CohortEffectMeasure measure, HeldOutCohort h) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => FormattableString.Invariant($"R² {h.Score:0.000}, mean squared error {h.Error:0.###}"),
        CohortEffectMeasure.HazardRatioPerSd => FormattableString.Invariant($"C {h.Score:0.000} [{h.ScoreInterval.Lower:0.000}, {h.ScoreInterval.Upper:0.000}]"),
        _ => FormattableString.Invariant($"AUC {h.Score:0.000} [{h.ScoreInterval.Lower:0.000}, {h.ScoreInterval.Upper:0.000}], error {h.Error:0.000}"),
    };
}
