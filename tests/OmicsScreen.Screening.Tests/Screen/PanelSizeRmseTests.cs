using OmicsScreen.TestSupport;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Screen;

/// <summary>
/// The panel-size curve of a measured outcome gives the held-out RMSE beside R², each fold's
/// from its own predictions: RMSE = sqrt(mean over the test rows of (observed - predicted)²) and
/// R² = 1 - SSE / SST about the test rows' mean (common practice; the coefficient of
/// determination as scikit-learn's r2_score computes it), averaged over the outer folds.
/// </summary>
public sealed class PanelSizeRmseTests
{
    /// <summary>Invented panel: 30 features around 5 (SD 1), y = 1.2 z0 + 0.7 z1 + N(0, 1).</summary>
    private static Panel MeasuredPanel(int samples = 120, int features = 30, ulong seed = 61)
    {
        var (matrix, z, generator) = StandardNormalFeatures.Draw(samples, features, seed, s => $"QR{s:D4}");
        var y = new double[samples];
        for (int s = 0; s < samples; s++) y[s] = 1.2 * z[0][s] + 0.7 * z[1][s] + generator.NextGaussian();
        return new Panel(matrix, new MeasuredOutcome("score", y));
    }

    [Fact]
    public void A_points_RMSE_and_R_squared_are_the_fold_means_of_the_formulas_on_the_fold_predictions()
    {
        var panel = MeasuredPanel();
        var y = panel.Measured!.Values.ToArray();
        var outcome = new MeasuredScreenOutcome(panel.Measured!);
        var binned = new BinMapper().Bin(panel.Matrix, 1);
        var settings = ScreenSettings.Resolve(new ScreenOptions { Seed = 3, TreesPerForest = 80 }, panel);
        const int foldCount = 4;
        var aware = new PanelScore[foldCount];
        var optimistic = new PanelScore[foldCount];
        var expectedRmse = new double[foldCount];
        var expectedRSquared = new double[foldCount];
        var expectedOptimisticRmse = new double[foldCount];
        for (int fold = 0; fold < foldCount; fold++)
        {
            var test = Enumerable.Range(0, y.Length).Where(s => s % foldCount == fold).ToArray();
            var training = Enumerable.Range(0, y.Length).Where(s => s % foldCount != fold).ToArray();
            var options = settings.ForestOptions(null, RandomStreams.PanelScoring(11, fold));
            options = options with { Tree = options.Tree with { FeaturesPerSplit = null } };
            aware[fold] = outcome.ScorePanel(binned, [0, 1], training, test, options);
            optimistic[fold] = outcome.ScorePanel(binned, [0, 1, 2, 3], training, test, options);
            (expectedRmse[fold], expectedRSquared[fold]) = Formulas(y, test, aware[fold].Predictions);
            expectedOptimisticRmse[fold] = Formulas(y, test, optimistic[fold].Predictions).Rmse;
        }

        var point = PanelSizeEstimator.Summarise(2, aware, optimistic);
        Assert.Equal(expectedRmse.Average(), point.SelectionAwareRootMeanSquaredError, 12);
        Assert.Equal(expectedOptimisticRmse.Average(), point.OptimisticRootMeanSquaredError, 12);
        Assert.Equal(expectedRSquared.Average(), point.SelectionAwareAuc, 12);
        // The mean squared error column stays the fold mean of RMSE², and by Jensen's inequality
        // the mean RMSE is at most the square root of the mean MSE.
        Assert.Equal(expectedRmse.Average(r => r * r), point.SelectionAwareError, 12);
        Assert.True(point.SelectionAwareRootMeanSquaredError <= Math.Sqrt(point.SelectionAwareError) + 1e-12);
        // A forest on the two acting markers predicts: its RMSE is below the outcome's SD (about 1.6).
        Assert.True(point.SelectionAwareRootMeanSquaredError < StandardDeviation(y), $"RMSE {point.SelectionAwareRootMeanSquaredError}, SD {StandardDeviation(y)}");
    }

    [Fact]
    public void A_class_outcome_has_no_RMSE_and_a_measured_screens_curve_has_one_at_every_size()
    {
        var classScore = new PanelScore(0.8, 0.2, [0.7, 0.4], [true, false]);
        var classPoint = PanelSizeEstimator.Summarise(1, [classScore, classScore], [classScore, classScore]);
        Assert.True(double.IsNaN(classPoint.SelectionAwareRootMeanSquaredError));
        Assert.True(double.IsNaN(classPoint.OptimisticRootMeanSquaredError));

        var options = new ScreenOptions { Seed = 5, HalfSamplePairs = 2, TreesPerForest = 60, CurveFolds = 3, CurveInnerPairs = 1, CurveMaxPanelSize = 3 };
        var curve = ScreenRunner.Run(MeasuredPanel(90, 20, 62), options).PanelSize!;
        Assert.Equal("r_squared", curve.Metric);
        Assert.All(curve.Points, p =>
        {
            Assert.True(double.IsFinite(p.SelectionAwareRootMeanSquaredError) && p.SelectionAwareRootMeanSquaredError > 0);
            Assert.True(p.SelectionAwareRootMeanSquaredError <= Math.Sqrt(p.SelectionAwareError) + 1e-12);
            Assert.True(p.OptimisticRootMeanSquaredError <= Math.Sqrt(p.OptimisticError) + 1e-12);
        });
    }

    private static (double Rmse, double RSquared) Formulas(double[] y, int[] test, double[] predicted)
    {
        double mean = test.Average(s => y[s]);
        double residual = 0, total = 0;
        for (int i = 0; i < test.Length; i++)
        {
            residual += (y[test[i]] - predicted[i]) * (y[test[i]] - predicted[i]);
            total += (y[test[i]] - mean) * (y[test[i]] - mean);
        }
        return (Math.Sqrt(residual / test.Length), 1 - residual / total);
    }

    private static double StandardDeviation(double[] values)
    {
        double mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1));
    }
}
