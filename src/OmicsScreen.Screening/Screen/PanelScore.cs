namespace OmicsScreen.Screening.Screen;

/// <summary>
/// A k-marker panel's forest scored on held-out samples, in the order of the test rows.
/// </summary>
/// <param name="Score">AUC (two classes), accuracy (more classes), R² (measured outcome) or Harrell's C (follow-up); higher is better.</param>
/// <param name="Error">Share of wrong majority votes, mean squared error, or 1 - C.</param>
/// <param name="Predictions">Each test sample's probability of the positive class, predicted value, or risk score.</param>
/// <param name="IsPositive">Each test sample's class against the positive one; empty for other outcome kinds.</param>
internal sealed record PanelScore(double Score, double Error, double[] Predictions, bool[] IsPositive)
{
    /// <summary>Root mean squared error of the predictions on the test rows (measured outcome); NaN for other kinds.</summary>
    public double RootMeanSquaredError { get; init; } = double.NaN;

    /// <summary>
    /// Class outcomes: each test sample's 1 when the forest's majority vote (or the chance call)
    /// names its class, else 0, in the order of the test rows; their mean is the accuracy. Empty
    /// for other outcome kinds.
    /// </summary>
    public double[] Hits { get; init; } = [];
}
