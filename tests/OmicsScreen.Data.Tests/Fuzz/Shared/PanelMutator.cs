using System.Globalization;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// Damages the bytes of a panel file, deterministically from one seed: the same seed and input
/// give the same output and the same description of what was done, so any case can be replayed.
/// </summary>
/// <remarks>
/// Text mutations treat the file as lines split at LF and fields split at the delimiter without
/// regard to quotes: the mutator must be able to produce what a careless editor produces, not
/// only well-formed CSV. Binary files take byte damage only; half of those positions fall in the
/// first or last 512 bytes, where Parquet and Arrow keep their schema and footer, because damage
/// to the float payload alone mostly just changes numbers.
/// </remarks>
internal sealed class PanelMutator
{
    private const int StructureBytes = 512;
    private static readonly byte[] Delimiters = [(byte)',', (byte)'\t', (byte)';'];

    /// <summary>Byte sequences that are hostile to a UTF-8 text reader.</summary>
    private static readonly byte[][] HostileBytes =
    [
        [0x00],
        [0xFF],
        [0xFE, 0xFF],
        [0xC3],             // a lead byte with no continuation
        [0x80],             // a continuation byte with no lead
        [0xED, 0xA0, 0x80], // an encoded UTF-16 surrogate, invalid in UTF-8
        [0xEF, 0xBB, 0xBF], // a byte-order mark in mid-file
        [(byte)'\r'],
        [(byte)'"'],
    ];

    private static readonly MutationKind[] TextKinds = Enum.GetValues<MutationKind>();
    private static readonly MutationKind[] BinaryKinds = [MutationKind.FlipBytes, MutationKind.Truncate, MutationKind.InsertBytes];

    private Xoshiro256StarStar _random;

    public PanelMutator(ulong seed) => _random = new Xoshiro256StarStar(seed);

    /// <summary>Applies one to three mutations, appending a description of each to <paramref name="applied"/>.</summary>
    public byte[] Mutate(byte[] original, bool isText, char delimiter, List<string> applied)
    {
        var bytes = new List<byte>(original);
        int mutationCount = 1 + _random.NextInt(3);
        var kinds = isText ? TextKinds : BinaryKinds;
        for (int m = 0; m < mutationCount; m++)
            applied.Add(Apply(kinds[_random.NextInt(kinds.Length)], bytes, isText, (byte)delimiter));
        return [.. bytes];
    }

    private string Apply(MutationKind kind, List<byte> bytes, bool isText, byte delimiter)
    {
        if (bytes.Count == 0 && kind != MutationKind.InsertBytes && kind != MutationKind.InsertStrayQuote)
            return $"{kind}(file already empty, nothing done)";
        return kind switch
        {
            MutationKind.FlipBytes => FlipBytes(bytes, isText),
            MutationKind.Truncate => Truncate(bytes, isText),
            MutationKind.InsertBytes => InsertBytes(bytes, isText),
            MutationKind.DeleteLine => DeleteLine(bytes),
            MutationKind.DuplicateLine => DuplicateLine(bytes),
            MutationKind.SwapDelimiterInLine or MutationKind.SwapDelimiterInFile => SwapDelimiter(bytes, delimiter, kind),
            MutationKind.InsertStrayQuote => InsertStrayQuote(bytes),
            MutationKind.EmptyCell => EmptyCell(bytes, delimiter),
            MutationKind.DuplicateHeaderName => DuplicateHeaderName(bytes, delimiter),
            _ => throw new ArgumentOutOfRangeException(nameof(kind)),
        };
    }

    private string FlipBytes(List<byte> bytes, bool isText)
    {
        int flipCount = 1 + _random.NextInt(4);
        var flips = new List<string>(flipCount);
        for (int i = 0; i < flipCount; i++)
        {
            int position = Position(bytes.Count, isText);
            byte before = bytes[position];
            bytes[position] = (byte)(before ^ (1 + _random.NextInt(255)));
            flips.Add(string.Create(CultureInfo.InvariantCulture, $"@{position} {before:X2}->{bytes[position]:X2}"));
        }
        return $"FlipBytes({string.Join(", ", flips)})";
    }

    private string Truncate(List<byte> bytes, bool isText)
    {
        int keep = Position(bytes.Count, isText);
        int before = bytes.Count;
        bytes.RemoveRange(keep, bytes.Count - keep);
        return Invariant($"Truncate(keep {keep} of {before} bytes)");
    }

    private string InsertBytes(List<byte> bytes, bool isText)
    {
        int position = bytes.Count == 0 ? 0 : Position(bytes.Count + 1, isText);
        int pieceCount = 1 + _random.NextInt(3);
        var inserted = new List<byte>();
        for (int p = 0; p < pieceCount; p++)
        {
            // One draw in ten is any byte at all, so the hostile list is not the only source.
            if (_random.NextInt(10) == 0) inserted.Add((byte)_random.NextInt(256));
            else inserted.AddRange(HostileBytes[_random.NextInt(HostileBytes.Length)]);
        }
        bytes.InsertRange(position, inserted);
        return Invariant($"InsertBytes(@{position} {Convert.ToHexString([.. inserted])})");
    }

