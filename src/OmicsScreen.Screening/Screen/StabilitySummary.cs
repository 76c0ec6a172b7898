using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>How stable the selection was over repeats, and what that bounds.</summary>
/// <param name="Stability">Nogueira, Sechidis &amp; Brown (2018) estimator with its 95% interval.</param>
/// <param name="MeanSelectedPerRepeat">Mean number of real features each repeat selected (q).</param>
/// <param name="ExpectedFalseSelectionsBound">Meinshausen &amp; Buhlmann (2010) bound q^2 / ((2 pi - 1) p) at the threshold used.</param>
public sealed record StabilitySummary(
    StabilityEstimate Stability,
    double MeanSelectedPerRepeat,
    double FrequencyThreshold,
    double ExpectedFalseSelectionsBound);
