namespace OmicsScreen.Benchmarks;

/// <summary>One part of a process's resident memory in a memory estimate.</summary>
public sealed record MemoryItem(string Part, double Bytes);
