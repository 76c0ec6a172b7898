using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public sealed class SquaredErrorFitTests
{
    [Fact]
    public void The_worked_example_of_scikit_learns_metrics_documentation_is_reproduced()
    {
        // scikit-learn's documentation examples for r2_score and mean_squared_error (from memory):
        // y_true = [3, -0.5, 2, 7], y_pred = [2.5, 0.0, 2, 8] give R² 0.948... and MSE 0.375.
        // By hand: mean 2.875, total 29.1875, residual 1.5, so R² = 1 - 1.5 / 29.1875.
        var fit = SquaredErrorFit.Of([3, -0.5, 2, 7], [2.5, 0.0, 2, 8]);
        Assert.Equal(1.5, fit.ResidualSumOfSquares, 12);
        Assert.Equal(29.1875, fit.TotalSumOfSquares, 12);
        Assert.Equal(0.948608137044968, fit.RSquared, 12);
        Assert.Equal(0.375, fit.MeanSquaredError, 12);
        Assert.Equal(Math.Sqrt(0.375), fit.RootMeanSquaredError, 12);
    }

    [Fact]
    public void Predicting_the_mean_scores_zero_a_worse_guess_scores_below_zero_and_a_constant_outcome_has_no_r_squared()
    {
        // The definition (common practice; scikit-learn's r2_score documents the same three cases).
        Assert.Equal(0, SquaredErrorFit.Of([1, 2, 3, 6], [3, 3, 3, 3]).RSquared, 12);
        Assert.True(SquaredErrorFit.Of([1, 2, 3, 6], [6, 3, 2, 1]).RSquared < 0);
        Assert.True(double.IsNaN(SquaredErrorFit.Of([4, 4, 4], [1, 2, 3]).RSquared));
        Assert.Throws<ArgumentException>(() => SquaredErrorFit.Of([1, 2], [1]));
    }
}
