namespace OmicsScreen.Data.Text;

/// <summary>
/// Reads delimited text one row at a time with no limit on a row's length (the limit is memory),
/// for rows longer than the fast reader's buffer: a samples-in-rows export of a million features.
/// Quoting follows RFC 4180: a field that starts with a quote runs to the next quote not doubled,
/// may hold delimiters and line breaks, and a doubled quote inside stands for one quote.
/// </summary>
internal sealed class TextRowReader
{
    private readonly TextReader _text;
    private readonly char _delimiter;
    private readonly char[] _buffer = new char[1 << 16];
    private int _position;
    private int _filled;
    private long _line = 1;

    public TextRowReader(TextReader text, char delimiter)
    {
        _text = text;
        _delimiter = delimiter;
    }

    /// <summary>Reads the next row into <paramref name="row"/>; false at the end of the text.</summary>
    public bool Next(TextRow row)
    {
        row.Clear();
        row.FirstLine = _line;
        if (Peek() < 0) return false;
        bool fieldStart = true, quoted = false;
        while (true)
        {
            int next = Read();
            if (next < 0)
            {
                row.EndField();
                return true;
            }
            char c = (char)next;
            if (c == '\n') _line++;
            if (quoted)
            {
                if (c != '"') row.Append(c);
                else if (Peek() == '"') row.Append((char)Read());
                else quoted = false;
                continue;
            }
            if (c == '"' && fieldStart)
            {
                quoted = true;
                fieldStart = false;
                continue;
            }
            if (c == _delimiter)
            {
                row.EndField();
                fieldStart = true;
                continue;
            }
            if (c is '\n' or '\r')
            {
                if (c == '\r')
                {
                    _line++;
                    if (Peek() == '\n') Read();
                }
                row.EndField();
                return true;
            }
            // Spaces before an opening quote are kept, as text, like any other character.
            row.Append(c);
            fieldStart = false;
        }
    }

    private int Peek()
    {
        if (_position == _filled && !Fill()) return -1;
        return _buffer[_position];
    }

    private int Read()
    {
        if (_position == _filled && !Fill()) return -1;
        return _buffer[_position++];
    }

    private bool Fill()
    {
        _filled = _text.Read(_buffer, 0, _buffer.Length);
        _position = 0;
        return _filled > 0;
    }
}
