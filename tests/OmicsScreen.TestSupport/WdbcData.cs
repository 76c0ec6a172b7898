using System.Globalization;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.TestSupport;

/// <summary>
/// A tiny test-only reader of reference/wdbc/wdbc.csv (UCI Wisconsin Diagnostic Breast Cancer;
/// see reference/wdbc/README.md): sample_id, diagnosis, then 30 numeric features, no missing
/// values. Class codes follow ordinal name order, so benign = 0 and malignant = 1.
/// </summary>
public static class WdbcData
{
    public static (FeatureMatrix Matrix, ClassOutcome Outcome) Load()
    {
        var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv"));
        var header = lines[0].Split(',');
        var featureNames = header[2..];
        var sampleIds = new string[lines.Length - 1];
        var labels = new string[lines.Length - 1];
        var columns = new float[featureNames.Length][];
        for (int f = 0; f < columns.Length; f++) columns[f] = new float[sampleIds.Length];
        for (int s = 0; s < sampleIds.Length; s++)
        {
            var fields = lines[s + 1].Split(',');
            sampleIds[s] = fields[0];
            labels[s] = fields[1];
            for (int f = 0; f < featureNames.Length; f++)
                columns[f][s] = float.Parse(fields[f + 2], NumberStyles.Float, CultureInfo.InvariantCulture);
        }
        string[] classNames = ["benign", "malignant"];
        var classes = new int[labels.Length];
        for (int s = 0; s < labels.Length; s++) classes[s] = Array.IndexOf(classNames, labels[s]);
        var matrix = new FeatureMatrix(featureNames, sampleIds, columns, new CellState[]?[featureNames.Length]);
        return (matrix, new ClassOutcome("diagnosis", classNames, classes));
    }

    /// <summary>Rows of a small CSV with a header, split on commas (the reference tables hold no quoted commas).</summary>
    public static List<Dictionary<string, string>> ReadTable(string fileName)
    {
        var lines = File.ReadAllLines(ReferenceData.Wdbc(fileName));
        var header = lines[0].Split(',');
        var rows = new List<Dictionary<string, string>>();
        foreach (var line in lines.Skip(1))
        {
            if (line.Length == 0) continue;
            var fields = line.Split(',');
            var row = new Dictionary<string, string>(StringComparer.Ordinal);
            for (int i = 0; i < header.Length; i++) row[header[i]] = fields[i];
            rows.Add(row);
        }
        return rows;
    }
}
