using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Screen;

/// <summary>The reference forest of a screen, its summary, and the one thing asked of the grown forest later (group importance).</summary>
internal sealed record ReferenceForest(ReferenceForestSummary Summary, Func<BinnedMatrix, List<int[]>, int, double[]>? GroupImportance)
{
    /// <summary>The grown trees read as leaf values (class share, mean, or mortality): what partial dependence reads.</summary>
    public IReadOnlyList<Effects.TreeLeafValues> LeafValues { get; init; } = [];
}
