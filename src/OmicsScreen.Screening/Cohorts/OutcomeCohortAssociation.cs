using MathNet.Numerics.Distributions;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: how strongly the outcome depends on the cohort. When it
/// depends strongly, no method can tell a marker of outcome from a marker of cohort.
/// </summary>
internal static class OutcomeCohortAssociation
{
    /// <summary>An association at or above this strength means outcome and cohort cannot be separated.</summary>
    public const double ConfoundingStrength = 0.5;

    /// <summary>Cramer's V of the class x cohort table (Cramer 1946) with the chi-square test of independence.</summary>
    public static (double CramersV, double PValue) OfClasses(ClassOutcome outcome, SampleGrouping cohort)
    {
        int rows = outcome.ClassCount, columns = cohort.LevelCount, n = outcome.SampleCount;
        var table = new double[rows, columns];
        for (int s = 0; s < n; s++) table[outcome.SampleClasses[s], cohort.SampleLevels[s]]++;
        var rowSums = new double[rows];
        var columnSums = new double[columns];
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                rowSums[r] += table[r, c];
                columnSums[c] += table[r, c];
            }
        double chiSquare = 0;
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                double expected = rowSums[r] * columnSums[c] / n;
                if (expected > 0) chiSquare += (table[r, c] - expected) * (table[r, c] - expected) / expected;
            }
        int usedRows = rowSums.Count(x => x > 0), usedColumns = columnSums.Count(x => x > 0);
        int smaller = Math.Min(usedRows, usedColumns) - 1;
        if (smaller < 1) return (double.NaN, double.NaN);
        double v = Math.Sqrt(chiSquare / (n * smaller));
        int degrees = (usedRows - 1) * (usedColumns - 1);
        return (v, ChiSquared.CDF(degrees, chiSquare) is var cdf ? 1 - cdf : double.NaN);
    }
}
