using System.Globalization;
using System.Text;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The figures of the screen report, each built from result records only: importance with its
/// spread, selection frequency against order, out-of-bag error against trees, the panel-size
/// curve, per-class values of the top markers and the shortlist's correlations.
/// </summary>
internal static class ScreenReportCharts
{
    public const int ImportanceFeatureLimit = 20;
    public const int FrequencyFeatureLimit = 100;
    public const int StripMarkerLimit = 12;
    public const int HeatMapMinimum = 2;
    public const int HeatMapMaximum = 40;

    public const string FeatureAxisLabel = "Feature (in screen order)";
    public const string CorrectedAxisLabel = "Corrected impurity importance (Gini decrease, mean ± SD over repeats)";
    public const string PermutationAxisLabel = "Permutation importance (out-of-bag accuracy drop, mean ± SD over repeats)";
    public const string OrderAxisLabel = "Position in screen order (1 = best)";
    public const string FrequencyAxisLabel = "Selection frequency (fraction of repeats)";
    public const string TreesAxisLabel = "Number of trees";
    public const string ErrorAxisLabel = "Out-of-bag error (fraction misclassified)";
    public const string PanelSizeAxisLabel = "Panel size (number of markers)";
    public const string ClassAxisLabel = "Class";

    /// <summary>The features drawn in the importance charts: the first of the screen order.</summary>
    public static IReadOnlyList<FeatureSummary> TopFeatures(ScreenResult result, int limit)
    {
        int count = Math.Min(limit, result.Order.Count);
        var top = new FeatureSummary[count];
        for (int i = 0; i < count; i++) top[i] = result.Features[result.Order[i]];
        return top;
    }

    public static SvgImage CorrectedImportance(ScreenResult result) =>
        ImportanceChart(result, "Corrected impurity importance", CorrectedAxisLabel, f => (f.CorrectedMean, f.CorrectedSd));

    public static SvgImage PermutationImportance(ScreenResult result) =>
        ImportanceChart(result, "Permutation importance", PermutationAxisLabel, f => (f.PermutationMean, f.PermutationSd));

    private static SvgImage ImportanceChart(ScreenResult result, string measure, string axisLabel, Func<FeatureSummary, (double Mean, double Sd)> spread)
    {
        var top = TopFeatures(result, ImportanceFeatureLimit);
        var items = new DotIntervalItem[top.Count];
        for (int i = 0; i < items.Length; i++)
        {
            var (mean, sd) = spread(top[i]);
            items[i] = new DotIntervalItem(top[i].Feature, mean, mean - sd, mean + sd);
        }
        return DotIntervalChart.Render(new DotIntervalChartOptions(
            Invariant($"{measure} of the top {items.Length} features"), axisLabel, FeatureAxisLabel,
            ReferenceValue: 0, LegendText: "Dot: mean over repeats; bar: ± 1 SD", Width: 820), items);
    }

    public static SvgImage SelectionFrequency(ScreenResult result)
    {
        int count = Math.Min(FrequencyFeatureLimit, result.Order.Count);
        var positions = new double[count];
        var frequencies = new double[count];
        for (int i = 0; i < count; i++)
        {
            positions[i] = i + 1;
            frequencies[i] = result.Features[result.Order[i]].SelectionFrequency;
        }
        double threshold = result.Settings.Options.FrequencyThreshold;
        return XYChart.Render(
            new XYChartOptions(Invariant($"Selection frequency of the first {count} features"), OrderAxisLabel, FrequencyAxisLabel,
                YMinimum: 0, YMaximum: 1),
            [new XYSeries("Feature", positions, frequencies, XYSeriesStyle.Points)],
            threshold > 0 ? [new ReferenceLine(ChartAxis.Y, threshold, Invariant($"Shortlist threshold {threshold:0.##}"))] : []);
    }

    public static SvgImage OutOfBagError(ReferenceForestSummary forest, OutcomeKind kind = OutcomeKind.Classes)
    {
        var curve = forest.ErrorCurve;
        var trees = new double[curve.Count];
        var errors = new double[curve.Count];
        for (int t = 0; t < curve.Count; t++)
        {
            trees[t] = t + 1;
            errors[t] = curve[t];
        }
        return XYChart.Render(
            new XYChartOptions("Out-of-bag error of the forest on all samples", TreesAxisLabel, OutcomeKindReport.ErrorAxisLabel(kind), YMinimum: 0),
            [new XYSeries("Out-of-bag error", trees, errors)]);
    }

