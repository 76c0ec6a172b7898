using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Survival;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Reads the committed reference tables under reference/: a sample id column, the outcome
/// column(s), then one column per feature, comma-separated, every cell measured.
/// </summary>
public static class ReferenceTables
{
    /// <summary>sample, outcome, features...: a measured outcome.</summary>
    public static (FeatureMatrix Matrix, double[] Outcome) Measured(string folder, string fileName)
    {
        var (matrix, columns) = Read(folder, fileName, outcomeColumns: 1);
        return (matrix, columns[0]);
    }

    /// <summary>sample, time, status (1 = event, 0 = censored), features...: censored follow-up.</summary>
    public static (FeatureMatrix Matrix, FollowUpTimes FollowUp) FollowUp(string folder, string fileName)
    {
        var (matrix, columns) = Read(folder, fileName, outcomeColumns: 2);
        return (matrix, new FollowUpTimes(columns[0], columns[1].Select(v => v == 1).ToArray()));
    }

    private static (FeatureMatrix Matrix, double[][] Outcomes) Read(string folder, string fileName, int outcomeColumns)
    {
        var lines = File.ReadAllLines(Path.Combine(ReferenceData.Directory, folder, fileName));
        int first = 1 + outcomeColumns;
        var features = lines[0].Split(',')[first..];
        var rows = lines[1..].Select(l => l.Split(',')).ToArray();
        var builder = new FeatureMatrixBuilder(features, rows.Select(r => r[0]).ToArray());
        var outcomes = new double[outcomeColumns][];
        for (int c = 0; c < outcomeColumns; c++) outcomes[c] = new double[rows.Length];
        for (int s = 0; s < rows.Length; s++)
        {
            for (int c = 0; c < outcomeColumns; c++) outcomes[c][s] = double.Parse(rows[s][1 + c], CultureInfo.InvariantCulture);
            for (int f = 0; f < features.Length; f++)
                builder.SetMeasured(f, s, float.Parse(rows[s][f + first], CultureInfo.InvariantCulture));
        }
        return (builder.Build(), outcomes);
    }
}