    private string DeleteLine(List<byte> bytes)
    {
        var lines = Lines(bytes);
        int line = _random.NextInt(lines.Count);
        var (start, length) = lines[line];
        int end = Math.Min(bytes.Count, start + length + 1);
        bytes.RemoveRange(start, end - start);
        return Invariant($"DeleteLine({line + 1} of {lines.Count})");
    }

    private string DuplicateLine(List<byte> bytes)
    {
        var lines = Lines(bytes);
        int line = _random.NextInt(lines.Count);
        var (start, length) = lines[line];
        var copy = bytes.GetRange(start, length);
        copy.Add((byte)'\n');
        bytes.InsertRange(Math.Min(bytes.Count, start + length + 1), copy);
        if (start + length == bytes.Count - copy.Count) bytes.Insert(start + length, (byte)'\n');
        return Invariant($"DuplicateLine({line + 1} of {lines.Count})");
    }

    private string SwapDelimiter(List<byte> bytes, byte delimiter, MutationKind kind)
    {
        bool wholeFile = kind == MutationKind.SwapDelimiterInFile;
        // Mostly replace the file's own delimiter, which is what turns a CSV into a mixed file.
        byte from = _random.NextInt(4) < 3 ? delimiter : Delimiters[_random.NextInt(Delimiters.Length)];
        byte to;
        do to = Delimiters[_random.NextInt(Delimiters.Length)]; while (to == from);
        int start = 0, end = bytes.Count, line = 0;
        var lines = Lines(bytes);
        if (!wholeFile)
        {
            line = _random.NextInt(lines.Count);
            (start, int length) = lines[line];
            end = start + length;
        }
        int replaced = 0;
        for (int i = start; i < end; i++)
        {
            if (bytes[i] != from) continue;
            bytes[i] = to;
            replaced++;
        }
        string where = wholeFile ? "" : Invariant($"line {line + 1}, ");
        return Invariant($"{kind}({where}{Name(from)}->{Name(to)}, {replaced} replaced)");
    }

    private string InsertStrayQuote(List<byte> bytes)
    {
        int position = _random.NextInt(bytes.Count + 1);
        bytes.Insert(position, (byte)'"');
        return Invariant($"InsertStrayQuote(@{position})");
    }

    private string EmptyCell(List<byte> bytes, byte delimiter)
    {
        var lines = Lines(bytes);
        int line = _random.NextInt(lines.Count);
        var fields = Fields(bytes, lines[line], delimiter);
        int field = _random.NextInt(fields.Count);
        var (start, length) = fields[field];
        bytes.RemoveRange(start, length);
        return Invariant($"EmptyCell(line {line + 1}, field {field + 1} of {fields.Count})");
    }

    private string DuplicateHeaderName(List<byte> bytes, byte delimiter)
    {
        var lines = Lines(bytes);
        var fields = Fields(bytes, lines[0], delimiter);
        if (fields.Count < 2) return "DuplicateHeaderName(header has one field, nothing done)";
        int source = _random.NextInt(fields.Count);
        int target;
        do target = _random.NextInt(fields.Count); while (target == source);
        var name = bytes.GetRange(fields[source].Start, fields[source].Length);
        bytes.RemoveRange(fields[target].Start, fields[target].Length);
        bytes.InsertRange(fields[target].Start, name);
        return Invariant($"DuplicateHeaderName(field {target + 1} takes the name of field {source + 1})");
    }

    /// <summary>A byte position in [0, count): uniform for text; for binary, half near either end.</summary>
    private int Position(int count, bool isText)
    {
        if (isText || count <= 2 * StructureBytes) return _random.NextInt(count);
        return _random.NextInt(4) switch
        {
            0 => _random.NextInt(StructureBytes),
            1 => count - 1 - _random.NextInt(StructureBytes),
            _ => _random.NextInt(count),
        };
    }

    /// <summary>Each line as (start, length without its LF); a file without a final LF still has its last line.</summary>
    private static List<(int Start, int Length)> Lines(List<byte> bytes)
    {
        var lines = new List<(int, int)>();
        int start = 0;
        for (int i = 0; i < bytes.Count; i++)
        {
            if (bytes[i] != (byte)'\n') continue;
            lines.Add((start, i - start));
            start = i + 1;
        }
        if (start < bytes.Count || lines.Count == 0) lines.Add((start, bytes.Count - start));
        return lines;
    }

    private static List<(int Start, int Length)> Fields(List<byte> bytes, (int Start, int Length) line, byte delimiter)
    {
        var fields = new List<(int, int)>();
        int start = line.Start, end = line.Start + line.Length;
        for (int i = line.Start; i < end; i++)
        {
            if (bytes[i] != delimiter) continue;
            fields.Add((start, i - start));
            start = i + 1;
        }
        fields.Add((start, end - start));
        return fields;
    }

    private static string Name(byte delimiter) => delimiter switch
    {
        (byte)',' => "comma",
        (byte)'\t' => "tab",
        _ => "semicolon",
    };

    private static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
