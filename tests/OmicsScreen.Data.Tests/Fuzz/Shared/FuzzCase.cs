using System.Globalization;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>One damaged input of the fuzz corpus: which seed, what was done to it, and the resulting bytes.</summary>
/// <param name="SampleSheetBytes">The sample sheet as given to the loader (damaged when <see cref="SampleSheetDamaged"/>).</param>
internal sealed record FuzzCase(
    int Number,
    ulong MasterSeed,
    ulong CaseSeed,
    FuzzSeedPanel Seed,
    byte[] MatrixBytes,
    byte[]? SampleSheetBytes,
    bool SampleSheetDamaged,
    IReadOnlyList<string> Mutations)
{
    /// <summary>True when the mutations happened to leave both files byte-identical to the seed.</summary>
    public bool IsUnchanged =>
        MatrixBytes.AsSpan().SequenceEqual(Seed.MatrixBytes)
        && (SampleSheetBytes is null || SampleSheetBytes.AsSpan().SequenceEqual(Seed.SampleSheetBytes));

    /// <summary>Everything needed to replay the case: master seed, number, seed panel, damaged file and mutations.</summary>
    public string Describe() => string.Create(CultureInfo.InvariantCulture,
        $"case {Number} (master seed {MasterSeed}, case seed 0x{CaseSeed:X16}) of the {Seed.Name}, {(SampleSheetDamaged ? "sample sheet" : "matrix")} damaged by: {string.Join("; ", Mutations)}");

    public override string ToString() => Describe();
}
