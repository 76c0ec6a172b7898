using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>One shortlisted marker's effect shape and forest partners.</summary>
public sealed record ManifestMarkerEffect
{
    public required string Feature { get; init; }

    /// <summary>The shape in words (rises, falls, rises above about X, U-shaped, inverted U, irregular, none on its own).</summary>
    public required string Shape { get; init; }

    /// <summary>The marker value of a one-step curve's step; null for other shapes.</summary>
    public double? Step { get; init; }

    /// <summary>Largest minus smallest partial dependence over the marker's range, in the prediction's units.</summary>
    public required double Range { get; init; }

    /// <summary>Named forest partners, strongest first.</summary>
    public required IReadOnlyList<string> Partners { get; init; }

    public static ManifestMarkerEffect Of(MarkerEffect effect, ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(effect);
        ArgumentNullException.ThrowIfNull(result);
        return new ManifestMarkerEffect
        {
            Feature = result.Features[effect.Feature].Feature,
            Shape = effect.Shape.Description,
            Step = double.IsFinite(effect.Shape.Step) ? effect.Shape.Step : null,
            Range = effect.Shape.Range,
            Partners = effect.Partners.Select(p => result.Features[p].Feature).ToArray(),
        };
    }
}
