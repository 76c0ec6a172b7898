using System.Globalization;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// The seeded fuzz corpus: case number k of master seed m is always the same damaged input,
/// made by its own generator, so one case can be rebuilt without the others.
/// </summary>
/// <remarks>
/// Three cases in ten damage a binary seed (Parquet, Arrow) and seven a text seed. Set
/// OMICSSCREEN_FUZZ_SEED to explore another corpus of the same shape, and
/// OMICSSCREEN_FUZZ_CASES to change its size; a failure names the master seed and case.
/// </remarks>
internal static class FuzzCorpus
{
    public const ulong DefaultMasterSeed = 20261202;
    public const int DefaultCaseCount = 2000;

    /// <summary>A features-in-rows seed with a sample sheet damages the sheet instead of the matrix one time in four.</summary>
    private const int SheetDamageOdds = 4;

    public static ulong MasterSeed =>
        ulong.TryParse(Environment.GetEnvironmentVariable("OMICSSCREEN_FUZZ_SEED"), NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed)
            ? seed
            : DefaultMasterSeed;

    public static int CaseCount(int defaultCount) =>
        int.TryParse(Environment.GetEnvironmentVariable("OMICSSCREEN_FUZZ_CASES"), NumberStyles.None, CultureInfo.InvariantCulture, out int count)
            ? count
            : defaultCount;

    public static bool IsBinary(int number) => number % 10 < 3;

    public static FuzzCase Case(ulong masterSeed, int number, IReadOnlyList<FuzzSeedPanel> textSeeds,
        IReadOnlyList<FuzzSeedPanel> binarySeeds)
    {
        // SplitMix64 spreads (master seed, case number) into an independent generator seed.
        ulong caseSeed = SplitMix64.Mix(masterSeed + (ulong)(number + 1) * SplitMix64.Increment);
        var choice = new Xoshiro256StarStar(caseSeed);
        var seeds = IsBinary(number) ? binarySeeds : textSeeds;
        var seed = seeds[choice.NextInt(seeds.Count)];
        bool damageSheet = seed.SampleSheetBytes is not null && choice.NextInt(SheetDamageOdds) == 0;

        var mutator = new PanelMutator(choice.NextUInt64());
        var mutations = new List<string>();
        byte[] matrix = seed.MatrixBytes;
        byte[]? sheet = seed.SampleSheetBytes;
        if (damageSheet) sheet = mutator.Mutate(sheet!, isText: true, ',', mutations);
        else matrix = mutator.Mutate(matrix, seed.IsText, seed.Delimiter, mutations);
        return new FuzzCase(number, masterSeed, caseSeed, seed, matrix, sheet, damageSheet, mutations);
    }
}
