using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>How stable the selection was over repeats, and what that bounds.</summary>
/// <remarks>
/// The bound is only worth printing when repeats select few features: with q about a tenth of p it
/// exceeds the list itself (<see cref="BoundIsInformative"/>).
/// </remarks>
/// <param name="Stability">Nogueira, Sechidis &amp; Brown (2018) estimator with its 95% interval.</param>
/// <param name="MeanSelectedPerRepeat">Mean number of real features each repeat selected (q).</param>
/// <param name="ExpectedFalseSelectionsBound">Meinshausen &amp; Buhlmann (2010) bound q^2 / ((2 pi - 1) p) at the threshold used; NaN without a frequency filter (the bound needs a threshold above 0.5).</param>
public sealed record StabilitySummary(
    StabilityEstimate Stability,
    double MeanSelectedPerRepeat,
    double FrequencyThreshold,
    double ExpectedFalseSelectionsBound)
{
    /// <summary>Nogueira stability of each repeat's top features at the shortlist's length: how much a list of that length moves between halves of the samples.</summary>
    public StabilityEstimate ListStability { get; init; }

    /// <summary>True when the bound is under one false marker or under half of the list; otherwise it says nothing about the list.</summary>
    public bool BoundIsInformative(int shortlistLength) =>
        !double.IsNaN(ExpectedFalseSelectionsBound) && (ExpectedFalseSelectionsBound < 1 || ExpectedFalseSelectionsBound < 0.5 * shortlistLength);
}