    /// <summary>The y-axis label of the panel-size curve: AUC for two classes, accuracy for more.</summary>
    public static string PanelSizeScoreLabel(PanelSizeCurve curve) =>
        "Held-out " + OutcomeKindReport.AxisMetricName(curve.Metric) + " (mean over outer folds)";

    /// <summary>
    /// The panel-size curve on a log-spaced size axis (the sizes grow roughly geometrically), with
    /// the level a panel without information reaches (AUC 0.5, or the largest class's share for
    /// accuracy) and the size of the locked panel.
    /// </summary>
    public static SvgImage PanelSize(PanelSizeCurve curve, Panel panel, int lockedPanelSize)
    {
        int count = curve.Points.Count;
        var sizes = new double[count];
        var selectionAware = new double[count];
        var selectionAwareLow = new double[count];
        var selectionAwareHigh = new double[count];
        var optimistic = new double[count];
        var optimisticLow = new double[count];
        var optimisticHigh = new double[count];
        double recommendedScore = double.NaN;
        for (int i = 0; i < count; i++)
        {
            var point = curve.Points[i];
            sizes[i] = point.PanelSize;
            selectionAware[i] = point.SelectionAwareAuc;
            selectionAwareLow[i] = point.SelectionAwareAuc - point.SelectionAwareAucSd;
            selectionAwareHigh[i] = point.SelectionAwareAuc + point.SelectionAwareAucSd;
            optimistic[i] = point.OptimisticAuc;
            optimisticLow[i] = point.OptimisticAuc - point.OptimisticAucSd;
            optimisticHigh[i] = point.OptimisticAuc + point.OptimisticAucSd;
            if (point.PanelSize == curve.RecommendedSize) recommendedScore = point.SelectionAwareAuc;
        }
        var markers = double.IsFinite(recommendedScore)
            ? new[] { new PointMarker(curve.RecommendedSize, recommendedScore, Invariant($"Recommended size: {curve.RecommendedSize}")) }
            : [];
        var lines = new List<ReferenceLine> { new(ChartAxis.Y, OutcomeKindReport.ChanceLevel(curve, panel), OutcomeKindReport.ChanceLabel(curve)) };
        if (lockedPanelSize > 0)
            lines.Add(new ReferenceLine(ChartAxis.X, lockedPanelSize, Invariant($"Locked panel: {lockedPanelSize} markers")));
        return XYChart.Render(
            new XYChartOptions("Panel-size curve: selection-aware and optimistic estimates", PanelSizeAxisLabel, PanelSizeScoreLabel(curve), Width: 820,
                XScale: AxisScaleKind.Log10, YMaximum: 1),
            [
                new XYSeries("Selection-aware (markers chosen inside each training part)", sizes, selectionAware, XYSeriesStyle.LineAndPoints, selectionAwareLow, selectionAwareHigh),
                new XYSeries("Optimistic (markers chosen once on all samples)", sizes, optimistic, XYSeriesStyle.DashedLine, optimisticLow, optimisticHigh),
            ],
            lines,
            markers);
    }

    public const string FirstComponentAxisLabel = "First principal component";
    public const string SecondComponentAxisLabel = "Second principal component";
    public const string AucAxisLabel = "Single-marker AUC (positive class against the rest)";
    public const string ImportanceAxisLabel = "Corrected impurity importance (mean over repeats)";
    public const int RankAucFeatureLimit = 5000;
    public const int DistributionPointLimit = 1000;

