using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// A locked-panel file as read, whatever its outcome kind: exactly one of <see cref="Classes"/>,
/// <see cref="Measured"/> and <see cref="FollowUp"/> is set, with the optional keys every kind
/// may carry (hashed discovery sample ids, the markers' display names).
/// </summary>
public sealed record LoadedLockedPanel
{
    public required OutcomeKind Kind { get; init; }
    public LockedPanel? Classes { get; init; }
    public LockedMeasuredPanel? Measured { get; init; }
    public LockedFollowUpPanel? FollowUp { get; init; }

    /// <summary>The SHA-256 of each discovery sample id, when the screen recorded them.</summary>
    public HashSet<string>? DiscoverySampleIdHashes { get; init; }

    /// <summary>The markers' display names (id to name; empty when none were recorded).</summary>
    public required IReadOnlyDictionary<string, string> DisplayNames { get; init; }

    public IReadOnlyList<string> MarkerNames => Classes?.MarkerNames ?? Measured?.MarkerNames ?? FollowUp!.MarkerNames;

    public LockProvenance Provenance => Classes?.Provenance ?? Measured?.Provenance ?? FollowUp!.Provenance;

    public int TreeCount => Classes?.Trees.Count ?? Measured?.Trees.Count ?? FollowUp!.Trees.Count;
}
