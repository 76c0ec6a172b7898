using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Tests.Randomness;

/// <summary>
/// Every named slot of <see cref="RandomStreams"/> is enumerated over realistic ranges (200
/// repeats, 10 x 10 curve folds, 20 cohorts, 200 outcome permutations, 60 trees, 50 features and
/// decoys) and reduced to the seeds of the generators it hands out; two slots that shared a
/// generator would share a seed. The sharing RandomStreams documents is the only one allowed.
/// </summary>
public class RandomStreamsTests
{
    private const ulong RunSeed = 20261204;
    private const int Repeats = 200, FoldRepeats = 10, Folds = 10, Cohorts = 20, InnerRepeats = 50, Sizes = 21;
    private const int Permutations = 200, Trees = 60, Columns = 50;

    /// <summary>The one pair of slots RandomStreams lists as shared for byte-identical results.</summary>
    private static readonly HashSet<(string, string)> DocumentedSharing = [("cohort forest", "locked panel forest")];

    /// <summary>Seeds of the per-tree streams the engine derives from a forest's coordinates (one per tree and purpose).</summary>
    private static IEnumerable<ulong> ForestSeeds(ForestStreams forest)
    {
        for (int t = 0; t < Trees; t++)
        {
            yield return SeedSchedule.Derive(forest.Seed, forest.Repeat, t, SeedPurpose.Sampling);
            yield return SeedSchedule.Derive(forest.Seed, forest.Repeat, t, SeedPurpose.Splitting);
            yield return RandomStreams.PermutationImportanceTree(forest, t);
        }
        // The permuted copies of the corrected-importance forest (engine: BinnedMatrix.WithPermutedCopies).
        for (int f = 0; f < Columns; f++) yield return SeedSchedule.Derive(forest.Seed, forest.Repeat, f, SeedPurpose.PermutedCopy);
    }

    /// <summary>A generator's identity: its first draw equals that of a generator built from the same seed.</summary>
    private static ulong Seed(Xoshiro256StarStar generator) => generator.NextUInt64();

    private static ulong AsGenerator(ulong seed) => new Xoshiro256StarStar(seed).NextUInt64();

