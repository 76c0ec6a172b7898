using System.Globalization;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// The HTML page of `omicsscreen apply` for a panel locked on a time to an event: the panel, the
/// risk groups, and with follow-up known Harrell's C, the time-dependent AUC at the horizon asked
/// for and the Kaplan-Meier curves of the risk groups with the log-rank p; the scale checks and
/// the cautions. Sample ids appear only when asked for.
/// </summary>
public static class FollowUpApplyReport
{
    public static string Build(LockedFollowUpPanel model, LockedFollowUpScores scores, LockedFollowUpPerformance? performance, string matrixPath,
        bool showSampleIds, IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string> displayNames)
    {
        var html = ApplyReport.BeginPage(matrixPath, "Read before using these risk scores", [.. discoveryOverlap, .. Cautions(scores, performance)],
            new("Outcome", $"time to an event (discovery follow-up '{model.TimeColumn}', event '{model.EventColumn}', {model.DiscoveryEventCount} events)"),
            model.MarkerNames, displayNames, model.Trees.Count,
            [
                new("Risk score", "ensemble mortality: the mean over the trees of the leaf's Nelson-Aalen cumulative hazard summed over the discovery event times (a random survival forest, Ishwaran et al. 2008); higher means more events expected, earlier"),
                new("Risk groups", $"high when the risk score is above {Number(model.RiskGroupCut)}, the median of the discovery out-of-bag risk scores; low otherwise"),
                new("Discovery out-of-bag concordance (Harrell's C)", Number(model.OutOfBagConcordance)),
            ],
            model.Provenance);

        html.BeginSection("Risk scores");
        int high = scores.HighRiskCount;
        var groups = new HtmlTable("Samples per risk group", [new("risk group"), new("samples", ColumnAlignment.Numeric)]);
        groups.AddRow("high", high.ToString(CultureInfo.InvariantCulture));
        groups.AddRow("low", (scores.SampleCount - high).ToString(CultureInfo.InvariantCulture));
        html.Table(groups);
        if (showSampleIds)
        {
            var table = new HtmlTable("Every sample's risk score and group", [new("sample"), new("risk score", ColumnAlignment.Numeric), new("risk group")]);
            for (int s = 0; s < scores.SampleCount; s++) table.AddRow(scores.SampleIds[s], Number(scores.RiskScores[s]), scores.HighRisk[s] ? "high" : "low");
            html.Table(table);
        }
        else
        {
            html.Paragraph($"Per-sample risk scores are in {ApplyResultFiles.Scores}; this page shows no sample ids (pass --show-sample-ids to list them).");
        }
        html.EndSection();

        if (performance is not null) AddPerformance(html, model, performance);

        ApplyReport.AddScaleCheck(html, scores.Warnings.Select(w => w.Message).ToList());
        return html.EndDocument();
    }

    private static void AddPerformance(HtmlBuilder html, LockedFollowUpPanel model, LockedFollowUpPerformance performance)
    {
        html.BeginSection("Performance on this cohort");
        var c = performance.Concordance;
        var entries = new List<KeyValuePair<string, string>>
        {
            new("Samples", performance.SampleCount.ToString(CultureInfo.InvariantCulture)),
            new("Events", performance.EventCount.ToString(CultureInfo.InvariantCulture)),
            new("Concordance (Harrell's C)", $"{Number(c.Concordance)} (95% CI {Number(c.Interval.Lower)} to {Number(c.Interval.Upper)}, infinitesimal jackknife; 0.5 is chance)"),
        };
        if (performance.TimeDependentAuc is { } auc)
            entries.Add(new(FormattableString.Invariant($"Time-dependent AUC at {auc.Horizon:G6}"),
                $"{Number(auc.Auc)} ({auc.Cases} samples with the event by then against {auc.Controls} followed beyond it; {auc.CensoredBeforeHorizon} censored before it enter through censoring weights. "
                + "Cumulative/dynamic definition, Heagerty, Lumley & Pepe 2000, with inverse-probability-of-censoring weights, Uno et al. 2007)"));
        else
            entries.Add(new("Time-dependent AUC", "not computed: name a horizon with --horizon"));
        if (performance.LogRank is { } logRank)
            entries.Add(new("Log-rank test, high against low risk", $"chi-square {Number(logRank.ChiSquare)}, p {Significant(logRank.PValue)}"));
        html.DefinitionList(entries);

        var groups = new HtmlTable("Risk groups on this cohort",
            [new("risk group"), new("samples", ColumnAlignment.Numeric), new("events", ColumnAlignment.Numeric), new("median time to the event (Kaplan-Meier)", ColumnAlignment.Numeric)]);
        groups.AddRow("high", performance.HighRiskCount.ToString(CultureInfo.InvariantCulture),
            performance.HighRiskEventCount.ToString(CultureInfo.InvariantCulture), Median(performance.HighRisk));
        groups.AddRow("low", (performance.SampleCount - performance.HighRiskCount).ToString(CultureInfo.InvariantCulture),
            (performance.EventCount - performance.HighRiskEventCount).ToString(CultureInfo.InvariantCulture), Median(performance.LowRisk));
        html.Table(groups);
        html.Figure(RiskGroupCurves(model, performance),
            "Kaplan-Meier estimates of the share still without the event in each risk group, split at the discovery median risk score. "
            + $"The curves are in {ApplyResultFiles.RiskGroups}. Separated curves show ranking, not calibrated risk.");
        html.EndSection();
    }

    /// <summary>The Kaplan-Meier curves of the two risk groups, with the log-rank p in the title.</summary>
    public static SvgImage RiskGroupCurves(LockedFollowUpPanel model, LockedFollowUpPerformance performance) =>
        KaplanMeierSteps.RiskGroups("Risk groups of the locked panel", "Time (" + model.TimeColumn + " units)", performance);

    private static List<string> Cautions(LockedFollowUpScores scores, LockedFollowUpPerformance? performance)
    {
        var cautions = new List<string>
        {
            "Research use only: a locked panel is a candidate for validation, not a diagnostic or prognostic test for a patient.",
            "A risk score ranks samples; it is not a calibrated probability of the event by any time. Concordance and the time-dependent AUC measure ranking only; neither shows calibration over time.",
            "The risk groups are cut at the discovery median; in a cohort with another case mix, follow-up or assay the groups need not be halves, and the cut is not a clinical threshold.",
            "Only an independent cohort, measured as it will be in use, shows how well the panel ranks risk; a cohort from the discovery centres is not enough.",
        };
        cautions.AddRange(ApplyReport.ScaleCautions(scores.Warnings, "the risk scores", "the risk scores"));
        if (performance is null)
            cautions.Add("No follow-up was given, so nothing here says how well the panel ranks risk on this cohort.");
        else if (performance.EventCount < 50)
            cautions.Add(FormattableString.Invariant($"{performance.EventCount} events: the concordance interval is wide and the curves are uncertain (common practice asks for at least 50 to 100 events to validate a prognostic score)."));
        return cautions;
    }

    private static string Median(SurvivalCurve? curve) => curve is null ? "no samples" : double.IsNaN(curve.Median) ? "not reached" : Number(curve.Median);

    private static string Number(double value) => double.IsNaN(value) ? "not defined" : value.ToString("0.###", CultureInfo.InvariantCulture);

    private static string Significant(double value) => double.IsNaN(value) ? "not defined" : value.ToString("G2", CultureInfo.InvariantCulture);
}
