using System.Text;
using OmicsScreen.Data;

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

    /// <summary>Names come from user files: printed by the one console rule, <see cref="UntrustedText.Printable"/>.</summary>
    internal static string Printable(string text) => UntrustedText.Printable(text);
}
