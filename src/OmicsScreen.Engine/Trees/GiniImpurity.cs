using System.Runtime.CompilerServices;

namespace OmicsScreen.Engine.Trees;

/// <summary>
/// The Gini index of class weights w_c with total W: G = 1 - sum_c (w_c/W)^2 (Breiman et al. 1984,
/// "Classification and Regression Trees", ch. 4).
/// </summary>
/// <remarks>
/// W·G = W - S/W with S = sum_c w_c^2, so the weighted decrease of a split is
/// W·G - W_L·G_L - W_R·G_R = S_L/W_L + S_R/W_R - S/W: maximising the proxy S_L/W_L + S_R/W_R
/// maximises the decrease without computing any logarithm or impurity per candidate.
/// </remarks>
internal static class GiniImpurity
{
    public static double SumOfSquares(ReadOnlySpan<double> classWeights)
    {
        double sum = 0;
        foreach (double w in classWeights) sum += w * w;
        return sum;
    }

    public static double Total(ReadOnlySpan<double> classWeights)
    {
        double sum = 0;
        foreach (double w in classWeights) sum += w;
        return sum;
    }

    public static double Index(ReadOnlySpan<double> classWeights)
    {
        double total = Total(classWeights);
        return total > 0 ? 1.0 - SumOfSquares(classWeights) / (total * total) : 0.0;
    }

    /// <summary>The proxy score S_L/W_L + S_R/W_R, right = total - left.</summary>
    public static double SplitScore(ReadOnlySpan<double> left, ReadOnlySpan<double> total, double leftWeight, double rightWeight)
    {
        double leftSquares = 0, rightSquares = 0;
        for (int c = 0; c < left.Length; c++)
        {
            double l = left[c];
            double r = total[c] - l;
            leftSquares += l * l;
            rightSquares += r * r;
        }
        return leftSquares / leftWeight + rightSquares / rightWeight;
    }

    /// <summary>
    /// The proxy score for two classes, the same sums as the general form written out so the
    /// split scanner's hot loop keeps the four weights in registers.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static double SplitScore(double left0, double left1, double right0, double right1) =>
        (left0 * left0 + left1 * left1) / (left0 + left1) + (right0 * right0 + right1 * right1) / (right0 + right1);

    /// <summary>Weighted impurity decrease (W_t·G_t - W_L·G_L - W_R·G_R)/W_root from a split score; never negative.</summary>
    public static double Decrease(double splitScore, ReadOnlySpan<double> nodeClassWeights, double rootWeight)
    {
        double nodeWeight = Total(nodeClassWeights);
        double decrease = (splitScore - SumOfSquares(nodeClassWeights) / nodeWeight) / rootWeight;
        return decrease > 0 ? decrease : 0.0;
    }
}
