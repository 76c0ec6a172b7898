namespace OmicsScreen.Screening.Univariate;

/// <summary>Why a log2 ratio of medians could not be formed.</summary>
public enum RatioUnavailableReason
{
    /// <summary>The ratio is available.</summary>
    None = 0,
    /// <summary>A group has no measured or below-detection value.</summary>
    NoValues = 1,
    /// <summary>A median falls among below-detection cells, so only an upper bound is known.</summary>
    MedianBelowDetection = 2,
    /// <summary>A median is zero or negative (for example already log-scaled or centred data), so the ratio has no log.</summary>
    NonPositiveMedian = 3,
}
