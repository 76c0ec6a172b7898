using System.Buffers.Binary;
using System.Security.Cryptography;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Work;

/// <summary>
/// The bytes of one finished work unit (layout in PARTS.md beside this file): a header naming the
/// run and the unit, the values as little-endian IEEE doubles (so a stored unit is bit-identical to
/// a computed one), and a SHA-256 of all of it, so a truncated or edited file is never used.
/// </summary>
public static class WorkUnitCodec
{
    /// <summary>"OSUNIT" and format version 2 (inner screens carry their shortlist).</summary>
    private static ReadOnlySpan<byte> Magic => "OSUNIT\0\u0002"u8;

    public const int RunIdentityLength = 32;
    private const int HeaderLength = 8 + RunIdentityLength + 4 + 4 + 8;
    private const int DigestLength = 32;

    public static byte[] Encode(ReadOnlySpan<byte> runIdentity, WorkUnit unit, WorkUnitResult result)
    {
        if (runIdentity.Length != RunIdentityLength) throw new ArgumentException("The run identity is a 32-byte SHA-256.");
        var payload = new PayloadWriter();
        switch (result)
        {
            case RepeatUnitResult { Row: var row } when unit.Kind == WorkUnitKind.Repeat:
                if (row.RepeatCount != 1) throw new ArgumentException("A repeat unit holds exactly one repeat.");
                payload.Int(row.FeatureCount);
                payload.Int(row.DecoyCount);
                payload.Int(row.TrainingSampleCounts[0]);
                payload.Doubles(row.Corrected);
                payload.Doubles(row.Permutation);
                payload.Doubles(row.Impurity);
                payload.Doubles(row.CombinedRank);
                payload.Flags(row.Selected);
                payload.Doubles(row.DecoyCorrected);
                payload.Flags(row.DecoySelected);
                break;
            case InnerScreenResult inner when unit.Kind != WorkUnitKind.Repeat:
                if (inner.Order.Length != inner.MeanCorrected.Length) throw new ArgumentException("Order and importances differ in length.");
                payload.Int(inner.Order.Length);
                foreach (int f in inner.Order) payload.Int(f);
                payload.Doubles(inner.MeanCorrected);
                payload.Int(inner.Shortlist.Length);
                foreach (int f in inner.Shortlist) payload.Int(f);
                break;
            default:
                throw new ArgumentException($"A {result.GetType().Name} is not the result of {unit.Name}.");
        }
        var body = payload.ToArray();
        var bytes = new byte[HeaderLength + body.Length + DigestLength];
        Magic.CopyTo(bytes);
        runIdentity.CopyTo(bytes.AsSpan(8));
        BinaryPrimitives.WriteInt32LittleEndian(bytes.AsSpan(8 + RunIdentityLength), (int)unit.Kind);
        BinaryPrimitives.WriteInt32LittleEndian(bytes.AsSpan(12 + RunIdentityLength), unit.Index);
        BinaryPrimitives.WriteInt64LittleEndian(bytes.AsSpan(16 + RunIdentityLength), body.Length);
        body.CopyTo(bytes.AsSpan(HeaderLength));
        SHA256.HashData(bytes.AsSpan(0, HeaderLength + body.Length), bytes.AsSpan(HeaderLength + body.Length));
        return bytes;
    }

