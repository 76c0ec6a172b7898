namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>
/// A Kaplan-Meier curve at its distinct event times, with the Nelson-Aalen cumulative hazard
/// beside it (both from the same risk sets).
/// </summary>
/// <param name="Time">Distinct times at which at least one event happened, ascending.</param>
/// <param name="AtRisk">Samples still followed just before each time (times at or after it).</param>
/// <param name="Events">Events at each time.</param>
/// <param name="Survival">Kaplan & Meier (1958) product-limit estimate just after each time.</param>
/// <param name="GreenwoodError">Standard error of the survival estimate by Greenwood's formula.</param>
/// <param name="CumulativeHazard">Nelson-Aalen estimate (Nelson 1972; Aalen 1978): the sum of events over at risk.</param>
public sealed record SurvivalCurve(
    double[] Time, int[] AtRisk, int[] Events, double[] Survival, double[] GreenwoodError, double[] CumulativeHazard)
{
    /// <summary>
    /// The first time at which the curve reaches 0.5 or below; where it sits at exactly 0.5 over
    /// an interval, the middle of that interval (the convention of R's survival package). NaN when
    /// the curve never reaches 0.5.
    /// </summary>
    public double Median
    {
        get
        {
            for (int i = 0; i < Survival.Length; i++)
            {
                if (Survival[i] > 0.5 + 1e-12) continue;
                if (Math.Abs(Survival[i] - 0.5) <= 1e-12 && i + 1 < Time.Length) return 0.5 * (Time[i] + Time[i + 1]);
                return Time[i];
            }
            return double.NaN;
        }
    }

    /// <summary>The estimate just after time t (1 before the first event).</summary>
    public double SurvivalAt(double t)
    {
        double survival = 1.0;
        for (int i = 0; i < Time.Length && Time[i] <= t; i++) survival = Survival[i];
        return survival;
    }
}
