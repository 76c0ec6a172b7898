namespace OmicsScreen.Screening.Effects;

/// <summary>Two shortlisted markers, how much more often they split directly one below the other than their own split counts predict, and whether that beat the copies' null.</summary>
/// <param name="First">Feature index of the first marker (the one higher on the shortlist).</param>
/// <param name="Second">Feature index of the second marker.</param>
/// <param name="Score">Adjacent-split score, (observed - expected) / sqrt(expected) (<see cref="AdjacentSplits.Score"/>).</param>
/// <param name="Named">True when the score is positive and above every marker-with-copy score of the scan (<see cref="InteractionPartners"/>).</param>
public sealed record InteractionPair(int First, int Second, double Score, bool Named);
