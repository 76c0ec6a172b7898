using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// What the report says and draws differently for each outcome kind: the words of its measures,
/// its input facts and the figures of a marker against a measured outcome (a scatter) or against
/// follow-up (Kaplan-Meier curves of the marker's high and low halves).
/// </summary>
internal static class OutcomeKindReport
{
    /// <summary>The held-out score of a panel-size curve in words.</summary>
    public static string MetricName(string metric) => metric switch
    {
        "auc" => "AUC",
        "r_squared" => "R²",
        "concordance" => "concordance (Harrell's C)",
        _ => "accuracy",
    };

    /// <summary>The score's short name for a chart axis.</summary>
    public static string AxisMetricName(string metric) => metric switch
    {
        "auc" => "AUC",
        "r_squared" => "R²",
        "concordance" => "Harrell's C",
        _ => "accuracy",
    };

    /// <summary>What a panel without information scores.</summary>
    public static double ChanceLevel(PanelSizeCurve curve, Panel panel)
    {
        switch (curve.Metric)
        {
            case "auc":
            case "concordance":
                return 0.5;
            case "r_squared":
                return 0;
            default:
                int largest = 0;
                foreach (int count in panel.Outcome.ClassCounts) largest = Math.Max(largest, count);
                return (double)largest / panel.SampleCount;
        }
    }

    public static string ChanceLabel(PanelSizeCurve curve) => curve.Metric switch
    {
        "auc" => "Chance (AUC 0.5)",
        "concordance" => "Chance (C 0.5)",
        "r_squared" => "No information (R² 0: the test samples' mean)",
        _ => "Chance (always the largest class)",
    };

    public static string PermutationMeaning(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "the rise in out-of-bag mean squared error",
        OutcomeKind.TimeToEvent => "the drop in out-of-bag concordance (Harrell's C)",
        _ => "the drop in out-of-bag accuracy",
    };

    public static string ImpurityMeaning(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "the decrease in squared error (variance) its splits bring",
        OutcomeKind.TimeToEvent => "the log-rank statistics of its splits",
        _ => "the decrease in Gini impurity its splits bring",
    };

    public static string ErrorCurveCaption(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "Out-of-bag mean squared error of the forest grown on all samples as trees are added. A flat end says the forests have enough trees.",
        OutcomeKind.TimeToEvent => "One minus the out-of-bag concordance of the forest grown on all samples as trees are added. A flat end says the forests have enough trees.",
        _ => "Out-of-bag error of the forest grown on all samples as trees are added. A flat end says the forests have enough trees.",
    };

    public static string ErrorAxisLabel(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "Out-of-bag mean squared error",
        OutcomeKind.TimeToEvent => "1 − out-of-bag concordance",
        _ => ScreenReportCharts.ErrorAxisLabel,
    };

    /// <summary>The reference forest in one sentence.</summary>
    public static string ReferenceForestSentence(ReferenceForestSummary forest)
    {
        if (forest.OutOfBagRSquared is { } r2)
            return Invariant($" A forest on all samples and features has out-of-bag R² {r2:0.000} (mean squared error {forest.OutOfBagError:0.###}).");
        if (forest.OutOfBagConcordance is { } c)
            return Invariant($" A forest on all samples and features has out-of-bag concordance (Harrell's C) {c:0.000}.");
        return forest.OutOfBagAuc is { } auc
            ? Invariant($" A forest on all samples and features has out-of-bag error {forest.OutOfBagError:0.000} and AUC {auc:0.000}.")
            : Invariant($" A forest on all samples and features has out-of-bag error {forest.OutOfBagError:0.000}.");
    }

