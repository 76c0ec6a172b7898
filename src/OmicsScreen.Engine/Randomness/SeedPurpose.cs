namespace OmicsScreen.Engine.Randomness;

/// <summary>
/// What a random stream is used for. Each purpose gets its own generator so that changing how
/// one step consumes random numbers (say, the feature draw) never shifts another (the bootstrap).
/// </summary>
public enum SeedPurpose : ulong
{
    /// <summary>Which samples a tree is grown on (bootstrap counts, subsample, groups).</summary>
    Sampling = 1,
    /// <summary>Which features are tried at each node and how impure leaves break ties.</summary>
    Splitting = 2,
    /// <summary>Random class priorities that break tied votes of one sample.</summary>
    VoteTieBreak = 3,
    /// <summary>Permutations of one feature's codes (permutation importance).</summary>
    Permutation = 4,
    /// <summary>Permutations that build permuted copies of features.</summary>
    PermutedCopy = 5,
    /// <summary>Drawing resamples or folds in the screening layer.</summary>
    Resampling = 6,
    /// <summary>Permutations of the outcome labels that build an outcome-permutation null of importance.</summary>
    OutcomePermutation = 7,
}
