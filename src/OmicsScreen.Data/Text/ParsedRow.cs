namespace OmicsScreen.Data.Text;

/// <summary>
/// What a parsing worker found in one text row. Workers store cells straight into the columns
/// and report everything else here, so that the reading thread can check rows in file order and
/// always report the first problem of the file, whatever the thread timing.
/// </summary>
internal sealed class ParsedRow
{
    public bool IsBlank { get; init; }

    /// <summary>True when the row's first cell starts with '#' or '!': a comment line below the header.</summary>
    public bool IsComment { get; init; }
    public long Line { get; init; }
    public int FieldCount { get; init; }

    /// <summary>The column slot (features in rows) or sample slot (samples in rows) the row was stored in.</summary>
    public int Slot { get; init; }

    /// <summary>True when the row lies beyond the slots sized from the line count (which cannot happen for valid text).</summary>
    public bool BeyondCapacity { get; init; }

    /// <summary>The sample id (samples in rows) or row label (features in rows), trimmed.</summary>
    public string Label { get; set; } = "";

    /// <summary>Attribute texts: one per attribute column, or for an attribute row one per sample.</summary>
    public string[]? Texts { get; set; }

    /// <summary>A feature row's describing texts (its annotation columns), trimmed.</summary>
    public string[]? Descriptors { get; set; }

    /// <summary>The index (feature or sample) of the first cell that is not a measurement, or -1.</summary>
    public int FailedIndex { get; set; } = -1;
    public string FailedText { get; set; } = "";
    public CellKind FailedKind { get; set; }

    /// <summary>True when the row is not blank, has one field per header column and has a slot.</summary>
    public bool CanHoldCells(int fieldCount) => !IsBlank && FieldCount == fieldCount && !BeyondCapacity;

    /// <summary>Records the first cell that is not a measurement.</summary>
    public void Fail(int index, ReadOnlySpan<char> text, CellKind kind)
    {
        FailedIndex = index;
        FailedText = text.ToString();
        FailedKind = kind;
    }
}
