namespace OmicsScreen.Screening.Effects;

/// <summary>How one shortlisted marker acts in the forest: its partial-dependence curve, the curve's shape in words, and its named interaction partners.</summary>
/// <param name="Feature">The marker's feature index.</param>
/// <param name="Partners">Feature indices of its named partners, strongest first; empty when none beat the copies' null or it was not scanned.</param>
public sealed record MarkerEffect(int Feature, EffectCurve Curve, EffectShape Shape, IReadOnlyList<int> Partners);
