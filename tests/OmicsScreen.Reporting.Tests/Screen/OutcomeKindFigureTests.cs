using OmicsScreen.TestSupport;
using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Reporting.Charts;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// The screen report's figures of a measured outcome and of follow-up, checked against the
/// engine and the statistics routines they draw: the observed-against-out-of-bag scatter holds
/// the reference forest's own out-of-bag predictions, and its R² is 1 - SSE / SST of the points
/// plotted. The panels are invented (ids "QX..." that no real cohort uses).
/// </summary>
public sealed class OutcomeKindFigureTests
{
    private static readonly ScreenOptions Quick = new() { Seed = 19, HalfSamplePairs = 2, TreesPerForest = 60, CurveFolds = 0 };

    /// <summary>40 features around 5 (SD 1); y = z0 + 0.8 z1 + N(0, 1), so the forest explains part of y.</summary>
    internal static Panel MeasuredPanel(int samples = 90, int features = 40, ulong seed = 23)
    {
        var (matrix, z, generator) = StandardNormalFeatures.Draw(samples, features, seed, s => $"QX{s:D4}");
        var y = new double[samples];
        for (int s = 0; s < samples; s++) y[s] = z[0][s] + 0.8 * z[1][s] + generator.NextGaussian();
        return new Panel(matrix, new MeasuredOutcome("score", y));
    }

    [Fact]
    public void The_observed_against_out_of_bag_scatter_plots_the_reference_forests_own_predictions()
    {
        var panel = MeasuredPanel();
        var result = ScreenRunner.Run(panel, Quick);

        // The reference forest grown again by the engine with the screen's own settings and stream.
        var binned = new BinMapper().Bin(panel.Matrix, 1);
        var y = panel.Measured!.Values.ToArray();
        var forest = RegressionForestTrainer.Train(binned, y, result.Settings.ForestOptions(panel.Subject, RandomStreams.ReferenceForest(Quick.Seed)));
        var outOfBag = new RegressionOutOfBag(forest, y);
        var expectedPredicted = new List<double>();
        var expectedObserved = new List<double>();
        for (int s = 0; s < y.Length; s++)
        {
            if (double.IsNaN(outOfBag.Predictions[s])) continue;
            expectedPredicted.Add(outOfBag.Predictions[s]);
            expectedObserved.Add(y[s]);
        }

        var (predicted, observed) = OutcomeKindReport.OutOfBagPoints(panel, result.ReferenceForest);
        Assert.Equal(expectedPredicted, predicted);
        Assert.Equal(expectedObserved, observed);
        Assert.True(predicted.Length > 0.9 * y.Length, $"{predicted.Length} of {y.Length} samples out of bag somewhere");

        // R² = 1 - SSE / SST over the plotted points, SST about their mean (common practice: the
        // coefficient of determination); the caption prints it to three decimals.
        double mean = observed.Average();
        double residual = 0, total = 0;
        for (int i = 0; i < observed.Length; i++)
        {
            residual += (observed[i] - predicted[i]) * (observed[i] - predicted[i]);
            total += (observed[i] - mean) * (observed[i] - mean);
        }
        double rSquared = 1 - residual / total;
        Assert.Equal(rSquared, result.ReferenceForest.OutOfBagRSquared!.Value, 12);
        string caption = OutcomeKindReport.ObservedAgainstOutOfBagCaption(panel, result.ReferenceForest);
        Assert.Contains("Out-of-bag R² " + rSquared.ToString("0.000", CultureInfo.InvariantCulture)
            + " over these " + predicted.Length.ToString(CultureInfo.InvariantCulture) + " samples", caption);

        // Every plotted point is a dot of the chart (one more dot is the legend's symbol).
        string svg = OutcomeKindReport.ObservedAgainstOutOfBag(panel, result.ReferenceForest).Markup;
        Assert.Equal(predicted.Length + 1, CountOf(svg, "<circle"));
        Assert.Contains("Observed = predicted", svg);
    }

    [Fact]
    public void The_report_of_a_measured_screen_shows_the_scatter_and_no_sample_id()
    {
        var panel = MeasuredPanel();
        var result = ScreenRunner.Run(panel, Quick);
        string html = ScreenReport.Render(ScreenReportSample.Input(result: result) with { Panel = panel });
        Assert.Contains("Observed against out-of-bag predicted score", html);
        Assert.Contains(OutcomeKindReport.ObservedAgainstOutOfBagCaption(panel, result.ReferenceForest), html);
        Assert.DoesNotContain("QX0", html);
    }

