namespace OmicsScreen.Screening.Randomness;

/// <summary>
/// The (seed, repeat) coordinates a forest's random streams derive from: tree t draws its
/// samples from Derive(Seed, Repeat, t, Sampling), its features from (.., Splitting), and so on.
/// Obtained only from <see cref="RandomStreams"/>, so every forest's coordinates have one name.
/// </summary>
public readonly record struct ForestStreams(ulong Seed, int Repeat);
