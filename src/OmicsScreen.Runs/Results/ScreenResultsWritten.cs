namespace OmicsScreen.Runs.Results;

/// <summary>Where a finished screen's results went, for the front end to name.</summary>
/// <param name="Folder">The results folder's full path.</param>
/// <param name="Report">The HTML report's full path.</param>
/// <param name="LockedPanel">The locked panel's full path; null when the shortlist was empty and nothing was locked.</param>
public sealed record ScreenResultsWritten(string Folder, string Report, string? LockedPanel);
