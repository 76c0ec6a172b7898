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
        var (featureNames, sampleIds, labels, cells) = Text();
        var columns = new float[featureNames.Length][];
        for (int f = 0; f < columns.Length; f++)
        {
            columns[f] = new float[sampleIds.Length];
            // Parsed from the text straight to float, as the panel loader does (not via double).
            for (int s = 0; s < sampleIds.Length; s++) columns[f][s] = float.Parse(cells[s][f], NumberStyles.Float, CultureInfo.InvariantCulture);
        }
        string[] classNames = ["benign", "malignant"];
        var classes = new int[labels.Length];
        for (int s = 0; s < labels.Length; s++) classes[s] = Array.IndexOf(classNames, labels[s]);
        var matrix = new FeatureMatrix(featureNames, sampleIds, columns, new CellState[]?[featureNames.Length]);
        return (matrix, new ClassOutcome("diagnosis", classNames, classes));
    }

    /// <summary>The same file in double precision, feature-major, for statistics compared with scipy/pandas values.</summary>
    public static (string[] FeatureNames, string[] Diagnosis, double[][] Columns) LoadDoubles()
    {
        var (featureNames, sampleIds, labels, cells) = Text();
        var columns = new double[featureNames.Length][];
        for (int f = 0; f < columns.Length; f++)
        {
            columns[f] = new double[sampleIds.Length];
            for (int s = 0; s < sampleIds.Length; s++) columns[f][s] = double.Parse(cells[s][f], NumberStyles.Float, CultureInfo.InvariantCulture);
        }
        return (featureNames, labels, columns);
    }

    /// <summary>Feature names, sample ids, diagnoses and each sample's feature cells as text.</summary>
    private static (string[] FeatureNames, string[] SampleIds, string[] Labels, string[][] Cells) Text()
    {
        var lines = File.ReadAllLines(ReferenceData.Wdbc("wdbc.csv"));
        var featureNames = lines[0].Split(',')[2..];
        var sampleIds = new string[lines.Length - 1];
        var labels = new string[lines.Length - 1];
        var cells = new string[lines.Length - 1][];
        for (int s = 0; s < sampleIds.Length; s++)
        {
            var fields = lines[s + 1].Split(',');
            sampleIds[s] = fields[0];
            labels[s] = fields[1];
            cells[s] = fields[2..];
        }
        return (featureNames, sampleIds, labels, cells);
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
