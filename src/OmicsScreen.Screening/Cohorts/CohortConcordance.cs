namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Agreement of two cohorts' own screens: Spearman correlation of mean corrected importance over
/// all features, overlap of their top-k lists, and rank-biased overlap of their orders (Webber,
/// Moffat &amp; Zobel 2010, extrapolated, persistence 0.9, over the top 100).
/// </summary>
public sealed record CohortConcordance(string First, string Second, double Spearman, double Top10Overlap, double Top20Overlap,
    double Top50Overlap, double RankBiasedOverlap);
