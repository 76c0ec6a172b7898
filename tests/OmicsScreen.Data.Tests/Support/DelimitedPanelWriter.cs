using System.Text;
using OmicsScreen.Data.Writing;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Support;

/// <summary>Writes a panel as delimited text in either orientation, quoting fields that need it.</summary>
internal static class DelimitedPanelWriter
{
    public static void Write(Panel panel, string path, PanelLayout layout, char delimiter, bool byteOrderMark = false,
        string newline = "\n", bool includeSampleAttributes = true)
    {
        var columns = PanelTableShape.Columns(panel, layout, includeSampleAttributes);
        int rowCount = columns[0].Texts!.Length;
        var text = new StringBuilder();
        for (int c = 0; c < columns.Count; c++)
        {
            if (c > 0) text.Append(delimiter);
            text.Append(Quote(columns[c].Name, delimiter));
        }
        text.Append(newline);
        for (int r = 0; r < rowCount; r++)
        {
            for (int c = 0; c < columns.Count; c++)
            {
                if (c > 0) text.Append(delimiter);
                string cell = columns[c].Numbers is { } numbers
                    ? numbers[r] is { } value ? value.ToString("R", System.Globalization.CultureInfo.InvariantCulture) : "NA"
                    : columns[c].Texts![r] ?? "";
                text.Append(Quote(cell, delimiter));
            }
            text.Append(newline);
        }
        File.WriteAllText(path, text.ToString(), new UTF8Encoding(byteOrderMark));
    }

    /// <summary>Writes the sample attributes of a panel as a sample sheet, rows in the given sample order.</summary>
    public static void WriteSheet(Panel panel, string path, IReadOnlyList<int> sampleOrder, char delimiter = ',')
    {
        var attributes = PanelTableShape.Attributes(panel);
        var text = new StringBuilder("sample_id");
        foreach (var (name, _) in attributes) text.Append(delimiter).Append(Quote(name, delimiter));
        text.Append('\n');
        foreach (int s in sampleOrder)
        {
            text.Append(Quote(panel.Matrix.SampleIds[s], delimiter));
            foreach (var (_, values) in attributes) text.Append(delimiter).Append(Quote(values[s], delimiter));
            text.Append('\n');
        }
        File.WriteAllText(path, text.ToString(), new UTF8Encoding(false));
    }

    private static string Quote(string field, char delimiter) =>
        field.Contains(delimiter) || field.Contains('"') || field.Contains('\n')
            ? "\"" + field.Replace("\"", "\"\"") + "\""
            : field;
}