    /// <summary>Samples on the first two principal components, one colour per level of <paramref name="grouping"/>.</summary>
    /// <summary>
    /// The ROC curve of the pooled held-out probabilities of the locked procedure: each distinct
    /// probability, from the highest, is a threshold; ties move the curve diagonally (common practice).
    /// </summary>
    public static SvgImage LockedPanelRoc(PanelSizeCurve curve)
    {
        var scores = curve.LockedOutOfFoldScores;
        var positive = curve.LockedOutOfFoldPositive;
        var order = Enumerable.Range(0, scores.Count).OrderByDescending(i => scores[i]).ThenBy(i => i).ToArray();
        int positives = positive.Count(p => p), negatives = positive.Count - positives;
        var falsePositiveRate = new List<double> { 0 };
        var truePositiveRate = new List<double> { 0 };
        int truePositives = 0, falsePositives = 0;
        for (int k = 0; k < order.Length; k++)
        {
            if (positive[order[k]]) truePositives++;
            else falsePositives++;
            if (k + 1 < order.Length && scores[order[k + 1]] == scores[order[k]]) continue;
            falsePositiveRate.Add(negatives == 0 ? 0 : (double)falsePositives / negatives);
            truePositiveRate.Add(positives == 0 ? 0 : (double)truePositives / positives);
        }
        const string title = "Locked panel: cross-validated ROC";
        return XYChart.Render(
            new XYChartOptions(title, "False positive rate (1 - specificity)", "True positive rate (sensitivity)",
                YMinimum: 0, YMaximum: 1, Width: 520, Height: 480),
            [
                new XYSeries(Invariant($"Held-out samples (AUC {curve.LockedEstimate:0.000})"), falsePositiveRate, truePositiveRate, XYSeriesStyle.Line),
                new XYSeries("Chance", [0.0, 1.0], [0.0, 1.0], XYSeriesStyle.DashedLine),
            ]);
    }

    public static SvgImage SampleMap(SamplePrincipalComponents components, string title, IReadOnlyList<string> levelNames, ReadOnlySpan<int> sampleLevels)
    {
        var series = new List<XYSeries>(levelNames.Count);
        for (int level = 0; level < levelNames.Count; level++)
        {
            var x = new List<double>();
            var y = new List<double>();
            for (int s = 0; s < sampleLevels.Length; s++)
            {
                if (sampleLevels[s] != level) continue;
                x.Add(components.First[s]);
                y.Add(components.Second[s]);
            }
            series.Add(new XYSeries(levelNames[level], x, y, XYSeriesStyle.Points));
        }
        return XYChart.Render(new XYChartOptions(title,
            Invariant($"{FirstComponentAxisLabel} ({components.FirstShare:0.0%} of variance)"),
            Invariant($"{SecondComponentAxisLabel} ({components.SecondShare:0.0%} of variance)"), Width: 620, Height: 480), series);
    }

    /// <summary>
    /// Every feature's position in the screen order (log axis) against its single-marker AUC: where the
    /// forest and a one-marker test agree, and the markers the forest ranks high for reasons a single test misses.
    /// </summary>
    public static SvgImage RankAgainstAuc(ScreenResult result) =>
        RankAgainst(result, "single-marker AUC", AucAxisLabel, feature => result.Univariate.Row(feature, 0).Auc, 0,
            new ReferenceLine(ChartAxis.Y, 0.5, "AUC 0.5 (no separation)"));

    /// <summary>The first features of the screen order (log axis) against a single-marker effect, shortlisted ones apart.</summary>
    internal static SvgImage RankAgainst(ScreenResult result, string effectName, string axisLabel, Func<int, double> effectOf,
        double yMinimum, ReferenceLine noEffect)
    {
        int count = Math.Min(RankAucFeatureLimit, result.Order.Count);
        var shortlisted = new HashSet<int>(result.Shortlist.Select(e => e.Forest.FeatureIndex));
        var inX = new List<double>();
        var inY = new List<double>();
        var outX = new List<double>();
        var outY = new List<double>();
        for (int i = 0; i < count; i++)
        {
            int feature = result.Order[i];
            double effect = effectOf(feature);
            if (!double.IsFinite(effect)) continue;
            (shortlisted.Contains(feature) ? inX : outX).Add(i + 1);
            (shortlisted.Contains(feature) ? inY : outY).Add(effect);
        }
        return XYChart.Render(
            new XYChartOptions(Invariant($"Screen order against {effectName} ({count} features)"), OrderAxisLabel, axisLabel,
                XScale: AxisScaleKind.Log10, YMinimum: yMinimum, YMaximum: 1, Width: 820),
            [new XYSeries("Not shortlisted", outX, outY, XYSeriesStyle.Points), new XYSeries("Shortlisted", inX, inY, XYSeriesStyle.Points)],
            [noEffect]);
    }

