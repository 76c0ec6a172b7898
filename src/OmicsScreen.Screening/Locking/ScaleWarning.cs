namespace OmicsScreen.Screening.Locking;

/// <summary>A marker whose new values do not look like its discovery values, or that was not measured at all.</summary>
/// <param name="Marker">The marker's name.</param>
/// <param name="Message">One sentence for the user, with the medians and quartiles that triggered it.</param>
public sealed record ScaleWarning(string Marker, string Message)
{
    /// <summary>The marker was measured in no sample of the new cohort (every cell missing or below detection).</summary>
    public bool Unmeasured { get; init; }
}
