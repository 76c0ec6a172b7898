using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The effects tables of a screen (issue 19, parts 4-5): effect_shapes.tsv (each shortlisted
/// marker's partial-dependence curve with its band) and the shortlist's effect_shape and
/// forest_partners columns; and the words that stand for a marker's direction in the report.
/// </summary>
public static class EffectTables
{
    public const string FileName = "effect_shapes.tsv";

    private static readonly NumberFormat Value = NumberFormat.Significant(6);

    /// <summary>One row per shortlisted marker and grid point: rank, marker, grid value, partial dependence, band low and high.</summary>
    public static int WriteEffectShapes(TextWriter writer, ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var rows = new List<(int Rank, string Marker, double Grid, double Average, double Low, double High)>();
        foreach (var entry in result.Shortlist)
        {
            if (result.Effects.Of(entry.Forest.FeatureIndex) is not { } effect) continue;
            var curve = effect.Curve;
            for (int g = 0; g < curve.GridCount; g++)
                rows.Add((entry.Rank, entry.Forest.Feature, curve.GridValues[g], curve.Average[g], curve.Lower[g], curve.Upper[g]));
        }
        var columns = new List<TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>>
        {
            TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>.Integer("rank", r => r.Rank),
            TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>.Text("marker", r => r.Marker),
            TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>.Number("grid_value", r => r.Grid, Value),
            TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>.Number("partial_dependence", r => r.Average, Value),
            TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>.Number("band_low", r => r.Low, Value),
            TsvColumn<(int Rank, string Marker, double Grid, double Average, double Low, double High)>.Number("band_high", r => r.High, Value),
        };
        return new TsvTableWriter<(int Rank, string Marker, double Grid, double Average, double Low, double High)>(columns).Write(writer, rows);
    }

    /// <summary>The shortlist's effects columns: the shape in words and the named forest partners ("; "-separated).</summary>
    public static IEnumerable<TsvColumn<ShortlistEntry>> ShortlistColumns(ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        yield return TsvColumn<ShortlistEntry>.Text("effect_shape", e => result.Effects.Of(e.Forest.FeatureIndex)?.Shape.Description ?? "");
        yield return TsvColumn<ShortlistEntry>.Text("forest_partners", e => string.Join("; ", PartnerNames(result, e.Forest.FeatureIndex)));
    }

    /// <summary>The feature names of a marker's named forest partners, strongest first.</summary>
    public static IEnumerable<string> PartnerNames(ScreenResult result, int feature) =>
        result.Effects.Of(feature)?.Partners.Select(p => result.Features[p].Feature) ?? [];

    /// <summary>
    /// Whether the marker's single-marker interval spans no effect: the AUC interval covers 0.5,
    /// Spearman's rho interval covers 0, or the hazard ratio's interval covers 1. An interval that
    /// could not be computed counts as not spanning (the direction is then kept).
    /// </summary>
    public static bool SpansNoEffect(ShortlistEntry entry)
    {
        ArgumentNullException.ThrowIfNull(entry);
        if (entry.Measured is { } measured) return Covers(measured.Interval.Lower, measured.Interval.Upper, 0);
        if (entry.FollowUp is { } followUp) return Covers(followUp.HazardRatioInterval.Lower, followUp.HazardRatioInterval.Upper, 1);
        if (entry.Univariate is { } row) return Covers(row.AucInterval.Lower, row.AucInterval.Upper, 0.5);
        return false;
    }

    private static bool Covers(double lower, double upper, double value) => lower <= value && value <= upper;

    /// <summary>
    /// What the report says of a marker's direction: the bare direction ("higher in case"), or,
    /// when its single-marker interval spans no effect and the forest gave it a curve, the curve's
    /// shape in words (issue 19: "higher in case" with AUC 0.512 tells the lab nothing true).
    /// </summary>
    public static string DirectionWords(ShortlistEntry entry, ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(entry);
        ArgumentNullException.ThrowIfNull(result);
        string direction = ScreenTables.DirectionOf(entry, result);
        if (!SpansNoEffect(entry) || result.Effects.Of(entry.Forest.FeatureIndex) is not { } effect) return direction;
        return "forest: " + effect.Shape.Description;
    }

    /// <summary>The report's words on the direction and partner columns.</summary>
    public const string ShortlistLegend =
        "Where the single-marker interval spans no effect (AUC interval covering 0.5, rho's covering 0, or the hazard ratio's covering 1), "
        + "the direction is replaced by the shape of the forest's partial dependence on the marker (\"forest: ...\"; see How each marker acts). "
        + "Partners in the forest: the markers it splits directly below, or above, more often than the shuffled copies of any marker do.";

    /// <summary>What the forest's prediction is on each outcome kind's scale (the y axis of the curves).</summary>
    public static string PredictionLabel(OutcomeKind kind, string positiveClass) => kind switch
    {
        OutcomeKind.Measured => "Predicted outcome (forest mean)",
        OutcomeKind.TimeToEvent => "Predicted risk (forest mortality)",
        _ => $"Predicted probability of {positiveClass}",
    };
}
