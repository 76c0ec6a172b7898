namespace OmicsScreen.Screening.Locking;

/// <summary>A marker whose new values do not look like its discovery values.</summary>
/// <param name="Marker">The marker's name.</param>
/// <param name="Message">One sentence for the user, with the medians and quartiles that triggered it.</param>
public sealed record ScaleWarning(string Marker, string Message);
