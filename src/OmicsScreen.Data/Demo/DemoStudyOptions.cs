namespace OmicsScreen.Data.Demo;

/// <summary>
/// Settings of the invented demo study. The defaults make a panel that screens in seconds yet
/// has every difficulty a real discovery panel has.
/// </summary>
public sealed record DemoStudyOptions
{
    public ulong Seed { get; init; } = 20261202;
    public int FeatureCount { get; init; } = 2000;

    /// <summary>Cases and controls per recruitment centre; the last centre carries the batch shift.</summary>
    public IReadOnlyList<(string Centre, int Cases, int Controls)> Centres { get; init; } =
        [("north", 38, 112), ("south", 30, 90), ("east", 45, 45)];

    public int ModuleCount { get; init; } = 30;
    public double CellMissingRate { get; init; } = 0.015;

    public void Validate()
    {
        if (FeatureCount < 100) throw new ArgumentException("The demo needs at least 100 features.");
        if (Centres.Count < 2) throw new ArgumentException("The demo needs at least two centres.");
        foreach (var (_, cases, controls) in Centres)
            if (cases < 2 || controls < 2) throw new ArgumentException("Each centre needs at least two cases and two controls.");
    }
}
