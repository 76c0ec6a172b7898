namespace OmicsScreen.Data.Text;

/// <summary>
/// One row of delimited text held whole, however long: the unescaped characters of every field
/// one after another, and where each field starts and ends. Reused from row to row, so its
/// buffers grow to the longest row and no further.
/// </summary>
internal sealed class TextRow
{
    private char[] _chars = new char[1 << 16];
    private int[] _starts = new int[256];
    private int _length;

    /// <summary>The 1-based line the row starts on.</summary>
    public long FirstLine { get; set; }

    public int FieldCount { get; private set; }

    /// <summary>The field's unescaped text (quotes removed, doubled quotes made single).</summary>
    public ReadOnlySpan<char> this[int field] => _chars.AsSpan(_starts[field], _starts[field + 1] - _starts[field]);

    public bool IsBlank => FieldCount == 1 && this[0].Trim().IsEmpty;

    public void Clear()
    {
        _length = 0;
        FieldCount = 0;
        _starts[0] = 0;
    }

    public void Append(char c)
    {
        if (_length == _chars.Length) Array.Resize(ref _chars, checked(_chars.Length * 2));
        _chars[_length++] = c;
    }

    /// <summary>Ends the current field; the next character starts a new one.</summary>
    public void EndField()
    {
        if (FieldCount + 2 > _starts.Length) Array.Resize(ref _starts, checked(_starts.Length * 2));
        FieldCount++;
        _starts[FieldCount] = _length;
    }
}