    [Fact]
    public void A_measured_curve_writes_RMSE_beside_R_squared_in_the_table_the_manifest_and_the_report()
    {
        var panel = MeasuredPanel();
        var result = ScreenRunner.Run(panel, Quick with { CurveFolds = 3, CurveInnerPairs = 1, CurveMaxPanelSize = 3 });
        var curve = result.PanelSize!;
        using var writer = new StringWriter();
        ScreenTables.WritePanelSizeCurve(writer, curve);
        var lines = writer.ToString().TrimEnd('\n').Split('\n');
        var header = lines[0].Split('\t');
        int aware = Array.IndexOf(header, "selection_aware_rmse"), optimistic = Array.IndexOf(header, "optimistic_rmse");
        Assert.True(aware > Array.IndexOf(header, "selection_aware_r_squared") && optimistic > aware, string.Join(",", header));
        for (int i = 0; i < curve.Points.Count; i++)
        {
            var cells = lines[i + 1].Split('\t');
            Assert.Equal(curve.Points[i].SelectionAwareRootMeanSquaredError.ToString("F4", CultureInfo.InvariantCulture), cells[aware]);
            Assert.Equal(curve.Points[i].OptimisticRootMeanSquaredError.ToString("F4", CultureInfo.InvariantCulture), cells[optimistic]);
        }
        var recommended = curve.Points.Single(p => p.PanelSize == curve.RecommendedSize);
        Assert.Equal(recommended.SelectionAwareRootMeanSquaredError, Manifests.ManifestResults.Of(result).RecommendedPanelSizeSelectionAwareRmse);
        string html = ScreenReport.Render(ScreenReportSample.Input(result: result) with { Panel = panel });
        Assert.Contains("The panel-size curve in numbers", html);
        Assert.Contains("root mean squared error is " + ReportNumber.Significant(recommended.SelectionAwareRootMeanSquaredError, 3), html);
    }

    /// <summary>Invented follow-up: exponential event times with log hazard 0.9 z0 + 0.6 z1, exponential censoring (about a third censored).</summary>
    internal static Panel FollowUpPanel(int samples = 120, int features = 30, ulong seed = 29)
    {
        var (matrix, z, generator) = StandardNormalFeatures.Draw(samples, features, seed, s => $"QX{s:D4}");
        var times = new double[samples];
        var events = new bool[samples];
        for (int s = 0; s < samples; s++)
        {
            double eventTime = -Math.Log(1 - generator.NextDouble()) / Math.Exp(0.9 * z[0][s] + 0.6 * z[1][s]);
            double censorTime = -Math.Log(1 - generator.NextDouble()) / 0.5;
            times[s] = Math.Min(eventTime, censorTime);
            events[s] = eventTime <= censorTime;
        }
        return new Panel(matrix, new FollowUpOutcome("months", "relapse", times, events));
    }

    [Fact]
    public void Kaplan_Meier_steps_turn_at_the_estimators_own_points()
    {
        // Small invented follow-up with ties and censoring; KaplanMeier is checked against R's survival package elsewhere.
        double[] time = [1, 2, 2, 3, 4, 4, 5, 7, 8, 9];
        bool[] events = [true, true, false, true, false, true, true, false, true, false];
        var curve = KaplanMeier.Estimate(time, events);
        var (x, y) = KaplanMeierSteps.Of(curve);
        Assert.Equal((0.0, 1.0), (x[0], y[0]));
        Assert.Equal(1 + 2 * curve.Time.Length, x.Count);
        for (int i = 0; i < curve.Time.Length; i++)
        {
            // The line runs level to each time at the previous estimate, then drops to the estimate there.
            Assert.Equal(curve.Time[i], x[1 + 2 * i]);
            Assert.Equal(i == 0 ? 1.0 : curve.Survival[i - 1], y[1 + 2 * i]);
            Assert.Equal(curve.Time[i], x[2 + 2 * i]);
            Assert.Equal(curve.Survival[i], y[2 + 2 * i]);
        }
    }

    [Fact]
    public void The_report_of_a_follow_up_screen_draws_the_locked_panels_discovery_risk_groups_with_the_log_rank_p()
    {
        var panel = FollowUpPanel();
        var result = ScreenRunner.Run(panel, Quick with { CurveFolds = 3, CurveInnerPairs = 1, CurveMaxPanelSize = 3 });
        Assert.True(result.LockedPanelSize > 0, "the planted markers should be locked");
        var (_, groups) = PanelLocker.LockFollowUpWithRiskGroups(panel, result, new PanelLockOptions { Seed = Quick.Seed, TreeCount = 60, ToolVersion = "test" });
        var input = ScreenReportSample.Input(result: result) with { Panel = panel, LockedRiskGroups = groups };
        string html = ScreenReport.Render(input);

        var logRank = groups.LogRank!.Value;
        Assert.Contains("Discovery risk groups, log-rank p " + logRank.PValue.ToString("G2", CultureInfo.InvariantCulture), html);
        Assert.Contains("chi-square " + ReportNumber.Significant(logRank.ChiSquare, 3), html);
        Assert.Contains($"High risk ({groups.HighRiskCount})", html);
        Assert.Contains($"Low risk ({groups.SampleCount - groups.HighRiskCount})", html);
        Assert.DoesNotContain("QX0", html);

        // The chart is the shared step drawing of the groups' curves, the same as apply's.
        string svg = OutcomeKindReport.DiscoveryRiskGroups(panel, groups).Markup;
        Assert.Equal(KaplanMeierSteps.RiskGroups("Discovery risk groups", "Time (months)", groups).Markup, svg);

        // Without the groups (nothing locked, or another kind) the figure is absent.
        Assert.DoesNotContain("Discovery risk groups", ScreenReport.Render(input with { LockedRiskGroups = null }));
    }

    private static int CountOf(string text, string part)
    {
        int count = 0;
        for (int at = text.IndexOf(part, StringComparison.Ordinal); at >= 0; at = text.IndexOf(part, at + part.Length, StringComparison.Ordinal)) count++;
        return count;
    }
}