    /// <summary>
    /// The unit's result, or null with the reason when the bytes are not a whole, unedited unit
    /// of this run: wrong format, another run, another unit, wrong sizes or a failed digest.
    /// </summary>
    public static WorkUnitResult? Decode(ReadOnlySpan<byte> bytes, ReadOnlySpan<byte> runIdentity, WorkUnit unit,
        int featureCount, int decoyCount, out string? problem)
    {
        problem = null;
        if (bytes.Length < HeaderLength + DigestLength || !bytes[..8].SequenceEqual(Magic))
            return Fail("is not a work-unit file of this version", out problem);
        long bodyLength = BinaryPrimitives.ReadInt64LittleEndian(bytes[(16 + RunIdentityLength)..]);
        if (bodyLength < 0 || bodyLength != bytes.Length - HeaderLength - DigestLength)
            return Fail("is truncated or has trailing bytes", out problem);
        Span<byte> digest = stackalloc byte[DigestLength];
        SHA256.HashData(bytes[..(HeaderLength + (int)bodyLength)], digest);
        if (!digest.SequenceEqual(bytes[(HeaderLength + (int)bodyLength)..]))
            return Fail("fails its SHA-256 check (damaged or edited)", out problem);
        if (!bytes.Slice(8, RunIdentityLength).SequenceEqual(runIdentity))
            return Fail("belongs to a different run (other inputs, settings or version)", out problem);
        var kind = (WorkUnitKind)BinaryPrimitives.ReadInt32LittleEndian(bytes[(8 + RunIdentityLength)..]);
        int index = BinaryPrimitives.ReadInt32LittleEndian(bytes[(12 + RunIdentityLength)..]);
        if (kind != unit.Kind || index != unit.Index)
            return Fail($"holds {new WorkUnit(kind, index)}, not {unit.Name}", out problem);
        // Sizes follow from the panel: 3 ints, 4 doubles and a flag per feature, a double and a
        // flag per decoy for a repeat; otherwise the count, an int and a double per feature, then
        // the shortlist's length and an int per shortlisted feature.
        if (unit.Kind == WorkUnitKind.Repeat)
        {
            if (bodyLength != 12L + 33L * featureCount + 9L * decoyCount) return Fail("has a different number of features or decoys", out problem);
        }
        else
        {
            long fixedPart = 4L + 12L * featureCount + 4L;
            if (bodyLength < fixedPart || (bodyLength - fixedPart) % 4 != 0 || (bodyLength - fixedPart) / 4 > featureCount)
                return Fail("has a different number of features or decoys", out problem);
            int statedLength = BinaryPrimitives.ReadInt32LittleEndian(bytes.Slice(HeaderLength + (int)fixedPart - 4, 4));
            if (statedLength != (bodyLength - fixedPart) / 4) return Fail("has a shortlist of impossible length", out problem);
        }
        var reader = new PayloadReader(bytes.Slice(HeaderLength, (int)bodyLength).ToArray());
        if (unit.Kind == WorkUnitKind.Repeat)
        {
            if (reader.Int() != featureCount || reader.Int() != decoyCount)
                return Fail("has a different number of features or decoys", out problem);
            var row = new RepeatImportances(1, featureCount, decoyCount);
            row.TrainingSampleCounts[0] = reader.Int();
            reader.Doubles(row.Corrected);
            reader.Doubles(row.Permutation);
            reader.Doubles(row.Impurity);
            reader.Doubles(row.CombinedRank);
            reader.Flags(row.Selected);
            reader.Doubles(row.DecoyCorrected);
            reader.Flags(row.DecoySelected);
            return reader.AtEnd ? new RepeatUnitResult(row) : Fail("has trailing values", out problem);
        }
        int count = reader.Int();
        if (count != featureCount) return Fail("has a different number of features", out problem);
        var order = new int[count];
        for (int i = 0; i < count; i++)
        {
            order[i] = reader.Int();
            if ((uint)order[i] >= (uint)count) return Fail("names a feature outside the panel", out problem);
        }
        var mean = new double[count];
        reader.Doubles(mean);
        int listed = reader.Int();
        var shortlist = new int[listed];
        for (int i = 0; i < listed; i++)
        {
            shortlist[i] = reader.Int();
            if ((uint)shortlist[i] >= (uint)count) return Fail("names a feature outside the panel", out problem);
        }
        return reader.AtEnd ? new InnerScreenResult(order, mean, shortlist) : Fail("has trailing values", out problem);
    }

    private static WorkUnitResult? Fail(string reason, out string? problem)
    {
        problem = reason;
        return null;
    }

    private sealed class PayloadWriter
    {
        private readonly MemoryStream _stream = new();
        private readonly byte[] _buffer = new byte[8];

        public void Int(int value)
        {
            BinaryPrimitives.WriteInt32LittleEndian(_buffer, value);
            _stream.Write(_buffer, 0, 4);
        }

        public void Doubles(ReadOnlySpan<double> values)
        {
            foreach (double value in values)
            {
                BinaryPrimitives.WriteDoubleLittleEndian(_buffer, value);
                _stream.Write(_buffer, 0, 8);
            }
        }

        public void Flags(ReadOnlySpan<bool> values)
        {
            foreach (bool value in values) _stream.WriteByte(value ? (byte)1 : (byte)0);
        }

        public byte[] ToArray() => _stream.ToArray();
    }

    /// <summary>Reads the payload; the digest has been checked, so a short payload means a writer bug and throws.</summary>
    private sealed class PayloadReader(byte[] bytes)
    {
        private int _position;

        public bool AtEnd => _position == bytes.Length;

        public int Int()
        {
            int value = BinaryPrimitives.ReadInt32LittleEndian(bytes.AsSpan(_position, 4));
            _position += 4;
            return value;
        }

        public void Doubles(Span<double> values)
        {
            for (int i = 0; i < values.Length; i++, _position += 8)
                values[i] = BinaryPrimitives.ReadDoubleLittleEndian(bytes.AsSpan(_position, 8));
        }

        public void Flags(Span<bool> values)
        {
            for (int i = 0; i < values.Length; i++, _position++) values[i] = bytes[_position] != 0;
        }
    }
}
