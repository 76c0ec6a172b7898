using System.Globalization;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Support;

/// <summary>
/// The Wisconsin breast cancer reference data in double precision (read by the shared test
/// loader), with the scipy/pandas per-feature statistics beside them.
/// </summary>
internal sealed class WdbcFeatureStatistics
{
    private static readonly Lazy<WdbcFeatureStatistics> Shared = new(Load);

    private WdbcFeatureStatistics(string[] featureNames, string[] diagnosis, double[][] columns, Dictionary<string, Dictionary<string, double>> stats)
    {
        FeatureNames = featureNames;
        Diagnosis = diagnosis;
        Columns = columns;
        FeatureStats = stats;
    }

    public static WdbcFeatureStatistics Instance => Shared.Value;

    public string[] FeatureNames { get; }
    public string[] Diagnosis { get; }
    /// <summary>Feature-major values in double, exactly as written in wdbc.csv.</summary>
    public double[][] Columns { get; }
    /// <summary>feature_stats.csv: feature name -> column name -> value.</summary>
    public Dictionary<string, Dictionary<string, double>> FeatureStats { get; }

    /// <summary>Every feature with its reference row and its values split by diagnosis.</summary>
    public IEnumerable<(string Name, Dictionary<string, double> Expected, double[] Malignant, double[] Benign)> FeaturesByClass()
    {
        for (int f = 0; f < FeatureNames.Length; f++)
        {
            var (malignant, benign) = Split(f);
            yield return (FeatureNames[f], FeatureStats[FeatureNames[f]], malignant, benign);
        }
    }

    public (double[] Malignant, double[] Benign) Split(int feature)
    {
        var malignant = new List<double>();
        var benign = new List<double>();
        for (int s = 0; s < Diagnosis.Length; s++)
            (Diagnosis[s] == "malignant" ? malignant : benign).Add(Columns[feature][s]);
        return (malignant.ToArray(), benign.ToArray());
    }

    private static WdbcFeatureStatistics Load()
    {
        var (featureNames, diagnosis, columns) = TestSupport.WdbcData.LoadDoubles();
        var stats = new Dictionary<string, Dictionary<string, double>>(StringComparer.Ordinal);
        foreach (var row in TestSupport.WdbcData.ReadTable("feature_stats.csv"))
        {
            var values = new Dictionary<string, double>(StringComparer.Ordinal);
            foreach (var (column, text) in row)
                if (column != "feature") values[column] = double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
            stats[row["feature"]] = values;
        }
        return new WdbcFeatureStatistics(featureNames, diagnosis, columns, stats);
    }
}
