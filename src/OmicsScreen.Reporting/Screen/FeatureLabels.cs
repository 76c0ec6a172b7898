namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The lab-facing name and annotations of each feature, indexed like the screened panel's
/// features, for the tables and the report. Texts come from input files and are untrusted: the
/// table writer neutralises formulas and the HTML builder escapes them.
/// </summary>
public sealed class FeatureLabels
{
    public static readonly FeatureLabels None = new(null, []);

    /// <param name="displayNames">One per feature ("" for none), or null when the inputs gave none.</param>
    /// <param name="annotations">Annotation columns, each one text per feature.</param>
    public FeatureLabels(IReadOnlyList<string>? displayNames, IReadOnlyList<KeyValuePair<string, IReadOnlyList<string>>> annotations)
    {
        DisplayNames = displayNames;
        Annotations = annotations;
    }

    public IReadOnlyList<string>? DisplayNames { get; }
    public IReadOnlyList<KeyValuePair<string, IReadOnlyList<string>>> Annotations { get; }
    public bool HasDisplayNames => DisplayNames is not null;

    /// <summary>The feature's display name, or "" when it has none.</summary>
    public string DisplayName(int featureIndex) => DisplayNames?[featureIndex] ?? "";

    /// <summary>The lab-facing name first with the id beside it ("IL-6 (P05231_1)"), or the id alone when there is no display name or it equals the id.</summary>
    public string Label(int featureIndex, string id)
    {
        string display = DisplayName(featureIndex);
        return display.Length == 0 || display == id ? id : display + " (" + id + ")";
    }
}
