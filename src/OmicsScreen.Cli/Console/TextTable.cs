using System.Text;
using OmicsScreen.Reporting.Html;

namespace OmicsScreen.Cli.Console;

/// <summary>A plain fixed-width text table: readable in a terminal, a log or a pasted e-mail.</summary>
public sealed class TextTable
{
    private readonly string[] _header;
    private readonly bool[] _rightAligned;
    private readonly List<string[]> _rows = [];

    public TextTable(params string[] header)
    {
        _header = header;
        _rightAligned = new bool[header.Length];
    }

    /// <summary>Right-aligns the given columns (numbers read better that way).</summary>
    public TextTable AlignRight(params int[] columns)
    {
        foreach (int c in columns) _rightAligned[c] = true;
        return this;
    }

    public TextTable Add(params string[] cells)
    {
        if (cells.Length != _header.Length) throw new ArgumentException("A row needs one cell per column.");
        _rows.Add(cells.Select(Printable).ToArray());
        return this;
    }

    public int RowCount => _rows.Count;

    public void WriteTo(TextWriter writer, string indent = "  ")
    {
        var widths = new int[_header.Length];
        for (int c = 0; c < _header.Length; c++)
        {
            widths[c] = _header[c].Length;
            foreach (var row in _rows) widths[c] = Math.Max(widths[c], row[c].Length);
        }
        var line = new StringBuilder();
        void Emit(string[] cells)
        {
            line.Clear().Append(indent);
            for (int c = 0; c < cells.Length; c++)
            {
                if (c > 0) line.Append("  ");
                line.Append(_rightAligned[c] ? cells[c].PadLeft(widths[c]) : cells[c].PadRight(widths[c]));
            }
            writer.WriteLine(line.ToString().TrimEnd());
        }
        Emit(_header);
        Emit(widths.Select(w => new string('-', w)).ToArray());
        foreach (var row in _rows) Emit(row);
    }

    /// <summary>Names come from user files: control characters would move the cursor or ring the bell.</summary>
    /// <summary>
    /// Console-safe text: control characters become '?', and hidden format characters (bidirectional
    /// overrides, zero-width spaces) a visible &lt;U+XXXX&gt;, so a name cannot reorder or hide what is printed.
    /// </summary>
    internal static string Printable(string text)
    {
        bool clean = true;
        foreach (char ch in text) if (char.IsControl(ch) || HiddenCharacters.IsHidden(ch)) { clean = false; break; }
        if (clean) return text;
        var sb = new StringBuilder(text.Length + 16);
        foreach (char ch in text)
        {
            if (char.IsControl(ch)) sb.Append('?');
            else if (HiddenCharacters.IsHidden(ch)) sb.Append(HiddenCharacters.Mark(ch));
            else sb.Append(ch);
        }
        return sb.ToString();
    }
}
