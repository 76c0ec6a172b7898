using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// The effects tables and words (issue 19, parts 4-5): the shape replaces the bare direction only
/// when the single-marker interval spans no effect; effect_shapes.tsv holds each curve with its band.
/// </summary>
public sealed class EffectTablesTests
{
    /// <summary>The sample screen's first shortlisted marker, given a curve that steps up at 2.5.</summary>
    private static (ScreenResult Result, ShortlistEntry Entry) WithStepCurve()
    {
        var result = ScreenReportSample.Result;
        var entry = result.Shortlist[0];
        int feature = entry.Forest.FeatureIndex;
        var curve = new EffectCurve(feature, [1, 2, 3, 4], [0.2, 0.2, 0.7, 0.7], [0.1, 0.1, 0.6, 0.6], [0.3, 0.3, 0.8, 0.8], new double[8]);
        var effect = new MarkerEffect(feature, curve, EffectShapeReader.Read(curve, 0.05), []);
        return (result with { Effects = ScreenEffects.Empty with { Markers = [effect] } }, entry);
    }

    private static ShortlistEntry WithAucInterval(ShortlistEntry entry, double lower, double upper) =>
        entry with { Univariate = entry.Univariate! with { AucInterval = new ConfidenceInterval(lower, upper, 0.95) } };

    [Fact]
    public void The_shape_replaces_the_direction_only_when_the_interval_spans_no_effect()
    {
        var (result, entry) = WithStepCurve();
        // Issue 19's rule: AUC interval covering 0.5 (e.g. AUC 0.512 [0.43, 0.59]) -> the forest's shape.
        var spanning = WithAucInterval(entry, 0.43, 0.59);
        Assert.True(EffectTables.SpansNoEffect(spanning));
        Assert.Equal("forest: rises above about 2.5", EffectTables.DirectionWords(spanning, result));
        // An interval clear of 0.5 on either side keeps the bare direction ("higher in ...").
        foreach (var clear in new[] { WithAucInterval(entry, 0.62, 0.81), WithAucInterval(entry, 0.2, 0.45) })
        {
            Assert.False(EffectTables.SpansNoEffect(clear));
            Assert.Equal(ScreenTables.DirectionOf(clear, result), EffectTables.DirectionWords(clear, result));
        }
        // An interval that could not be computed keeps the direction too.
        Assert.False(EffectTables.SpansNoEffect(WithAucInterval(entry, double.NaN, double.NaN)));
        // A marker with no curve (not in the effects) keeps its direction even when it spans.
        Assert.Equal(ScreenTables.DirectionOf(spanning, result), EffectTables.DirectionWords(spanning, result with { Effects = ScreenEffects.Empty }));
    }

    [Fact]
    public void The_other_outcome_kinds_span_no_effect_at_rho_0_and_hazard_ratio_1()
    {
        var entry = ScreenReportSample.Result.Shortlist[0] with { Univariate = null };
        var measured = new MeasuredOutcomeMarker(0, "m", 50, 0.1, new ConfidenceInterval(-0.1, 0.3, 0.95), 0.3, 0.5, "none", 0, 0);
        Assert.True(EffectTables.SpansNoEffect(entry with { Measured = measured }));
        Assert.False(EffectTables.SpansNoEffect(entry with { Measured = measured with { Interval = new ConfidenceInterval(0.05, 0.4, 0.95) } }));
        var followUp = new FollowUpMarker(0, "m", 50, 20, new ConcordanceEstimate(0.55, 0.05, new ConfidenceInterval(0.45, 0.65, 0.95), 110, 90, 0),
            1.2, new ConfidenceInterval(0.9, 1.6, 0.95), 0.2, 0.4, "none", true, 0, 0);
        Assert.True(EffectTables.SpansNoEffect(entry with { FollowUp = followUp }));
        Assert.False(EffectTables.SpansNoEffect(entry with { FollowUp = followUp with { HazardRatioInterval = new ConfidenceInterval(1.1, 1.6, 0.95) } }));
    }

    [Fact]
    public void Effect_shapes_table_holds_each_curve_with_its_band()
    {
        var (result, entry) = WithStepCurve();
        using var writer = new StringWriter();
        int rows = EffectTables.WriteEffectShapes(writer, result);
        Assert.Equal(4, rows);
        var lines = writer.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("rank\tmarker\tgrid_value\tpartial_dependence\tband_low\tband_high", lines[0]);
        var third = lines[3].Split('\t');
        Assert.Equal(["1", "3", "0.7", "0.6", "0.8"], new[] { third[0], third[2], third[3], third[4], third[5] });
        // Names are untrusted: a name starting with '=' is neutralised against spreadsheet formulas.
        Assert.DoesNotContain("\t=", writer.ToString());
        _ = entry;
    }

    [Fact]
    public void The_real_screen_gives_every_shortlisted_marker_a_curve_and_the_report_a_section()
    {
        var result = ScreenReportSample.Result;
        Assert.Equal(result.Shortlist.Select(e => e.Forest.FeatureIndex), result.Effects.Markers.Select(m => m.Feature));
        foreach (var marker in result.Effects.Markers)
        {
            Assert.True(marker.Curve.GridCount >= 2);
            for (int g = 0; g < marker.Curve.GridCount; g++)
                Assert.InRange(marker.Curve.Average[g], marker.Curve.Lower[g] - 1e-12, marker.Curve.Upper[g] + 1e-12);
        }
        string html = ScreenReport.Render(ScreenReportSample.Input());
        Assert.Contains("How each marker acts", html);
        Assert.DoesNotContain(ScreenReportSample.Script, html);
    }
}
