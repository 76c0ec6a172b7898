namespace OmicsScreen.Screening.Univariate;

/// <summary>Which group of a contrast tends to have the higher values, judged by the AUC.</summary>
public enum EffectDirection
{
    /// <summary>No AUC: one side of the contrast has no usable value.</summary>
    Undetermined = 0,
    /// <summary>AUC above 0.5: the contrast class tends to be higher than the rest.</summary>
    Higher = 1,
    /// <summary>AUC below 0.5: the contrast class tends to be lower than the rest.</summary>
    Lower = 2,
    /// <summary>AUC exactly 0.5.</summary>
    NoDifference = 3,
}
