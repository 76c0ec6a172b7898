namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// A generalized Pareto distribution fitted to the exceedances of a sample over a threshold, used
/// to extend a Monte Carlo p-value beyond the sample's resolution (Knijnenburg, Wessels, Reinders
/// &amp; Shmulevich 2009, Bioinformatics 25(12):i161-i168).
/// </summary>
/// <remarks>
/// Parameterisation: P(Y &gt; y) = (1 + shape·y/scale)^(-1/shape), and exp(-y/scale) at shape 0.
/// The fit uses probability-weighted moments (Hosking &amp; Wallis 1987, Technometrics 29(3)):
/// with a0 = E[Y] and a1 = E[Y(1 - F(Y))], a0 = scale/(1 - shape) and a1 = scale/(2(2 - shape)),
/// so shape = 2 - a0/(a0 - 2 a1) and scale = 2 a0 a1/(a0 - 2 a1). The shape is kept at 0 or
/// above: a bounded (light) tail fitted to a few hundred points can end just past the largest
/// one and give a null feature a p-value of 0, while an exponential tail never does; erring toward
/// the heavier tail keeps the p-value conservative.
/// </remarks>
public sealed record GeneralizedParetoTail(double Scale, double Shape)
{
    /// <summary>Fits the tail to exceedances (values above the threshold, minus it), in any order.</summary>
    public static GeneralizedParetoTail Fit(ReadOnlySpan<double> exceedances)
    {
        int count = exceedances.Length;
        if (count < 3) throw new ArgumentException("A tail fit needs at least three exceedances.");
        var sorted = exceedances.ToArray();
        Array.Sort(sorted);
        double a0 = 0, a1 = 0;
        for (int i = 0; i < count; i++)
        {
            a0 += sorted[i];
            // Unbiased estimator of E[Y(1 - F(Y))] from the i-th smallest (0-based): (n - 1 - i)/(n - 1)
            // of the sample lies above it (Landwehr, Matalas & Wallis 1979).
            a1 += sorted[i] * (count - 1 - i) / (count - 1);
        }
        return FromMoments(a0 / count, a1 / count);
    }

    /// <summary>The fit from the two probability-weighted moments a0 = E[Y] and a1 = E[Y(1 - F(Y))].</summary>
    internal static GeneralizedParetoTail FromMoments(double a0, double a1)
    {
        double denominator = a0 - 2 * a1;
        double shape = denominator > 0 ? 2 - a0 / denominator : double.PositiveInfinity;
        if (!(shape > 0) || double.IsInfinity(shape) || a0 <= 0)
            return new GeneralizedParetoTail(Math.Max(a0, double.Epsilon), 0);
        // A shape of 1 or more has no mean; cap it below 1 so the moment fit stays defined.
        shape = Math.Min(shape, 0.9);
        return new GeneralizedParetoTail(a0 * (1 - shape), shape);
    }

    /// <summary>ln P(Y &gt; y) for an exceedance y (0 for y &lt;= 0), exact where P underflows.</summary>
    public double LogSurvival(double exceedance)
    {
        if (exceedance <= 0) return 0;
        return Shape == 0 ? -exceedance / Scale : -Math.Log(1 + Shape * exceedance / Scale) / Shape;
    }

    /// <summary>P(Y &gt; y) for an exceedance y (1 for y &lt;= 0).</summary>
    public double Survival(double exceedance)
    {
        if (exceedance <= 0) return 1;
        return Shape == 0 ? Math.Exp(-exceedance / Scale) : Math.Pow(1 + Shape * exceedance / Scale, -1 / Shape);
    }
}