    private static Dictionary<string, List<ulong>> Slots()
    {
        var slots = new Dictionary<string, List<ulong>>();
        void Add(string slot, IEnumerable<ulong> seeds)
        {
            if (!slots.TryGetValue(slot, out var list)) slots[slot] = list = [];
            // Seeds and generators compared alike: everything as the first draw of its generator.
            list.AddRange(seeds.Select(AsGenerator));
        }
        void AddGenerators(string slot, IEnumerable<Xoshiro256StarStar> generators)
        {
            if (!slots.TryGetValue(slot, out var list)) slots[slot] = list = [];
            list.AddRange(generators.Select(Seed));
        }

        for (int r = 0; r < Repeats; r++) Add("screen repeat forests", ForestSeeds(RandomStreams.ScreenRepeat(RunSeed, r)));
        Add("reference forest", ForestSeeds(RandomStreams.ReferenceForest(RunSeed)));
        Add("cohort forest", ForestSeeds(RandomStreams.CohortForest(RunSeed)));
        Add("locked panel forest", ForestSeeds(RandomStreams.LockedPanelForest(RunSeed)));
        Add("partner forest", ForestSeeds(RandomStreams.PartnerForest(RunSeed)));
        AddGenerators("partner copies", Enumerable.Range(0, Columns * 10).Select(c => RandomStreams.PartnerCopy(RunSeed, c)));
        Add("tracking forest", ForestSeeds(RandomStreams.TrackingForest(RunSeed)));
        var trackingForest = RandomStreams.TrackingForest(RunSeed);
        for (int t = 0; t < Trees; t++)
            for (int c = 0; c < 5; c++)
                AddGenerators("stratified permutations", Enumerable.Range(0, Columns).Select(f =>
                    RandomStreams.StratifiedPermutation(RandomStreams.PermutationImportanceTree(trackingForest, t), c, f)));

        AddGenerators("half-samples", Enumerable.Range(0, Repeats / 2).Select(p => RandomStreams.HalfSamples(RunSeed, p)));
        AddGenerators("outer folds", Enumerable.Range(0, FoldRepeats).Select(k => RandomStreams.OuterFolds(RunSeed, k)));
        AddGenerators("decoy sources", [RandomStreams.DecoySources(RunSeed)]);
        AddGenerators("added value bootstrap", [RandomStreams.AddedValueBootstrap(RunSeed)]);
        ulong decoySeed = RandomStreams.DecoyPermutationSeed(RunSeed);
        Add("decoy permutation seed", [decoySeed]);
        AddGenerators("decoy permutations", Enumerable.Range(0, Columns).Select(d => RandomStreams.DecoyPermutation(decoySeed, d)));

        var referenceForest = RandomStreams.ReferenceForest(RunSeed);
        for (int s = 0; s < Permutations; s++)
        {
            ulong permutationSeed = RandomStreams.OutcomePermutationSeed(referenceForest, s);
            Add("outcome permutation seeds", [permutationSeed]);
            AddGenerators("outcome shuffles", [RandomStreams.OutcomeShuffle(permutationSeed)]);
            // Each permutation's forest is grown with its seed as run seed, at the observed forest's repeat.
            Add("outcome permutation forests", ForestSeeds(new ForestStreams(permutationSeed, referenceForest.Repeat)).Take(2 * Trees));
        }

        var innerSeeds = new List<(string Family, ulong Seed)>();
        for (int k = 0; k < FoldRepeats; k++)
            for (int f = 0; f < Folds; f++) innerSeeds.Add(("curve fold", RandomStreams.CurveFoldScreenSeed(RunSeed, k, f)));
        for (int c = 0; c < Cohorts; c++)
        {
            innerSeeds.Add(("cohort screen", RandomStreams.CohortScreenSeed(RunSeed, c)));
            innerSeeds.Add(("held-out screen", RandomStreams.HeldOutScreenSeed(RunSeed, c)));
        }
        foreach (var (family, seed) in innerSeeds)
        {
            Add(family + " seeds", [seed]);
            for (int r = 0; r < InnerRepeats; r++) Add(family + " repeat forests", ForestSeeds(RandomStreams.ScreenRepeat(seed, r)).Take(2 * Trees));
            AddGenerators(family + " half-samples", Enumerable.Range(0, InnerRepeats / 2).Select(p => RandomStreams.HalfSamples(seed, p)));
            Add(family + " decoy permutation seed", [RandomStreams.DecoyPermutationSeed(seed)]);
        }
        foreach (var (family, seed) in innerSeeds.Where(s => s.Family == "curve fold"))
            for (int s = 0; s <= Sizes; s++) Add("panel scoring forests", ForestSeeds(RandomStreams.PanelScoring(seed, s)).Take(2 * Trees));
        foreach (var (family, seed) in innerSeeds.Where(s => s.Family == "curve fold"))
            Add("covariate scoring forests", ForestSeeds(RandomStreams.CovariateScoring(seed)).Take(2 * Trees));
        foreach (var (family, seed) in innerSeeds.Where(s => s.Family == "held-out screen"))
            Add("held-out scoring forests", ForestSeeds(RandomStreams.HeldOutScoring(seed)).Take(2 * Trees));
        return slots;
    }

    [Fact]
    public void No_two_named_slots_hand_out_the_same_stream_except_the_documented_sharing()
    {
        var owner = new Dictionary<ulong, string>();
        var clashes = new HashSet<(string, string)>();
        int streams = 0;
        foreach (var (slot, seeds) in Slots())
            foreach (ulong seed in seeds.Distinct())
            {
                streams++;
                if (owner.TryGetValue(seed, out var other) && other != slot)
                    clashes.Add(string.CompareOrdinal(other, slot) < 0 ? (other, slot) : (slot, other));
                else owner[seed] = slot;
            }
        Assert.True(streams > 1_000_000, $"only {streams} streams enumerated");
        Assert.Equal(DocumentedSharing, clashes);
    }

