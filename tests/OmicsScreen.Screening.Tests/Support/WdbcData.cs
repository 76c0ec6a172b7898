using System.Globalization;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Support;

/// <summary>
/// The Wisconsin breast cancer reference files parsed in double from their text (invariant culture),
/// with the scipy/pandas per-feature statistics beside them.
/// </summary>
internal sealed class WdbcData
{
    private static readonly Lazy<WdbcData> Shared = new(Load);

    private WdbcData(string[] featureNames, string[] diagnosis, double[][] columns, Dictionary<string, Dictionary<string, double>> stats)
    {
        FeatureNames = featureNames;
        Diagnosis = diagnosis;
        Columns = columns;
        FeatureStats = stats;
    }

    public static WdbcData Instance => Shared.Value;

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

    private static WdbcData Load()
    {
        var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv"));
        var header = lines[0].Split(',');
        var featureNames = header[2..];
        var diagnosis = new string[lines.Length - 1];
        var columns = new double[featureNames.Length][];
        for (int f = 0; f < featureNames.Length; f++) columns[f] = new double[lines.Length - 1];
        for (int row = 1; row < lines.Length; row++)
        {
            var fields = lines[row].Split(',');
            diagnosis[row - 1] = fields[1];
            for (int f = 0; f < featureNames.Length; f++)
                columns[f][row - 1] = double.Parse(fields[f + 2], NumberStyles.Float, CultureInfo.InvariantCulture);
        }

        var statLines = File.ReadAllLines(ReferenceData.Wdbc("feature_stats.csv"));
        var statHeader = statLines[0].Split(',');
        var stats = new Dictionary<string, Dictionary<string, double>>(StringComparer.Ordinal);
        foreach (var line in statLines.Skip(1))
        {
            var fields = line.Split(',');
            var values = new Dictionary<string, double>(StringComparer.Ordinal);
            for (int c = 1; c < fields.Length; c++)
                values[statHeader[c]] = double.Parse(fields[c], NumberStyles.Float, CultureInfo.InvariantCulture);
            stats[fields[0]] = values;
        }
        return new WdbcData(featureNames, diagnosis, columns, stats);
    }
}
