using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Effects;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The report's "How each marker acts" section (issue 19, parts 4-5): one small partial-dependence
/// chart with its ICE band per shortlisted marker (up to <see cref="ChartLimit"/>), the partner
/// rule in words, and a two-marker heat map for each of the strongest named pairs.
/// </summary>
public static class EffectReportSection
{
    /// <summary>Curves drawn at most; every curve is in effect_shapes.tsv.</summary>
    public const int ChartLimit = 20;

    public static void Write(HtmlBuilder html, ScreenReportInput input)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentNullException.ThrowIfNull(input);
        var result = input.Result;
        var effects = result.Effects;
        if (effects.Markers.Count == 0) return;
        var panel = input.Panel;
        string prediction = EffectTables.PredictionLabel(result.Kind, panel.Kind == OutcomeKind.Classes ? panel.Outcome.ClassNames[panel.Outcome.PositiveClass] : "");
        html.BeginSection("How each marker acts");
        html.Paragraph("Partial dependence (Friedman 2001): the forest on all samples predicts every sample again with the marker set to each value of its observed range, "
            + "and the line is the mean of those predictions; the band holds the middle 80% of the samples' own curves (10th to 90th percentile, individual conditional expectation, Goldstein et al. 2015). "
            + "A wide band means the marker acts differently in different samples, often through another marker. "
            + string.Create(CultureInfo.InvariantCulture, $"A curve whose range stays under {ReportNumber.Significant(effects.SmallestEffect, 3)} (twice the largest range of {effects.UnrelatedFeatures.Count} features with no evidence, in the same forest) is read as \"none on its own\". ")
            + "This is the forest's view of the data, not a causal effect, and correlated markers share and blur it.");
        int drawn = 0;
        foreach (var entry in result.Shortlist)
        {
            if (drawn == ChartLimit) break;
            if (effects.Of(entry.Forest.FeatureIndex) is not { } effect || effect.Curve.GridCount < 2) continue;
            string label = input.FeatureLabels.Label(entry.Forest.FeatureIndex, entry.Forest.Feature);
            html.Figure(Curve(effect, label, prediction), label + ": " + effect.Shape.Description + Partners(effect, result, input.FeatureLabels) + ".");
            drawn++;
        }
        if (effects.Markers.Count > drawn)
            html.Paragraph(string.Create(CultureInfo.InvariantCulture, $"Curves of the other {effects.Markers.Count - drawn} shortlisted markers are in {EffectTables.FileName}."));

        var scan = effects.Partners;
        html.Paragraph(scan.Markers.Count < 2
            ? "Interaction partners need at least two shortlisted markers."
            : string.Create(CultureInfo.InvariantCulture,
                $"Partners in the forest: a forest on the panel plus {scan.CopiesPerMarker} copies of each of the first {scan.Markers.Count} shortlisted markers, each shuffled within strata of the outcome, ")
                + "counts how often two markers split directly one below the other against what their own split counts predict. "
                + string.Create(CultureInfo.InvariantCulture,
                    $"Two markers are named partners when that score beats the highest any marker reaches with another marker's copy ({ReportNumber.Fixed(scan.NullLargest, 2)} here, over {scan.NullCount} marker-copy pairs). ")
                + "On unrelated markers this names a pair in under 5% of panels; markers that each act on their own are named more often (see the README).");
        foreach (var surface in effects.Surfaces)
        {
            string first = input.FeatureLabels.Label(surface.FirstFeature, result.Features[surface.FirstFeature].Feature);
            string second = input.FeatureLabels.Label(surface.SecondFeature, result.Features[surface.SecondFeature].Feature);
            html.Figure(Surface(surface, first, second, prediction),
                $"Two-marker partial dependence of {first} (rows) and {second} (columns): the forest's mean prediction with both set to the values shown. "
                + "Colour that changes along one axis by an amount that depends on the other is the pair acting together.");
        }
        html.EndSection();
    }

    private static string Partners(MarkerEffect effect, Screening.Screen.ScreenResult result, FeatureLabels labels) =>
        effect.Partners.Count == 0 ? "" : "; acts with " + string.Join(", ", effect.Partners.Select(p => labels.Label(p, result.Features[p].Feature)));

    private static SvgImage Curve(MarkerEffect effect, string label, string prediction)
    {
        var curve = effect.Curve;
        var series = new XYSeries("Partial dependence (band: 10th-90th percentile of samples' curves)", curve.GridValues, curve.Average, XYSeriesStyle.LineAndPoints,
            curve.Lower, curve.Upper);
        return XYChart.Render(new XYChartOptions(label, label + " (measured value)", prediction, Width: 420, Height: 300), [series]);
    }

    private static SvgImage Surface(EffectSurface surface, string first, string second, string prediction)
    {
        var values = new double[surface.FirstGrid.Length, surface.SecondGrid.Length];
        double low = double.PositiveInfinity, high = double.NegativeInfinity;
        for (int i = 0; i < surface.FirstGrid.Length; i++)
            for (int j = 0; j < surface.SecondGrid.Length; j++)
            {
                values[i, j] = surface.At(i, j);
                low = Math.Min(low, values[i, j]);
                high = Math.Max(high, values[i, j]);
            }
        if (!(high > low)) high = low + 1e-9;
        static string Grid(double v) => v.ToString("G3", CultureInfo.InvariantCulture);
        return HeatMapChart.Render(new HeatMapOptions($"{first} with {second}", prediction, first, second, Minimum: low, Maximum: high, ShowValues: false),
            surface.FirstGrid.Select(Grid).ToArray(), surface.SecondGrid.Select(Grid).ToArray(), values);
    }
}
