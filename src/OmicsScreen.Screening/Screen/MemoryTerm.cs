namespace OmicsScreen.Screening.Screen;

/// <summary>One itemised share of a memory estimate.</summary>
/// <param name="Component">What the bytes hold.</param>
/// <param name="Bytes">Estimated bytes at the run's peak.</param>
public sealed record MemoryTerm(MemoryComponent Component, long Bytes);
