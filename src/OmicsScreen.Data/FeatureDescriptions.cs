namespace OmicsScreen.Data;

/// <summary>
/// What the inputs say about each feature beyond its measurements: the lab-facing display name
/// and annotation columns, in panel feature order. Features are always matched by id; the
/// display name is for people. All texts are untrusted data, like feature names.
/// </summary>
public sealed class FeatureDescriptions
{
    public FeatureDescriptions(IReadOnlyList<string> featureIds, IReadOnlyList<string>? displayNames,
        IReadOnlyList<FeatureAnnotation> annotations)
    {
        ArgumentNullException.ThrowIfNull(featureIds);
        ArgumentNullException.ThrowIfNull(annotations);
        if (displayNames is not null && displayNames.Count != featureIds.Count)
            throw new ArgumentException("One display name is needed per feature.", nameof(displayNames));
        foreach (var annotation in annotations)
            if (annotation.Values.Count != featureIds.Count)
                throw new ArgumentException($"Annotation '{annotation.Name}' needs one value per feature.", nameof(annotations));
        FeatureIds = featureIds;
        DisplayNames = displayNames;
        Annotations = annotations;
    }

    public static FeatureDescriptions None(IReadOnlyList<string> featureIds) => new(featureIds, null, []);

    public IReadOnlyList<string> FeatureIds { get; }

    /// <summary>One per feature ("" when a feature has none), or null when the inputs give no display names.</summary>
    public IReadOnlyList<string>? DisplayNames { get; }

    public IReadOnlyList<FeatureAnnotation> Annotations { get; }

    /// <summary>True when there is nothing beyond the ids to carry into the outputs.</summary>
    public bool IsEmpty => DisplayNames is null && Annotations.Count == 0;

    /// <summary>The lab-facing name of a feature, or "" when it has none.</summary>
    public string DisplayName(int feature) => DisplayNames?[feature] ?? "";
}