    [Fact]
    public void Within_a_slot_every_member_gets_its_own_stream()
    {
        // Each repeat, tree, fold, cohort and permutation is its own stream: a slot's seeds are all
        // distinct except where one method is called twice on purpose (none in this enumeration).
        foreach (var (slot, seeds) in Slots())
            Assert.True(seeds.Count == seeds.Distinct().Count(), $"{slot} repeats a stream");
    }

    [Fact]
    public void The_slot_families_refuse_members_that_would_run_into_the_next_family()
    {
        // Fold 1000 would be index slot 2000, the first cohort screen's seed.
        Assert.Throws<ArgumentOutOfRangeException>(() => RandomStreams.CurveFoldScreenSeed(RunSeed, 0, RandomStreams.SlotFamilyWidth));
        Assert.Throws<ArgumentOutOfRangeException>(() => RandomStreams.CohortScreenSeed(RunSeed, RandomStreams.SlotFamilyWidth));
        Assert.Throws<ArgumentOutOfRangeException>(() => RandomStreams.HeldOutScreenSeed(RunSeed, -1));
        // A screen repeat at the scoring base would share its streams with a panel's scoring forest.
        Assert.Throws<ArgumentOutOfRangeException>(() => RandomStreams.ScreenRepeat(RunSeed, RandomStreams.ScoringRepeatBase));
    }

    [Fact]
    public void Slots_keep_the_coordinates_earlier_results_were_drawn_with()
    {
        // Results stay byte-identical only if the registry hands out the coordinates the screen
        // used before it existed (DEVELOPERS.md's seed paragraph): checked literally here.
        Assert.Equal(SeedSchedule.Derive(RunSeed, 2, 1003, SeedPurpose.Resampling), RandomStreams.CurveFoldScreenSeed(RunSeed, 2, 3));
        Assert.Equal(SeedSchedule.Derive(RunSeed, 0, 2004, SeedPurpose.Resampling), RandomStreams.CohortScreenSeed(RunSeed, 4));
        Assert.Equal(SeedSchedule.Derive(RunSeed, 0, 3004, SeedPurpose.Resampling), RandomStreams.HeldOutScreenSeed(RunSeed, 4));
        Assert.Equal(SeedSchedule.Derive(RunSeed, int.MaxValue - 2, 0, SeedPurpose.PermutedCopy), RandomStreams.DecoyPermutationSeed(RunSeed));
        Assert.Equal(Seed(SeedSchedule.Generator(RunSeed, 7, 0, SeedPurpose.Resampling)), Seed(RandomStreams.HalfSamples(RunSeed, 7)));
        Assert.Equal(Seed(SeedSchedule.Generator(RunSeed, 3, 1, SeedPurpose.Resampling)), Seed(RandomStreams.OuterFolds(RunSeed, 3)));
        Assert.Equal(Seed(SeedSchedule.Generator(RunSeed, int.MaxValue - 2, 2, SeedPurpose.Resampling)), Seed(RandomStreams.DecoySources(RunSeed)));
        Assert.Equal(new ForestStreams(RunSeed, int.MaxValue), RandomStreams.ReferenceForest(RunSeed));
        Assert.Equal(new ForestStreams(RunSeed, int.MaxValue - 1), RandomStreams.CohortForest(RunSeed));
        Assert.Equal(new ForestStreams(RunSeed, int.MaxValue - 1), RandomStreams.LockedPanelForest(RunSeed));
        Assert.Equal(new ForestStreams(RunSeed, (1 << 20) + 5), RandomStreams.PanelScoring(RunSeed, 5));
        Assert.Equal(new ForestStreams(RunSeed, 1 << 20), RandomStreams.HeldOutScoring(RunSeed));
    }
}
