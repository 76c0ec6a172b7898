namespace OmicsScreen.Screening.Locking;

/// <summary>A cohort lacks markers of a locked panel; the message names every one, so one fix covers all.</summary>
public sealed class MissingMarkersException : Exception
{
    public MissingMarkersException(IReadOnlyList<string> missingMarkers, int markerCount)
        : base(Describe(missingMarkers, markerCount))
    {
        MissingMarkers = missingMarkers;
    }

    public IReadOnlyList<string> MissingMarkers { get; }

    private static string Describe(IReadOnlyList<string> missing, int markerCount) =>
        $"{missing.Count} of the {markerCount} markers of the locked panel are not in the new panel: "
        + string.Join(", ", missing)
        + ". Markers are matched by exact name; rename the columns to the discovery names or measure the missing markers.";
}
