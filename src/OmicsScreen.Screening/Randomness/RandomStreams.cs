using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Screening.Randomness;

/// <summary>
/// The registry of the screening layer's random streams: every slot of
/// <see cref="SeedSchedule"/> (run seed, repeat, index, purpose) the screen, its inner screens,
/// the curve, the cohort check and the locked panel use has one named method here, so no two
/// purposes can pick the same coordinates by accident. A test enumerates every slot over
/// realistic ranges and proves them disjoint except for the sharing listed below.
/// </summary>
/// <remarks>
/// Layout, at one run seed:
/// <list type="bullet">
/// <item>repeat coordinates 0 .. 2 x pairs - 1: the half-sample repeats' forests (and their permuted copies);</item>
/// <item>repeat coordinates 1 &lt;&lt; 20 and up: forests that score a panel, grown at an inner
/// screen's seed, clear of that inner screen's own repeats (it never has a million of them); from
/// (1 &lt;&lt; 20) + (1 &lt;&lt; 16) the forests that score a fold's clinical covariates;</item>
/// <item>int.MaxValue: the reference forest on all samples and the outcome-permutation null's observed forest;
/// int.MaxValue - 1: the forest predicting the cohort and the locked panel's forest;
/// int.MaxValue - 2: the decoys (sources and permutations, once per run);
/// int.MaxValue - 3: the interaction-partner scan's forest; int.MaxValue - 4: its stratum-permuted copies;
/// int.MaxValue - 5: the forest telling markers that track a covariate;</item>
/// <item>purpose Resampling, index slots: 0 half-samples (repeat = pair), 1 outer folds (repeat =
/// fold repeat), 2 decoy sources, 3 the added value's bootstrap (repeat 0), 1000 + fold inner seeds of the curve's folds (repeat = fold
/// repeat), 2000 + cohort and 3000 + cohort the seeds of each cohort's own screen and of the
/// screen without it (so at most 1,000 folds and 1,000 cohorts, checked).</item>
/// </list>
/// Deliberate sharing (both forests see the same samples, so their comparison is paired):
/// the clean and the decoy-carrying forest of one repeat (<see cref="ScreenRepeat"/>); the reference
/// forest and the outcome-permutation null's observed forest (<see cref="ReferenceForest"/>); a curve
/// fold's selection-aware and optimistic forests of one panel size (<see cref="PanelScoring"/>); a curve
/// fold's covariates-alone and covariates-with-panel forests (<see cref="CovariateScoring"/>).
/// Sharing kept for byte-identical results, not by design: the cohort forest and the locked panel's
/// forest both use int.MaxValue - 1 at the run seed (<see cref="CohortForest"/>,
/// <see cref="LockedPanelForest"/>); they answer different questions (the cohort from all features,
/// the outcome from k markers), so neither estimate is biased by it.
/// </remarks>
public static class RandomStreams
{
    /// <summary>Repeat coordinate of the reference forest on all samples.</summary>
    public const int ReferenceRepeat = int.MaxValue;

    /// <summary>Repeat coordinate of the forest predicting the cohort (shared with the locked panel, see remarks).</summary>
    public const int CohortForestRepeat = int.MaxValue - 1;

    /// <summary>Repeat coordinate of the locked panel's forest.</summary>
    public const int LockRepeat = int.MaxValue - 1;

    /// <summary>Repeat coordinate of the decoys' streams: one per run, shared by every repeat.</summary>
    public const int DecoyRepeat = int.MaxValue - 2;

    /// <summary>Repeat coordinate of the interaction-partner scan's forest.</summary>
    public const int PartnerForestRepeat = int.MaxValue - 3;

    /// <summary>Repeat coordinate of the interaction-partner scan's stratum-permuted copies.</summary>
    public const int PartnerCopyRepeat = int.MaxValue - 4;
    /// <summary>Repeat coordinate of the forest that tells markers tracking a covariate (its trees and the permuted copies of its decoys).</summary>
    public const int TrackingRepeat = int.MaxValue - 5;

    /// <summary>First repeat coordinate of the forests that score a panel at an inner screen's seed.</summary>
    public const int ScoringRepeatBase = 1 << 20;

    /// <summary>Index slots of the Resampling purpose.</summary>
    private const int HalfSampleSlot = 0, OuterFoldSlot = 1, DecoySourceSlot = 2, AddedValueBootstrapSlot = 3;

