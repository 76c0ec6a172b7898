namespace OmicsScreen.Screening.Univariate;

/// <summary>Rank statistics of one class against the rest for one feature, before formatting into a row.</summary>
internal readonly record struct ContrastSummary(
    int ClassCount,
    int RestCount,
    double ClassRankSum,
    double DeLongVariance,
    double ClassMedian,
    bool ClassMedianBelowDetection,
    double RestMedian,
    bool RestMedianBelowDetection);
