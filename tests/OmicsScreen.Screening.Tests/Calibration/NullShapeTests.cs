using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Calibration;

/// <summary>The null shapes of the calibration suite: the sizes and class shares asked for, and no association.</summary>
public class NullShapeTests
{
    [Theory]
    [InlineData("null-normal", 150, 1000, new[] { 75, 75 })]
    [InlineData("null-blocks", 150, 1000, new[] { 75, 75 })]
    [InlineData("null-imbalanced", 160, 1000, new[] { 120, 40 })]
    [InlineData("null-censored", 150, 1000, new[] { 75, 75 })]
    [InlineData("null-heavy-tails", 150, 1000, new[] { 75, 75 })]
    [InlineData("null-wide", 60, 2000, new[] { 30, 30 })]
    [InlineData("null-tall", 400, 300, new[] { 200, 200 })]
    [InlineData("null-three-classes", 150, 1000, new[] { 50, 50, 50 })]
    public void Each_null_shape_has_its_size_and_class_counts_and_no_related_feature(string name, int samples, int features, int[] classCounts)
    {
        var model = CalibrationCatalogue.Create(name, 1);
        var panel = model.Discovery();
        Assert.True(model.IsNull);
        Assert.Equal(samples, panel.SampleCount);
        Assert.Equal(features, panel.FeatureCount);
        Assert.Equal(classCounts, panel.Outcome.ClassCounts.ToArray());
        Assert.Equal("CAL0001", panel.Matrix.FeatureNames[0]);
        Assert.Equal("cal-s0001", panel.Matrix.SampleIds[0]);
    }

    [Theory]
    [InlineData("null-normal")]
    [InlineData("null-blocks")]
    [InlineData("null-imbalanced")]
    [InlineData("null-censored")]
    [InlineData("null-heavy-tails")]
    [InlineData("null-wide")]
    [InlineData("null-tall")]
    [InlineData("null-three-classes")]
    public void Rank_test_p_values_of_a_null_shape_are_roughly_uniform(string name)
    {
        // Under no association p ~ U(0, 1) (common practice). Pooled over three seeds; blocks of 10
        // correlated features make the p-values dependent, so the bounds are wide: about 3 SDs of a
        // binomial share over the ~100-600 independent blocks rather than over every feature.
        var pValues = new List<double>();
        for (int seed = 1; seed <= 3; seed++)
        {
            var panel = CalibrationCatalogue.Create(name, seed).Discovery();
            for (int f = 0; f < panel.FeatureCount; f++) pValues.Add(CalibrationValues.RankTestP(panel, f));
        }
        double small = pValues.Count(p => p <= 0.05) / (double)pValues.Count;
        double mean = pValues.Average();
        Assert.InRange(small, 0.02, 0.09);
        Assert.InRange(mean, 0.46, 0.54);
    }

    [Fact]
    public void The_censored_shape_puts_fifteen_percent_of_cells_below_a_limit_under_every_measured_value()
    {
        var model = CalibrationCatalogue.Create("null-censored", 1);
        var panel = model.Discovery();
        long censored = 0, cells = 0;
        for (int f = 0; f < panel.FeatureCount; f++)
        {
            var column = panel.Matrix.Column(f);
            float limit = float.NaN, lowestMeasured = float.PositiveInfinity;
            for (int s = 0; s < panel.SampleCount; s++)
            {
                cells++;
                if (panel.Matrix.State(f, s) == CellState.BelowDetection)
                {
                    censored++;
                    limit = column[s];
                }
                else lowestMeasured = Math.Min(lowestMeasured, column[s]);
            }
            if (!float.IsNaN(limit)) Assert.True(limit <= lowestMeasured, $"feature {f}: limit {limit} above a measured value {lowestMeasured}");
        }
        // Phi(-1.0364) = 0.15; 150,000 cells in correlated blocks, so a tolerance of 0.015.
        Assert.InRange(censored / (double)cells, 0.135, 0.165);
    }

    [Fact]
    public void The_heavy_tailed_shape_has_student_t_tails_with_two_degrees_of_freedom()
    {
        // Student t, 2 df: P(|T| > t) = 1 - t / sqrt(2 + t^2) (closed form of the t2 distribution
        // function, common practice); at t = 4.303 that is 0.05, where a normal gives 0.00002.
        var model = CalibrationCatalogue.Create("null-heavy-tails", 1);
        var panel = model.Discovery();
        long beyond = 0, cells = 0;
        for (int f = 0; f < panel.FeatureCount; f++)
            foreach (double z in CalibrationValues.Standardised(model, panel, f))
            {
                cells++;
                if (Math.Abs(z) > 4.303) beyond++;
            }
        Assert.InRange(beyond / (double)cells, 0.045, 0.055);
    }

    [Fact]
    public void Block_members_correlate_about_six_tenths_on_the_log_scale_and_other_features_not_at_all()
    {
        var model = CalibrationCatalogue.Create("null-blocks", 1);
        var panel = model.Discovery();
        double within = 0, across = 0;
        int withinPairs = 0, acrossPairs = 0;
        for (int block = 0; block < 100; block++)
        {
            int first = block * 10;
            var a = CalibrationValues.Standardised(model, panel, first);
            for (int i = 1; i < 10; i++)
            {
                within += Pearson(a, CalibrationValues.Standardised(model, panel, first + i));
                withinPairs++;
            }
            across += Pearson(a, CalibrationValues.Standardised(model, panel, (first + 10) % 1000));
            acrossPairs++;
        }
        // Mean of 900 within-block correlations of 150 samples (each SD ~0.05, shared within a block).
        Assert.InRange(within / withinPairs, 0.55, 0.65);
        Assert.InRange(across / acrossPairs, -0.05, 0.05);
    }

    private static double Pearson(double[] x, double[] y)
    {
        double meanX = x.Average(), meanY = y.Average(), sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++)
        {
            sxy += (x[i] - meanX) * (y[i] - meanY);
            sxx += (x[i] - meanX) * (x[i] - meanX);
            syy += (y[i] - meanY) * (y[i] - meanY);
        }
        return sxy / Math.Sqrt(sxx * syy);
    }
}
