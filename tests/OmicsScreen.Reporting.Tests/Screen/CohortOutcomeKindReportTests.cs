using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// The cohort tables and the report's cohort sentences for measured and time-to-event outcomes:
/// the kind's measure in the column names and the words, the value of no effect where the forest
/// plot draws it, and the held-out score in R² or C. Built from hand-made results (the figures are
/// invented; the screen that makes them is tested in the Screening and CLI tests).
/// </summary>
public sealed class CohortOutcomeKindReportTests
{
    private static CohortResult Result(CohortEffectMeasure measure)
    {
        var meta = RandomEffectsMetaAnalysis.DerSimonianLaird([0.4, 0.5], [0.01, 0.02]);
        var effects = new List<CohortEffect>
        {
            new("north", 40, double.NaN, measure.FromPooledScale(0.4), 0.1, new ConfidenceInterval(0.2, 0.6, 0.95)),
            new("south", 40, double.NaN, measure.FromPooledScale(0.5), 0.14, new ConfidenceInterval(0.25, 0.7, 0.95)),
        };
        var marker = new MarkerHeterogeneity(0, "AN0001", effects, meta, measure.FromPooledScale(0.45), new ConfidenceInterval(0.3, 0.6, 0.95),
            0.55, "north", 3, CohortFlag.None) { Measure = measure };
        return new CohortResult("centre", ["north", "south"], ["north", "south"], [], [marker],
            [new HeldOutCohort("north", 40, 3, 0.31, measure == CohortEffectMeasure.HazardRatioPerSd ? new ConfidenceInterval(0.6, 0.8, 0.95) : ConfidenceInterval.Undefined(0.95), 0.7)],
            0.5, 0.5, 0.2, 0.04, false) { Measure = measure };
    }

    private static string[] Header(Func<TextWriter, CohortResult, int> write, CohortResult result)
    {
        using var writer = new StringWriter();
        write(writer, result);
        return writer.ToString().Split('\n')[0].Split('\t');
    }

    [Theory]
    [InlineData(CohortEffectMeasure.SpearmanRho, "rho")]
    [InlineData(CohortEffectMeasure.HazardRatioPerSd, "hazard_ratio_per_sd")]
    public void Tables_name_the_kinds_measure(CohortEffectMeasure measure, string effect)
    {
        var result = Result(measure);
        var markers = Header(CohortTables.WriteMarkers, result);
        Assert.Contains("pooled_" + effect, markers);
        Assert.Contains("within_cohort_" + effect + "_high95", markers);
        Assert.DoesNotContain(markers, column => column.Contains("auc", StringComparison.Ordinal) && column != "cohort_separation_auc");
        Assert.Equal(["feature", "cohort", "samples", effect, effect + "_low95", effect + "_high95"], Header(CohortTables.WriteEffects, result));
        var heldOut = Header(CohortTables.WriteHeldOut, result);
        Assert.Contains(measure == CohortEffectMeasure.SpearmanRho ? "r_squared" : "concordance", heldOut);
        Assert.DoesNotContain("auc", heldOut);

        // The within-cohort estimate is the pooled value read back on the effect's scale: tanh for
        // Fisher's z, exp for the log hazard ratio (DerSimonian & Laird 1986 pool on those scales).
        var marker = result.Markers[0];
        Assert.Equal(measure.FromPooledScale(marker.WithinCohort!.RandomEstimate), marker.WithinCohortEffect, 12);
        Assert.Equal(measure.FromPooledScale(marker.WithinCohort.RandomInterval.Upper), marker.WithinCohortInterval.Upper, 12);
    }

    [Fact]
    public void The_sentences_speak_of_eta_and_the_kinds_size_rule()
    {
        var measured = Result(CohortEffectMeasure.SpearmanRho);
        Assert.Contains("eta 0.20", CohortReportSection.Association(measured));
        Assert.Contains("Kruskal-Wallis", CohortReportSection.Association(measured));
        Assert.Contains("20 with a measured outcome", CohortReportSection.Summary(measured));
        var followUp = Result(CohortEffectMeasure.HazardRatioPerSd);
        Assert.Contains("log-rank test across cohorts", CohortReportSection.Association(followUp));
        Assert.Contains("enough events (10)", CohortReportSection.Summary(followUp));
        Assert.DoesNotContain("Cramér", CohortReportSection.Association(followUp));
        Assert.Contains("HR per SD in each cohort", CohortReportSection.ForestCaption(1, followUp.Markers[0]));
    }
}
