using System.Globalization;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Effects;

/// <summary>The shapes a partial-dependence curve is read as.</summary>
public enum EffectShapeKind
{
    /// <summary>The curve moves by less than the smallest effect worth naming.</summary>
    NoneOnItsOwn,
    Rises,
    Falls,
    /// <summary>Most of the rise happens in one step between two grid points.</summary>
    RisesAbove,
    /// <summary>Most of the fall happens in one step between two grid points.</summary>
    FallsAbove,
    /// <summary>Lowest inside the range, higher at both ends.</summary>
    UShaped,
    /// <summary>Highest inside the range, lower at both ends.</summary>
    InvertedU,
    /// <summary>Moves, but in none of the shapes above.</summary>
    Irregular,
}

/// <summary>A curve's shape, its step point where it has one, and the words a lab reads.</summary>
/// <param name="Step">The marker value about which a one-step curve changes (midpoint of the two grid points); NaN otherwise.</param>
public sealed record EffectShape(EffectShapeKind Kind, double Step, double Range, string Description);

/// <summary>
/// Reads the shape of a partial-dependence curve in words (issue 19): rises, falls, rises (or falls)
/// above about X, U-shaped, inverted U, irregular, or none on its own.
/// </summary>
/// <remarks>
/// Rules (ours, fixed before any data; each a share of the curve's own movement, so they hold on
/// any outcome scale): the curve is "none on its own" when its range is under
/// <paramref name="smallestEffect"/> in the outcome's units; the caller sets it from what
/// unrelated features reach in the same forest (e.g. twice the largest range of permuted copies),
/// so that a flat curve with a forest's usual wiggle is not read as a shape. A step: the best
/// two-level fit (one cut between adjacent grid points, least squares) leaves at most a tenth of
/// the curve's variance and at most half of what a straight line leaves. Monotone: Spearman's rho
/// of curve against grid at least 0.8 in size. U (or inverted U): the lowest (highest) point lies
/// strictly inside and both ends stand at least half the range above (below) it.
/// </remarks>
public static class EffectShapeReader
{
    public const double StepResidualShare = 0.1;
    public const double StepAgainstLine = 0.5;
    public const double MonotoneRho = 0.8;
    public const double EndShare = 0.5;

    public static EffectShape Read(EffectCurve curve, double smallestEffect)
    {
        ArgumentNullException.ThrowIfNull(curve);
        var y = curve.Average;
        var x = curve.GridValues;
        int n = y.Length;
        double range = curve.Range;
        if (n < 2 || !(range >= smallestEffect) || range == 0)
            return new EffectShape(EffectShapeKind.NoneOnItsOwn, double.NaN, range, "none on its own");

        double mean = y.Average(), total = 0;
        foreach (double v in y) total += (v - mean) * (v - mean);
        var (cut, stepResidual) = BestStep(y);
        double lineResidual = LineResidual(x, y);
        if (n >= 3 && stepResidual <= StepResidualShare * total && stepResidual <= StepAgainstLine * lineResidual)
        {
            double step = (x[cut - 1] + x[cut]) / 2;
            string at = step.ToString("G3", CultureInfo.InvariantCulture);
            bool up = y[n - 1] > y[0];
            return up
                ? new EffectShape(EffectShapeKind.RisesAbove, step, range, $"rises above about {at}")
                : new EffectShape(EffectShapeKind.FallsAbove, step, range, $"falls above about {at}");
        }

        double rho = n >= 3 ? Correlation.Spearman(x, y) : Math.Sign(y[n - 1] - y[0]);
        if (rho >= MonotoneRho) return new EffectShape(EffectShapeKind.Rises, double.NaN, range, "rises");
        if (rho <= -MonotoneRho) return new EffectShape(EffectShapeKind.Falls, double.NaN, range, "falls");

        int lowest = Array.IndexOf(y, y.Min()), highest = Array.IndexOf(y, y.Max());
        if (lowest > 0 && lowest < n - 1 && y[0] - y[lowest] >= EndShare * range && y[n - 1] - y[lowest] >= EndShare * range)
            return new EffectShape(EffectShapeKind.UShaped, double.NaN, range, "U-shaped");
        if (highest > 0 && highest < n - 1 && y[highest] - y[0] >= EndShare * range && y[highest] - y[n - 1] >= EndShare * range)
            return new EffectShape(EffectShapeKind.InvertedU, double.NaN, range, "inverted U");
        return new EffectShape(EffectShapeKind.Irregular, double.NaN, range, "irregular");
    }

    /// <summary>The cut (first index of the right part) of the best two-level least-squares fit, and its residual sum of squares.</summary>
    private static (int Cut, double Residual) BestStep(double[] y)
    {
        int n = y.Length;
        double totalSum = y.Sum(), totalSquares = y.Sum(v => v * v), leftSum = 0, leftSquares = 0;
        (int Cut, double Residual) best = (1, double.PositiveInfinity);
        for (int cut = 1; cut < n; cut++)
        {
            leftSum += y[cut - 1];
            leftSquares += y[cut - 1] * y[cut - 1];
            double rightSum = totalSum - leftSum, rightSquares = totalSquares - leftSquares;
            double residual = leftSquares - leftSum * leftSum / cut + rightSquares - rightSum * rightSum / (n - cut);
            if (residual < best.Residual) best = (cut, residual);
        }
        return best;
    }

    /// <summary>Residual sum of squares of the least-squares line of y on x.</summary>
    private static double LineResidual(double[] x, double[] y)
    {
        double mx = x.Average(), my = y.Average(), sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++) { sxy += (x[i] - mx) * (y[i] - my); sxx += (x[i] - mx) * (x[i] - mx); syy += (y[i] - my) * (y[i] - my); }
        return sxx > 0 ? syy - sxy * sxy / sxx : syy;
    }
}