    /// <summary>The outcome's facts under Input and settings.</summary>
    public static IEnumerable<KeyValuePair<string, string>> OutcomeFacts(Panel panel)
    {
        switch (panel.Kind)
        {
            case OutcomeKind.Measured:
                var values = panel.Measured!.Values.ToArray();
                Array.Sort(values);
                yield return new("Outcome column", panel.OutcomeColumn + " (a measured quantity)");
                yield return new("Outcome range [quartiles]", ReportNumber.Significant(values[0], 4) + " to " + ReportNumber.Significant(values[^1], 4)
                    + " [" + ReportNumber.Significant(Quartile(values, 0.25), 4) + ", " + ReportNumber.Significant(Quartile(values, 0.5), 4) + ", "
                    + ReportNumber.Significant(Quartile(values, 0.75), 4) + "]");
                break;
            case OutcomeKind.TimeToEvent:
                var followUp = panel.FollowUp!;
                var curve = KaplanMeier.Estimate(followUp.Times, followUp.Events);
                double median = curve.Median;
                yield return new("Follow-up columns", followUp.TimeColumn + " (time), " + followUp.EventColumn + " (event)");
                yield return new("Events (censored)", ReportNumber.Integer(followUp.EventCount) + " (" + ReportNumber.Integer(followUp.SampleCount - followUp.EventCount) + ")");
                yield return new("Median survival (Kaplan-Meier)", double.IsNaN(median) ? "not reached" : ReportNumber.Significant(median, 4));
                yield return new("Median follow-up (reverse Kaplan-Meier)", ReportNumber.Significant(KaplanMeier.MedianFollowUp(followUp.Times, followUp.Events), 4));
                break;
            default:
                yield return new("Outcome column", panel.Outcome.ColumnName);
                yield return new("Classes (samples)", string.Join(", ", panel.Outcome.ClassNames.Select((name, c) => name + " (" + ReportNumber.Integer(panel.Outcome.ClassCounts[c]) + ")")));
                yield return new("Positive class", panel.Outcome.ClassNames[panel.Outcome.PositiveClass]);
                break;
        }
    }

    /// <summary>Type 7 quantile of sorted values (R's default).</summary>
    private static double Quartile(double[] sorted, double p) => Quantile.OfSorted(sorted, p, QuantileDefinition.Linear);

    public static string ShortlistLegend(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "Direction and Spearman's rho relate the marker to the measured outcome; rho's 95% interval uses Fisher's z with Bonett & Wright's (2000) variance, "
            + "and a direction is named only when the interval excludes 0. Univariate rank: the marker's position by Spearman p-value among all features.",
        OutcomeKind.TimeToEvent => "Harrell's C treats the marker as a risk score (above 0.5: higher values, earlier events), with its infinitesimal-jackknife interval; "
            + "the hazard ratio per SD and its Wald interval come from a single-marker Cox model (Efron ties). A direction is named only when the hazard-ratio interval excludes 1. "
            + "Univariate rank: the marker's position by Cox score-test p-value among all features.",
        _ => "Direction, log2 ratio (of class medians) and AUC compare the positive class with the rest; the AUC interval is DeLong's. "
            + "Univariate rank: the marker's position by rank-test p-value among all features. "
            + "Acts with: for a marker whose evidence comes from the pairwise interaction scan rather than a shift of its own, its partner: "
            + "the class differs between samples on the same side of both markers' medians and samples on opposite sides, so its direction and AUC alone say little.",
    };

    /// <summary>How the sample map is coloured: by class, by quarter of a measured outcome, or by event status.</summary>
    public static (string Title, string[] Names, int[] Levels, string Caption) SampleColouring(Panel panel) => panel.Kind switch
    {
        OutcomeKind.Measured => ("Samples by quarter of the outcome", ["Lowest quarter", "Second quarter", "Third quarter", "Highest quarter"],
            ResamplingStrata.Of(panel).SampleStrata.ToArray(), "coloured by quarter of the measured outcome. Quarters apart here mean the outcome moves with many features at once."),
        OutcomeKind.TimeToEvent => ("Samples by event status", ["Censored", "Event"], ResamplingStrata.Of(panel).SampleStrata.ToArray(),
            "coloured by whether the event was seen. Event and censored samples apart here differ in many features at once (or in follow-up time)."),
        _ => ("Samples by class", [.. panel.Outcome.ClassNames], panel.Outcome.SampleClasses.ToArray(),
            "coloured by class. Classes apart here differ in many features at once."),
    };

