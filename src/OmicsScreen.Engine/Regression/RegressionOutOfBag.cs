namespace OmicsScreen.Engine.Regression;

/// <summary>
/// Out-of-bag predictions of a regression forest: each sample's mean over the trees that left
/// it out (Breiman 2001), their mean squared error, R² and the error as trees are added.
/// </summary>
/// <remarks>
/// R² = 1 - MSE / variance, the variance of the outcome over the same samples with divisor n
/// (scikit-learn's oob_score_; ranger divides by n - 1, which differs by a factor (n-1)/n).
/// Samples in no tree's out-of-bag set have no prediction (NaN) and enter no figure.
/// </remarks>
public sealed class RegressionOutOfBag
{
    private readonly double[] _predictions;
    private readonly int[] _treeCounts;
    private readonly double[] _errorCurve;

    public RegressionOutOfBag(RegressionForest forest, ReadOnlySpan<double> outcome)
    {
        ArgumentNullException.ThrowIfNull(forest);
        if (outcome.Length != forest.SampleCount) throw new ArgumentException("The outcome must have one value per sample.");
        int n = forest.SampleCount;
        var sums = new double[n];
        _treeCounts = new int[n];
        _errorCurve = new double[forest.TreeCount];
        // The curve after tree t is the MSE of the predictions of trees 0..t, updated incrementally:
        // a sample's squared error changes only when one of its out-of-bag trees is added.
        var squaredErrors = new double[n];
        double errorSum = 0;
        int predicted = 0;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var rows = forest.OutOfBagRows(t);
            var values = forest.OutOfBagPredictions(t);
            for (int i = 0; i < rows.Length; i++)
            {
                int s = rows[i];
                if (_treeCounts[s] == 0) predicted++;
                else errorSum -= squaredErrors[s];
                sums[s] += values[i];
                _treeCounts[s]++;
                double residual = outcome[s] - sums[s] / _treeCounts[s];
                squaredErrors[s] = residual * residual;
                errorSum += squaredErrors[s];
            }
            _errorCurve[t] = predicted > 0 ? errorSum / predicted : double.NaN;
        }
        _predictions = new double[n];
        double mse = 0, mean = 0;
        for (int s = 0; s < n; s++)
        {
            _predictions[s] = _treeCounts[s] > 0 ? sums[s] / _treeCounts[s] : double.NaN;
            if (_treeCounts[s] == 0) continue;
            mean += outcome[s];
        }
        PredictedSampleCount = predicted;
        if (predicted == 0)
        {
            MeanSquaredError = RSquared = double.NaN;
            return;
        }
        mean /= predicted;
        double variance = 0;
        for (int s = 0; s < n; s++)
        {
            if (_treeCounts[s] == 0) continue;
            double residual = outcome[s] - _predictions[s];
            mse += residual * residual;
            variance += (outcome[s] - mean) * (outcome[s] - mean);
        }
        MeanSquaredError = mse / predicted;
        variance /= predicted;
        RSquared = variance > 0 ? 1.0 - MeanSquaredError / variance : double.NaN;
    }

    /// <summary>Each sample's out-of-bag prediction; NaN where no tree left it out.</summary>
    public ReadOnlySpan<double> Predictions => _predictions;

    /// <summary>How many trees left each sample out.</summary>
    public ReadOnlySpan<int> TreeCounts => _treeCounts;

    public int PredictedSampleCount { get; }
    public double MeanSquaredError { get; }
    public double RootMeanSquaredError => Math.Sqrt(MeanSquaredError);
    public double RSquared { get; }

    /// <summary>Out-of-bag MSE after each number of trees (entry t: trees 0..t).</summary>
    public ReadOnlySpan<double> ErrorCurve => _errorCurve;
}
