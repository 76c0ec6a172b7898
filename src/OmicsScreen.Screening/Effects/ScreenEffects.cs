namespace OmicsScreen.Screening.Effects;

/// <summary>
/// The effects part of a screen (issue 19, parts 4-5): every shortlisted marker's partial
/// dependence in the reference forest with its shape and partners, the partner scan, and the
/// two-marker surfaces of the strongest named pairs.
/// </summary>
/// <param name="Markers">One per shortlisted marker, in shortlist order.</param>
/// <param name="SmallestEffect">The smallest curve range read as a shape: twice the largest range of the unrelated features' curves in the same forest.</param>
/// <param name="UnrelatedFeatures">The features that set <paramref name="SmallestEffect"/> (spread over the lower half of the screen's order).</param>
/// <param name="Surfaces">Two-marker partial dependence of the strongest named pairs, at most <see cref="EffectAnalysis.MaxSurfaces"/>.</param>
public sealed record ScreenEffects(
    IReadOnlyList<MarkerEffect> Markers,
    double SmallestEffect,
    IReadOnlyList<int> UnrelatedFeatures,
    InteractionPartnerScan Partners,
    IReadOnlyList<EffectSurface> Surfaces)
{
    public static ScreenEffects Empty { get; } = new([], double.NaN, [], InteractionPartnerScan.Empty, []);

    /// <summary>The marker's effect, or null when it is not on the shortlist.</summary>
    public MarkerEffect? Of(int feature)
    {
        foreach (var marker in Markers) if (marker.Feature == feature) return marker;
        return null;
    }
}