    /// <summary>
    /// The marker against a measured outcome: measured cells as points, below-detection cells drawn
    /// apart at the detection limit (or below the smallest measured value when no limit was given).
    /// </summary>
    public static SvgImage MarkerAgainstMeasured(Panel panel, FeatureSummary feature, string label)
    {
        var matrix = panel.Matrix;
        var y = panel.Measured!.Values;
        var measuredX = new List<double>();
        var measuredY = new List<double>();
        var belowY = new List<double>();
        var belowLimits = new List<double>();
        double smallest = double.PositiveInfinity;
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            var state = matrix.State(feature.FeatureIndex, s);
            float value = matrix.Value(feature.FeatureIndex, s);
            if (state == CellState.Measured && !float.IsNaN(value))
            {
                measuredX.Add(value);
                measuredY.Add(y[s]);
                smallest = Math.Min(smallest, value);
            }
            else if (state == CellState.BelowDetection)
            {
                belowY.Add(y[s]);
                belowLimits.Add(value);
            }
        }
        var series = new List<XYSeries> { new("Measured", measuredX, measuredY, XYSeriesStyle.Points) };
        if (belowY.Count > 0)
        {
            double place = double.IsFinite(smallest) ? smallest : 0;
            var belowX = belowLimits.Select(limit => float.IsNaN((float)limit) ? place : limit).ToList();
            series.Add(new XYSeries(Invariant($"Below detection ({belowY.Count}), at the limit"), belowX, belowY, XYSeriesStyle.Points));
        }
        return XYChart.Render(new XYChartOptions(label, "Marker value", "Outcome: " + panel.OutcomeColumn, Width: 520, Height: 420), series);
    }

    /// <summary>
    /// The points of the observed-against-out-of-bag-predicted scatter of a measured outcome, in
    /// panel order: every sample some tree of the forest on all samples left out, its out-of-bag
    /// prediction against its observed value. No sample id travels with them.
    /// </summary>
    public static (double[] Predicted, double[] Observed) OutOfBagPoints(Panel panel, ReferenceForestSummary forest)
    {
        var observed = panel.Measured!.Values;
        var predictions = forest.OutOfBagPredictions;
        var x = new List<double>(predictions.Count);
        var y = new List<double>(predictions.Count);
        for (int s = 0; s < predictions.Count; s++)
        {
            if (double.IsNaN(predictions[s])) continue;
            x.Add(predictions[s]);
            y.Add(observed[s]);
        }
        return (x.ToArray(), y.ToArray());
    }

    /// <summary>Observed against out-of-bag predicted, one point per sample, with the identity line over the joint range.</summary>
    public static SvgImage ObservedAgainstOutOfBag(Panel panel, ReferenceForestSummary forest)
    {
        var (predicted, observed) = OutOfBagPoints(panel, forest);
        var series = new List<XYSeries> { new(Invariant($"Samples ({predicted.Length})"), predicted, observed, XYSeriesStyle.Points) };
        if (predicted.Length > 0)
        {
            double low = Math.Min(predicted.Min(), observed.Min()), high = Math.Max(predicted.Max(), observed.Max());
            series.Add(new XYSeries("Observed = predicted", [low, high], [low, high], XYSeriesStyle.DashedLine));
        }
        return XYChart.Render(new XYChartOptions("Observed against out-of-bag predicted " + panel.OutcomeColumn,
            "Out-of-bag predicted " + panel.OutcomeColumn, "Observed " + panel.OutcomeColumn, Width: 560, Height: 460), series);
    }

    /// <summary>The scatter's caption, with the forest's out-of-bag R² and how many samples it rests on.</summary>
    public static string ObservedAgainstOutOfBagCaption(Panel panel, ReferenceForestSummary forest)
    {
        int plotted = OutOfBagPoints(panel, forest).Predicted.Length;
        string rSquared = forest.OutOfBagRSquared is { } r2 && double.IsFinite(r2) ? Invariant($"{r2:0.000}") : "not defined";
        return "Each point is one sample: its observed outcome against the prediction of the forest grown on all samples and features, averaged over the trees that did not see it (out of bag). "
            + Invariant($"Out-of-bag R² {rSquared} over these {plotted} samples (1 - residual / total sum of squares about their mean). ")
            + "The dashed line is observed = predicted. Forest predictions shrink towards the mean, so the cloud is flatter than that line; "
            + "points far from it are samples the features do not explain. "
            + "A forest over all features is diluted by the many unrelated to the outcome, so this R² is usually below what a short panel reaches on the panel-size curve.";
    }

    /// <summary>
    /// Kaplan-Meier curves of the samples at or above the marker's median and those below it
    /// (below-detection cells count as below), with the log-rank p-value in the legend.
    /// </summary>
    public static SvgImage MarkerSurvival(Panel panel, FeatureSummary feature, string label)
    {
        var matrix = panel.Matrix;
        var followUp = panel.FollowUp!;
        var kept = new List<int>();
        var values = new List<double>();
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            var state = matrix.State(feature.FeatureIndex, s);
            float value = matrix.Value(feature.FeatureIndex, s);
            if (state == CellState.BelowDetection) { kept.Add(s); values.Add(double.NegativeInfinity); }
            else if (state == CellState.Measured && !float.IsNaN(value)) { kept.Add(s); values.Add(value); }
        }
        var sorted = values.Order().ToArray();
        double median = sorted.Length == 0 ? 0 : sorted.Length % 2 == 1 ? sorted[sorted.Length / 2] : 0.5 * (sorted[sorted.Length / 2 - 1] + sorted[sorted.Length / 2]);
        var time = kept.Select(s => followUp.Times[s]).ToArray();
        var events = kept.Select(s => followUp.Events[s]).ToArray();
        var high = values.Select(v => v >= median).ToArray();
        var series = new List<XYSeries>();
        string p = "";
        if (high.Any(h => h) && high.Any(h => !h))
        {
            var test = LogRankTest.TwoGroups(time, events, high);
            p = ", log-rank p " + ReportNumber.Significant(test.PValue, 2);
        }
        foreach (bool group in new[] { false, true })
        {
            var t = time.Where((_, i) => high[i] == group).ToArray();
            var e = events.Where((_, i) => high[i] == group).ToArray();
            if (t.Length == 0) continue;
            series.Add(KaplanMeierSteps.Series((group ? "At or above the median" : "Below the median") + Invariant($" ({t.Length})"), KaplanMeier.Estimate(t, e),
                group ? XYSeriesStyle.Line : XYSeriesStyle.DashedLine));
        }
        return XYChart.Render(new XYChartOptions(label + p, "Time (" + followUp.TimeColumn + ")", "Share without the event (Kaplan-Meier)",
            YMinimum: 0, YMaximum: 1, Width: 520, Height: 420), series);
    }

    /// <summary>
    /// Kaplan-Meier curves of the locked panel's discovery risk groups: the samples split at the
    /// median of the panel forest's out-of-bag risk scores, as `apply` splits a new cohort.
    /// </summary>
    public static SvgImage DiscoveryRiskGroups(Panel panel, LockedFollowUpPerformance groups) =>
        KaplanMeierSteps.RiskGroups("Discovery risk groups", "Time (" + panel.FollowUp!.TimeColumn + ")", groups);

    public static string DiscoveryRiskGroupsCaption(LockedFollowUpPerformance groups)
    {
        string test = groups.LogRank is { } logRank
            ? "Log-rank test of high against low risk: chi-square " + ReportNumber.Significant(logRank.ChiSquare, 3) + ", p " + KaplanMeierSteps.LogRankP(logRank.PValue) + ". "
            : "One group is empty, so there is no log-rank test. ";
        return Invariant($"Kaplan-Meier estimates of the share of discovery samples still without the event, in the locked panel's two risk groups ({groups.HighRiskCount} high, {groups.SampleCount - groups.HighRiskCount} low): ")
            + "each sample is scored by the trees of the panel's forest that did not see it (out of bag) and is high risk when its score is above the median of those scores, the cut `apply` uses on a new cohort. "
            + test
            + "The markers were chosen on these same samples, so the separation is optimistic: only an independent cohort shows how well the groups separate, and separated curves show ranking, not calibrated risk.";
    }

    /// <summary>
    /// Every feature's position in the screen order against its single-marker effect: Spearman's
    /// rho for a measured outcome, Harrell's C for follow-up.
    /// </summary>
    public static SvgImage RankAgainstEffect(ScreenResult result)
    {
        bool measured = result.Kind == OutcomeKind.Measured;
        return measured
            ? ScreenReportCharts.RankAgainst(result, "Spearman's rho with the outcome", "Spearman's rho with the outcome",
                feature => result.MeasuredMarkers[feature].Rho, -1, new ReferenceLine(ChartAxis.Y, 0, "rho 0 (no monotone relation)"))
            : ScreenReportCharts.RankAgainst(result, "single-marker concordance (Harrell's C)", "Harrell's C (marker as a risk score)",
                feature => result.FollowUpMarkers[feature].Concordance.Concordance, 0, new ReferenceLine(ChartAxis.Y, 0.5, "C 0.5 (no separation)"));
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
