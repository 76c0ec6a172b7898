using System.Globalization;

namespace OmicsScreen.Reporting.Tables;

/// <summary>
/// One column of a TSV table: its header and how a record's cell is written. Text cells are
/// sanitised (<see cref="SpreadsheetSafeText"/>); number cells use the column's stated
/// <see cref="NumberFormat"/> and are never altered by the text rules.
/// </summary>
public sealed class TsvColumn<TRecord>
{
    private readonly Func<TRecord, string?>? _text;
    private readonly Func<TRecord, double>? _number;
    private readonly Func<TRecord, long>? _integer;

    private TsvColumn(string header, Func<TRecord, string?>? text, Func<TRecord, double>? number,
        NumberFormat format, Func<TRecord, long>? integer)
    {
        ArgumentException.ThrowIfNullOrEmpty(header);
        Header = header;
        _text = text;
        _number = number;
        Format = format;
        _integer = integer;
    }

    public string Header { get; }

    /// <summary>The number format of a number column; meaningless for text and integer columns.</summary>
    public NumberFormat Format { get; }

    public bool IsText => _text is not null;

    /// <summary>A text column: the value is sanitised; null is written as an empty cell.</summary>
    public static TsvColumn<TRecord> Text(string header, Func<TRecord, string?> value) =>
        new(header, value ?? throw new ArgumentNullException(nameof(value)), null, default, null);

    /// <summary>A floating-point column written in <paramref name="format"/>; NaN is written as "NA".</summary>
    public static TsvColumn<TRecord> Number(string header, Func<TRecord, double> value, NumberFormat format) =>
        new(header, null, value ?? throw new ArgumentNullException(nameof(value)), format, null);

    /// <summary>A whole-number column (counts), written in invariant digits.</summary>
    public static TsvColumn<TRecord> Integer(string header, Func<TRecord, long> value) =>
        new(header, null, null, default, value ?? throw new ArgumentNullException(nameof(value)));

    /// <summary>Writes the cell of <paramref name="record"/>; <paramref name="scratch"/> holds number text (64 chars suffice).</summary>
    internal void WriteCell(TextWriter writer, TRecord record, Span<char> scratch)
    {
        if (_text is not null)
        {
            writer.Write(SpreadsheetSafeText.Sanitise(_text(record)));
            return;
        }
        int written;
        bool fits = _number is not null
            ? Format.TryFormat(_number(record), scratch, out written)
            : _integer!(record).TryFormat(scratch, out written, default, CultureInfo.InvariantCulture);
        if (!fits) throw new InvalidOperationException($"Number in column '{Header}' is longer than the cell buffer.");
        writer.Write(scratch[..written]);
    }
}