    /// <summary>
    /// The observed corrected importances (mean over repeats) of the features beside those of the
    /// decoys, each decoy slot's mean over repeats; null without decoys. Large groups are thinned to
    /// evenly spaced quantiles so the page stays small.
    /// </summary>
    public static SvgImage? ImportanceAgainstDecoys(ScreenResult result)
    {
        var repeats = result.Repeats;
        if (repeats.DecoyCount == 0 || repeats.RepeatCount == 0) return null;
        var decoys = new double[repeats.DecoyCount];
        for (int r = 0; r < repeats.RepeatCount; r++)
            for (int d = 0; d < repeats.DecoyCount; d++) decoys[d] += repeats.DecoyCorrected[r * repeats.DecoyCount + d] / repeats.RepeatCount;
        var shortlisted = new HashSet<int>(result.Shortlist.Select(e => e.Forest.FeatureIndex));
        var others = new List<double>();
        var chosen = new List<double>();
        foreach (var feature in result.Features)
            (shortlisted.Contains(feature.FeatureIndex) ? chosen : others).Add(feature.CorrectedMean);
        var groups = new List<StripGroup>
        {
            new("Decoys (permuted copies)", Thinned(decoys), DrawnFrom: decoys.Length),
            new("Features not shortlisted", Thinned(others), DrawnFrom: others.Count),
        };
        if (chosen.Count > 0) groups.Add(new StripGroup("Shortlisted markers", Thinned(chosen), DrawnFrom: chosen.Count));
        return StripBoxChart.Render(new StripBoxChartOptions("Observed importances against the decoys", ImportanceAxisLabel, "Kind",
            Width: 820, Height: 440), groups);
    }

    /// <summary>At most <see cref="DistributionPointLimit"/> evenly spaced order statistics, so box and points keep the shape of the whole.</summary>
    private static double[] Thinned(IReadOnlyList<double> values)
    {
        var sorted = values.Where(double.IsFinite).Order().ToArray();
        if (sorted.Length <= DistributionPointLimit) return sorted;
        var thinned = new double[DistributionPointLimit];
        for (int i = 0; i < thinned.Length; i++)
            thinned[i] = sorted[(int)Math.Round((double)i * (sorted.Length - 1) / (thinned.Length - 1))];
        return thinned;
    }

    public static SvgImage MarkerByClass(Panel panel, FeatureSummary feature, bool showSampleIds)
    {
        var values = MarkerValues.Of(panel, feature.FeatureIndex, labelPoints: showSampleIds);
        var scale = values.AllMeasuredPositive ? AxisScaleKind.Log10 : AxisScaleKind.Linear;
        string axis = scale == AxisScaleKind.Log10 ? "Value (log scale)" : "Value (linear scale)";
        string? description = showSampleIds ? DescribeWithSampleIds(panel, feature.FeatureIndex) : null;
        return StripBoxChart.Render(new StripBoxChartOptions(feature.Feature, axis, ClassAxisLabel, description, scale, values.DetectionLimit,
            Width: 520, Height: 420), values.Groups);
    }

    public static SvgImage Correlations(ScreenResult result)
    {
        var labels = new string[result.Shortlist.Count];
        for (int i = 0; i < labels.Length; i++) labels[i] = result.Shortlist[i].Forest.Feature;
        return HeatMapChart.Render(new HeatMapOptions("Spearman correlation between shortlisted markers", "Spearman correlation (rho)",
            "Shortlisted marker", "Shortlisted marker"), labels, labels, result.ShortlistCorrelations);
    }

    /// <summary>
    /// Only with the sample-id flag: the chart's accessible description lists each class's samples
    /// with their values, so identifiers never appear as page text.
    /// </summary>
    private static string DescribeWithSampleIds(Panel panel, int feature)
    {
        var matrix = panel.Matrix;
        var outcome = panel.Outcome;
        var classes = outcome.SampleClasses;
        var text = new StringBuilder();
        text.Append("Values by sample. ");
        for (int c = 0; c < outcome.ClassCount; c++)
        {
            text.Append(outcome.ClassNames[c]).Append(':');
            for (int sample = 0; sample < matrix.SampleCount; sample++)
            {
                if (classes[sample] != c) continue;
                var state = matrix.State(feature, sample);
                text.Append(' ').Append(matrix.SampleIds[sample]).Append(' ');
                text.Append(state switch
                {
                    CellState.Measured => ReportNumber.Significant(matrix.Value(feature, sample), 4),
                    CellState.BelowDetection => "below detection",
                    _ => "missing",
                });
                text.Append(';');
            }
            text.Append(' ');
        }
        return text.ToString().TrimEnd();
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
