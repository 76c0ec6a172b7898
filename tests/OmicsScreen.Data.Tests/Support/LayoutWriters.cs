using System.Globalization;
using System.Text;
using OmicsScreen.Data.Text;
using OmicsScreen.Data.Writing;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Support;

/// <summary>
/// Writes a panel in the layouts omics pipelines write besides the two wide ones: features in
/// rows with describing columns before the samples, and long tables (one row per sample and
/// feature, sample attributes repeated on each row).
/// </summary>
internal static class LayoutWriters
{
    /// <summary>Made-up describing texts for feature f: a symbol and a description (with a delimiter and a quote in it).</summary>
    public static string Symbol(int feature) => $"SYM{feature}";

    public static string Description(int feature) => $"made-up marker {feature}, \"test\"";

    /// <summary>Features in rows, tab-separated: feature, symbol, description, then one column per sample; attribute rows first.</summary>
    public static void WriteFeaturesWithDescriptors(Panel panel, string path)
    {
        var matrix = panel.Matrix;
        var text = new StringBuilder("feature\tsymbol\tdescription");
        foreach (var id in matrix.SampleIds) text.Append('\t').Append(id);
        text.Append('\n');
        foreach (var (name, values) in PanelTableShape.Attributes(panel))
        {
            text.Append(name).Append("\t\t");
            foreach (var value in values) text.Append('\t').Append(Quote(value, '\t'));
            text.Append('\n');
        }
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            text.Append(matrix.FeatureNames[f]).Append('\t').Append(Symbol(f)).Append('\t').Append(Quote(Description(f), '\t'));
            for (int s = 0; s < matrix.SampleCount; s++) text.Append('\t').Append(CellText.Format(matrix.State(f, s), matrix.Value(f, s)));
            text.Append('\n');
        }
        File.WriteAllText(path, text.ToString(), new UTF8Encoding(false));
    }

    /// <summary>
    /// A long CSV: sample, feature, value and the sample attributes on every row, rows in
    /// feature-major order shuffled by a fixed stride; the first missing cell gets no row at all.
    /// </summary>
    public static string LongText(Panel panel)
    {
        var matrix = panel.Matrix;
        var attributes = PanelTableShape.Attributes(panel);
        var text = new StringBuilder("sample,feature,value");
        foreach (var (name, _) in attributes) text.Append(',').Append(Quote(name, ','));
        text.Append('\n');
        int cells = matrix.SampleCount * matrix.FeatureCount;
        bool skipped = false;
        // A stride coprime with the cell count visits every cell once, in an order unlike either wide layout;
        // the sample order of first appearance must still be the panel's, so every sample's first row comes first.
        for (int s = 0; s < matrix.SampleCount; s++) AppendRow(text, panel, attributes, 0, s);
        int stride = 7;
        while (Gcd(stride, cells) != 1) stride++;
        for (int k = 0, cell = 0; k < cells; k++, cell = (cell + stride) % cells)
        {
            int f = cell / matrix.SampleCount, s = cell % matrix.SampleCount;
            if (f == 0) continue;
            if (!skipped && matrix.State(f, s) == CellState.Missing)
            {
                skipped = true;
                continue;
            }
            AppendRow(text, panel, attributes, f, s);
        }
        return text.ToString();
    }

    private static void AppendRow(StringBuilder text, Panel panel, List<(string Name, string[] Values)> attributes, int f, int s)
    {
        var matrix = panel.Matrix;
        text.Append(Quote(matrix.SampleIds[s], ',')).Append(',').Append(Quote(matrix.FeatureNames[f], ','))
            .Append(',').Append(CellText.Format(matrix.State(f, s), matrix.Value(f, s)));
        foreach (var (_, values) in attributes) text.Append(',').Append(Quote(values[s], ','));
        text.Append('\n');
    }

    /// <summary>A feature sheet: id, display name, a panel annotation and a detection limit for every other feature.</summary>
    public static string FeatureSheet(Panel panel, float limit)
    {
        var text = new StringBuilder("feature,display_name,assay_panel,detection_limit\n");
        var names = panel.Matrix.FeatureNames;
        // Reverse order: the join must not depend on it.
        for (int f = names.Count - 1; f >= 0; f--)
            text.Append(Quote(names[f], ',')).Append(",Lab name ").Append(f).Append(",panel ").Append(f % 2)
                .Append(',').Append(f % 2 == 0 ? limit.ToString("R", CultureInfo.InvariantCulture) : "").Append('\n');
        return text.ToString();
    }

    private static int Gcd(int a, int b) => b == 0 ? a : Gcd(b, a % b);

    private static string Quote(string field, char delimiter) =>
        field.Contains(delimiter) || field.Contains('"') || field.Contains('\n') ? "\"" + field.Replace("\"", "\"\"") + "\"" : field;
}
