using System.Globalization;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// The HTML page of `omicsscreen apply` for a panel locked on a measured outcome: the panel, the
/// predictions, and with a known outcome R², RMSE, the calibration line and its plot; the scale
/// checks and the cautions. Sample ids appear only when asked for.
/// </summary>
public static class MeasuredApplyReport
{
    public static string Build(LockedMeasuredPanel model, LockedMeasuredScores scores, LockedMeasuredPerformance? performance, string matrixPath,
        bool showSampleIds, IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string> displayNames)
    {
        var html = ApplyReport.BeginPage(matrixPath, "Read before using these predictions", [.. discoveryOverlap, .. Cautions(scores, performance)],
            new("Outcome", $"{model.OutcomeName}, a measured quantity"), model.MarkerNames, displayNames, model.Trees.Count,
            [
                new("Prediction", "the mean over the trees of the discovery samples' mean outcome in the leaf a sample reaches (a regression forest, Breiman 2001)"),
                new("Discovery out-of-bag R²", Number(model.OutOfBagRSquared)),
                new("Discovery out-of-bag RMSE", Number(model.OutOfBagRootMeanSquaredError)),
            ],
            model.Provenance);

        html.BeginSection("Predictions");
        var sorted = scores.Predictions.Order().ToArray();
        html.DefinitionList(
        [
            new("Samples", scores.SampleCount.ToString(CultureInfo.InvariantCulture)),
            new("Predictions, lowest to highest", sorted.Length == 0 ? "none" : $"{Number(sorted[0])} to {Number(sorted[^1])}"),
        ]);
        if (showSampleIds)
        {
            var table = new HtmlTable($"Every sample's predicted {model.OutcomeName}", [new("sample"), new("predicted", ColumnAlignment.Numeric)]);
            for (int s = 0; s < scores.SampleCount; s++) table.AddRow(scores.SampleIds[s], Number(scores.Predictions[s]));
            html.Table(table);
        }
        else
        {
            html.Paragraph($"Per-sample predictions are in {ApplyResultFiles.Scores}; this page shows no sample ids (pass --show-sample-ids to list them).");
        }
        html.EndSection();

        if (performance is not null) AddPerformance(html, model, performance);

        ApplyReport.AddScaleCheck(html, scores.Warnings.Select(w => w.Message).ToList());
        return html.EndDocument();
    }

    private static void AddPerformance(HtmlBuilder html, LockedMeasuredPanel model, LockedMeasuredPerformance performance)
    {
        html.BeginSection("Performance on this cohort");
        var line = performance.Calibration;
        html.DefinitionList(
        [
            new("Samples", performance.SampleCount.ToString(CultureInfo.InvariantCulture)),
            new("R²", $"{Number(performance.RSquared)} (1 - residual / total sum of squares about this cohort's mean; 0 is no better than predicting that mean)"),
            new("RMSE", $"{Number(performance.RootMeanSquaredError)} ({model.OutcomeName} units)"),
            new("Calibration slope", $"{Number(line.Slope)} (95% CI {Number(line.SlopeInterval.Lower)} to {Number(line.SlopeInterval.Upper)}; 1 is ideal)"),
            new("Calibration intercept", $"{Number(line.Intercept)} (95% CI {Number(line.InterceptInterval.Lower)} to {Number(line.InterceptInterval.Upper)}; 0 is ideal with slope 1)"),
        ]);
        html.Figure(CalibrationPlot(model, performance),
            "Observed against predicted, one point per sample. The dashed line is perfect calibration (observed = predicted); the solid line is the least-squares fit of observed on predicted. "
            + "A fitted slope below 1 means predictions spread more than the outcome does (over-fitting in discovery); above 1, less. Forest predictions shrink towards the discovery mean, so a slope above 1 is common.");
        var groups = new HtmlTable($"Calibration: groups of samples by predicted {model.OutcomeName}",
            [new("predicted range"), new("mean predicted", ColumnAlignment.Numeric), new("mean observed", ColumnAlignment.Numeric), new("samples", ColumnAlignment.Numeric)]);
        foreach (var bin in performance.Groups)
            groups.AddRow($"{Number(bin.LowestPredicted)} to {Number(bin.HighestPredicted)}", Number(bin.MeanPredicted), Number(bin.MeanObserved),
                bin.SampleCount.ToString(CultureInfo.InvariantCulture));
        html.Table(groups);
        html.EndSection();
    }

    /// <summary>The calibration plot: every sample, the identity line and the fitted line over the predictions' range.</summary>
    public static SvgImage CalibrationPlot(LockedMeasuredPanel model, LockedMeasuredPerformance performance)
    {
        var predicted = performance.Predicted;
        var observed = performance.Observed;
        double low = Math.Min(predicted.Min(), observed.Min()), high = Math.Max(predicted.Max(), observed.Max());
        var series = new List<XYSeries>
        {
            new("Samples", predicted, observed, XYSeriesStyle.Points),
            new("Perfect calibration (observed = predicted)", [low, high], [low, high], XYSeriesStyle.DashedLine),
        };
        var line = performance.Calibration;
        if (double.IsFinite(line.Slope))
        {
            double from = predicted.Min(), to = predicted.Max();
            series.Add(new XYSeries(FormattableString.Invariant($"Fitted: observed = {line.Intercept:G3} + {line.Slope:G3} x predicted"),
                [from, to], [line.Intercept + line.Slope * from, line.Intercept + line.Slope * to], XYSeriesStyle.Line));
        }
        return XYChart.Render(new XYChartOptions("Calibration: observed against predicted " + model.OutcomeName,
            "Predicted " + model.OutcomeName, "Observed " + model.OutcomeName, Width: 560, Height: 460), series);
    }

    private static List<string> Cautions(LockedMeasuredScores scores, LockedMeasuredPerformance? performance)
    {
        var cautions = new List<string>
        {
            "Research use only: a locked panel is a candidate for validation, not a diagnostic test or a measurement of the outcome.",
            "Predictions are averages of discovery samples, so they shrink towards the discovery mean; read the calibration line before reading a prediction as a value of the outcome.",
            "Only an independent cohort, measured as it will be in use, shows how well the panel predicts; a cohort from the discovery centres is not enough.",
        };
        cautions.AddRange(ApplyReport.ScaleCautions(scores.Warnings, "the predictions", "the predictions"));
        if (performance is null)
            cautions.Add("No outcome was given, so nothing here says how well the panel works on this cohort.");
        else if (performance.SampleCount < 50)
            cautions.Add("Fewer than 50 samples: R² and the calibration line are uncertain (see their intervals) and the groups are coarse.");
        return cautions;
    }

    private static string Number(double value) => double.IsNaN(value) ? "not defined" : value.ToString("0.###", CultureInfo.InvariantCulture);
}
