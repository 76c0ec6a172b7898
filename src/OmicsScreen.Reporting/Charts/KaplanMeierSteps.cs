using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Reporting.Charts;

/// <summary>
/// Kaplan-Meier curves drawn as step lines, one place for every survival figure: the screen
/// report's marker halves and discovery risk groups and `apply`'s risk groups.
/// </summary>
internal static class KaplanMeierSteps
{
    /// <summary>
    /// A survival curve as a step line from (0, 1): at each event time the line runs level to the
    /// time, then drops to the estimate there, so every corner is a point of the estimate.
    /// </summary>
    public static (List<double> X, List<double> Y) Of(SurvivalCurve curve)
    {
        var x = new List<double>(2 * curve.Time.Length + 1) { 0 };
        var y = new List<double>(2 * curve.Time.Length + 1) { 1 };
        double level = 1;
        for (int i = 0; i < curve.Time.Length; i++)
        {
            x.Add(curve.Time[i]);
            y.Add(level);
            level = curve.Survival[i];
            x.Add(curve.Time[i]);
            y.Add(level);
        }
        return (x, y);
    }

    /// <summary>One curve as a chart series.</summary>
    public static XYSeries Series(string name, SurvivalCurve curve, XYSeriesStyle style)
    {
        var (x, y) = Of(curve);
        return new XYSeries(name, x, y, style);
    }

    /// <summary>
    /// The low- and high-risk groups of a locked follow-up panel (dashed and solid), with the
    /// log-rank p after the title when both groups hold samples.
    /// </summary>
    public static SvgImage RiskGroups(string title, string timeAxisLabel, LockedFollowUpPerformance groups)
    {
        var series = new List<XYSeries>();
        int low = groups.SampleCount - groups.HighRiskCount;
        if (groups.LowRisk is { } lowCurve)
            series.Add(Series(FormattableString.Invariant($"Low risk ({low})"), lowCurve, XYSeriesStyle.DashedLine));
        if (groups.HighRisk is { } highCurve)
            series.Add(Series(FormattableString.Invariant($"High risk ({groups.HighRiskCount})"), highCurve, XYSeriesStyle.Line));
        string p = groups.LogRank is { } test && !double.IsNaN(test.PValue) ? ", log-rank p " + LogRankP(test.PValue) : "";
        return XYChart.Render(new XYChartOptions(title + p, timeAxisLabel, "Share without the event (Kaplan-Meier)", YMinimum: 0, YMaximum: 1,
            Width: 560, Height: 420), series);
    }

    /// <summary>The log-rank p as the risk-group figures print it (two significant digits).</summary>
    public static string LogRankP(double pValue) =>
        double.IsNaN(pValue) ? "not defined" : pValue.ToString("G2", System.Globalization.CultureInfo.InvariantCulture);
}
