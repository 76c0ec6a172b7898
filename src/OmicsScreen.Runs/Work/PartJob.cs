using OmicsScreen.Data;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// `screen --part I/N`: computes one part's work units into a part folder for a later merge
/// (format in PARTS.md). <see cref="Open"/> makes every check and opens the folder, so a refusal
/// comes before the caller prints any warning; <see cref="Run"/> then does the work.
/// </summary>
public sealed class PartJob
{
    private readonly LoadedPanel _loaded;
    private readonly ScreenOptions _screen;

    private PartJob(LoadedPanel loaded, ScreenOptions screen, RunPart part, WorkFolder folder, IReadOnlyList<WorkUnit> units, int unitCount)
    {
        _loaded = loaded;
        _screen = screen;
        Part = part;
        Folder = folder;
        Units = units;
        UnitCount = unitCount;
    }

    public RunPart Part { get; }

    /// <summary>The part folder: its record, the units kept from an earlier attempt and those discarded.</summary>
    public WorkFolder Folder { get; }

    /// <summary>This part's units, dealt by cost (<see cref="WorkPlan.UnitsOfPart"/>).</summary>
    public IReadOnlyList<WorkUnit> Units { get; }

    /// <summary>Work units of the whole run.</summary>
    public int UnitCount { get; }

    /// <summary>Chooses the part's units and opens its folder; refuses a split into more parts than the run has units.</summary>
    public static PartJob Open(LoadedPanel loaded, PartRequest request)
    {
        ArgumentNullException.ThrowIfNull(loaded);
        ArgumentNullException.ThrowIfNull(request);
        var panel = loaded.Panel;
        var settings = ScreenSettings.Resolve(request.Screen, panel);
        var plan = WorkPlan.For(panel, settings);
        var part = request.Part;
        if (part.Count > plan.Units.Count)
            throw new RunRefusedException(
                $"This screen has {plan.Units.Count} work units, so it can be split into at most {plan.Units.Count} parts, not {part.Count}.");
        var units = plan.UnitsOfPart(part.Index, part.Count);
        var (identity, described) = RunIdentity.Of("part", loaded, request.Panel, request.Screen, request.ShowSampleIds, request.CommandLine);
        var record = described with { Part = part.Index, Parts = part.Count };
        var folder = WorkFolder.Open(request.Folder, ScreenResultFiles.PartRecord, record, identity, panel.FeatureCount, settings.DecoyCount,
            request.Resume, request.Force, "part", request.Folder);
        return new PartJob(loaded, request.Screen, part, folder, units, plan.Units.Count);
    }

    /// <summary>Computes the units not already in the folder, then marks the part complete for the merge.</summary>
    public void Run(IProgress<ScreenProgress>? progress, CancellationToken cancellation = default)
    {
        ScreenRunner.RunUnits(_loaded.Panel, _screen, Units, Folder, progress, cancellation);
        Folder.MarkComplete(Units);
    }
}
