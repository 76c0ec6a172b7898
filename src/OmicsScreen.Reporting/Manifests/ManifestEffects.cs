using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>
/// How the shortlisted markers act (issue 19, parts 4-5): each marker's effect shape in words and
/// its named forest partners, and the partner scan's bar. The curves themselves are in effect_shapes.tsv.
/// </summary>
public sealed record ManifestEffects
{
    /// <summary>The smallest range of a partial-dependence curve read as a shape (twice the unrelated features' largest); null without a shortlist.</summary>
    public double? SmallestEffect { get; init; }

    /// <summary>Stratum-permuted copies of each scanned marker in the partner scan's forest.</summary>
    public required int PartnerCopiesPerMarker { get; init; }

    /// <summary>The score a pair had to pass: the largest adjacent-split score of a marker with another marker's copy; null when fewer than two markers were scanned.</summary>
    public double? PartnerBar { get; init; }

    public required IReadOnlyList<ManifestMarkerEffect> Markers { get; init; }

    public static ManifestEffects Of(ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var effects = result.Effects;
        return new ManifestEffects
        {
            SmallestEffect = double.IsFinite(effects.SmallestEffect) ? effects.SmallestEffect : null,
            PartnerCopiesPerMarker = effects.Partners.CopiesPerMarker,
            PartnerBar = double.IsFinite(effects.Partners.NullLargest) ? effects.Partners.NullLargest : null,
            Markers = effects.Markers.Select(m => ManifestMarkerEffect.Of(m, result)).ToArray(),
        };
    }
}
