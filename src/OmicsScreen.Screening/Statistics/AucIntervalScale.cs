namespace OmicsScreen.Screening.Statistics;

/// <summary>The scale on which a normal-approximation AUC interval is symmetric.</summary>
public enum AucIntervalScale
{
    /// <summary>AUC +/- z SE, clipped to [0, 1]. The default: it is the usual DeLong interval.</summary>
    Probability = 0,
    /// <summary>
    /// logit(AUC) +/- z SE / (AUC (1 - AUC)), mapped back (delta method); stays inside (0, 1) and is
    /// asymmetric near the bounds, which covers better for AUCs close to 1 (Pepe 2003, sec. 5.2).
    /// </summary>
    Logit = 1,
}
