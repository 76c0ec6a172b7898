namespace OmicsScreen.Data.Inspection;

/// <summary>A class or cohort and how many samples it has.</summary>
public sealed record LevelCount(string Name, int SampleCount);
