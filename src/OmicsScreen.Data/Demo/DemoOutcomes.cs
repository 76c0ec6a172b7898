namespace OmicsScreen.Data.Demo;

/// <summary>The demo's measured and time-to-event outcomes, one value per sample, as the sample sheet writes them.</summary>
/// <param name="ActivityScore">The invented disease-activity score, one decimal.</param>
/// <param name="MonthsFollowed">Months from sampling to a flare or to the end of follow-up, one decimal.</param>
/// <param name="Flare">Whether a flare ended the follow-up (false: censored).</param>
public sealed record DemoOutcomes(double[] ActivityScore, double[] MonthsFollowed, bool[] Flare);