    /// <summary>Index slot offsets of the inner screens' seeds; each family holds fewer than <see cref="SlotFamilyWidth"/> members.</summary>
    private const int CurveFoldSlot = 1000, CohortScreenSlot = 2000, HeldOutScreenSlot = 3000;

    /// <summary>How many folds (or cohorts) one slot family can name before it would run into the next.</summary>
    public const int SlotFamilyWidth = 1000;

    /// <summary>Repeat <paramref name="repeat"/> of a screen at <paramref name="runSeed"/> (main or inner): its clean and its decoy-carrying forest.</summary>
    public static ForestStreams ScreenRepeat(ulong runSeed, int repeat)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(repeat);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(repeat, ScoringRepeatBase);
        return new(runSeed, repeat);
    }

    /// <summary>The forest on all samples (and the outcome-permutation null's observed forest).</summary>
    public static ForestStreams ReferenceForest(ulong runSeed) => new(runSeed, ReferenceRepeat);

    /// <summary>The forest predicting the cohort from every feature.</summary>
    public static ForestStreams CohortForest(ulong runSeed) => new(runSeed, CohortForestRepeat);

    /// <summary>The forest on the shortlisted markers and their permuted copies that tells which markers only track a covariate.</summary>
    public static ForestStreams TrackingForest(ulong runSeed) => new(runSeed, TrackingRepeat);

    /// <summary>The locked panel's forest on all discovery samples.</summary>
    public static ForestStreams LockedPanelForest(ulong runSeed) => new(runSeed, LockRepeat);

    /// <summary>
    /// The forest scoring a panel of the <paramref name="sizeIndex"/>-th size in a curve fold (the
    /// selection-aware and the optimistic panel of one size share it), or the fold's locked panel at
    /// sizeIndex = the number of sizes; <paramref name="innerSeed"/> is the fold's <see cref="CurveFoldScreenSeed"/>.
    /// </summary>
    public static ForestStreams PanelScoring(ulong innerSeed, int sizeIndex)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(sizeIndex);
        return new(innerSeed, ScoringRepeatBase + sizeIndex);
    }

    /// <summary>
    /// Offset, above <see cref="ScoringRepeatBase"/>, of the forests that score clinical
    /// covariates in a curve fold; a curve never has this many panel sizes.
    /// </summary>
    public const int CovariateScoringOffset = 1 << 16;

    /// <summary>
    /// The forests scoring a curve fold's covariates alone and its covariates beside the fold's
    /// locked panel (shared on purpose: the same bootstraps make the gain a paired comparison);
    /// <paramref name="innerSeed"/> is the fold's <see cref="CurveFoldScreenSeed"/>.
    /// </summary>
    public static ForestStreams CovariateScoring(ulong innerSeed) => new(innerSeed, ScoringRepeatBase + CovariateScoringOffset);

    /// <summary>The forest scoring a held-out cohort with the other cohorts' panel; <paramref name="heldOutSeed"/> is <see cref="HeldOutScreenSeed"/>.</summary>
    public static ForestStreams HeldOutScoring(ulong heldOutSeed) => new(heldOutSeed, ScoringRepeatBase);

    /// <summary>The interaction-partner scan's forest on the panel and the markers' stratum-permuted copies.</summary>
    public static ForestStreams PartnerForest(ulong runSeed) => new(runSeed, PartnerForestRepeat);

    /// <summary>The shuffle of the interaction-partner scan's copy <paramref name="copy"/> (marker i's copy m is i x copies + m).</summary>
    public static Xoshiro256StarStar PartnerCopy(ulong runSeed, int copy)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(copy);
        return SeedSchedule.Generator(runSeed, PartnerCopyRepeat, copy, SeedPurpose.PermutedCopy);
    }

    /// <summary>The generator of half-sample pair <paramref name="pair"/>.</summary>
    public static Xoshiro256StarStar HalfSamples(ulong runSeed, int pair) =>
        SeedSchedule.Generator(runSeed, pair, HalfSampleSlot, SeedPurpose.Resampling);

    /// <summary>The generator dealing the outer folds of fold repeat <paramref name="foldRepeat"/>.</summary>
    public static Xoshiro256StarStar OuterFolds(ulong runSeed, int foldRepeat) =>
        SeedSchedule.Generator(runSeed, foldRepeat, OuterFoldSlot, SeedPurpose.Resampling);

    /// <summary>The generator choosing which features get a decoy.</summary>
    public static Xoshiro256StarStar DecoySources(ulong runSeed) =>
        SeedSchedule.Generator(runSeed, DecoyRepeat, DecoySourceSlot, SeedPurpose.Resampling);

    /// <summary>The generator resampling samples for the added value's paired bootstrap (measured and follow-up outcomes).</summary>
    public static Xoshiro256StarStar AddedValueBootstrap(ulong runSeed) =>
        SeedSchedule.Generator(runSeed, 0, AddedValueBootstrapSlot, SeedPurpose.Resampling);

    /// <summary>The seed every decoy's permutation derives from (once per run).</summary>
    public static ulong DecoyPermutationSeed(ulong runSeed) =>
        SeedSchedule.Derive(runSeed, DecoyRepeat, 0, SeedPurpose.PermutedCopy);

    /// <summary>
    /// The shuffle of decoy <paramref name="decoy"/>'s samples: the stream the engine's
    /// BinnedMatrix.WithPermutedCopies draws for column <paramref name="decoy"/> at (seed, repeat 0),
    /// so the raw values' permutation is the byte codes' one.
    /// </summary>
    public static Xoshiro256StarStar DecoyPermutation(ulong decoyPermutationSeed, int decoy) =>
        SeedSchedule.Generator(decoyPermutationSeed, 0, decoy, SeedPurpose.PermutedCopy);

    /// <summary>Run seed of the inner screen of outer fold <paramref name="fold"/> in fold repeat <paramref name="foldRepeat"/>.</summary>
    public static ulong CurveFoldScreenSeed(ulong runSeed, int foldRepeat, int fold) =>
        SeedSchedule.Derive(runSeed, foldRepeat, CurveFoldSlot + InFamily(fold), SeedPurpose.Resampling);

    /// <summary>Run seed of cohort <paramref name="cohort"/>'s own screen.</summary>
    public static ulong CohortScreenSeed(ulong runSeed, int cohort) =>
        SeedSchedule.Derive(runSeed, 0, CohortScreenSlot + InFamily(cohort), SeedPurpose.Resampling);

    /// <summary>Run seed of the screen of every cohort but <paramref name="cohort"/>.</summary>
    public static ulong HeldOutScreenSeed(ulong runSeed, int cohort) =>
        SeedSchedule.Derive(runSeed, 0, HeldOutScreenSlot + InFamily(cohort), SeedPurpose.Resampling);

    /// <summary>Seed of outcome permutation <paramref name="permutation"/> of the null grown at <paramref name="observed"/>'s coordinates; it is also that permutation's forest's run seed.</summary>
    public static ulong OutcomePermutationSeed(ForestStreams observed, int permutation) =>
        SeedSchedule.Derive(observed.Seed, observed.Repeat, permutation, SeedPurpose.OutcomePermutation);

    /// <summary>The generator shuffling the outcome labels of one outcome permutation.</summary>
    public static Xoshiro256StarStar OutcomeShuffle(ulong permutationSeed) =>
        SeedSchedule.Generator(permutationSeed, 0, 0, SeedPurpose.OutcomePermutation);

    /// <summary>The seed all of one tree's permutation-importance shuffles derive from; a function of the forest and the tree only.</summary>
    public static ulong PermutationImportanceTree(ForestStreams forest, int tree) =>
        SeedSchedule.Derive(forest.Seed, forest.Repeat, tree, SeedPurpose.Permutation);

    /// <summary>The generator permuting one feature in one tree.</summary>
    public static Xoshiro256StarStar FeaturePermutation(ulong treeSeed, int feature) =>
        SeedSchedule.Generator(treeSeed, 0, feature, SeedPurpose.Permutation);

    /// <summary>The generator permuting one redundancy group in one tree; repeat coordinate 1 keeps it apart from the feature streams.</summary>
    public static Xoshiro256StarStar GroupPermutation(ulong treeSeed, int group) =>
        SeedSchedule.Generator(treeSeed, 1, group, SeedPurpose.Permutation);

    /// <summary>
    /// The generator permuting one feature within the strata of covariate <paramref name="covariate"/>
    /// in one tree; repeat coordinates 2 and up keep it apart from the feature (0) and group (1) streams.
    /// </summary>
    public static Xoshiro256StarStar StratifiedPermutation(ulong treeSeed, int covariate, int feature)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(covariate);
        return SeedSchedule.Generator(treeSeed, 2 + covariate, feature, SeedPurpose.Permutation);
    }

    private static int InFamily(int member)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(member);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(member, SlotFamilyWidth);
        return member;
    }
}
