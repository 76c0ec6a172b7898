using System.Text.Json.Nodes;
using OmicsScreen.Data;
using OmicsScreen.Reporting.Screen;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// Carries the features' lab-facing names from the loaded inputs into the outputs: the tables and
/// report (<see cref="FeatureLabels"/>) and the locked panel, which records each marker's display
/// name beside its id so that `apply` can show it. Markers are always matched by id.
/// </summary>
public static class MarkerLabels
{
    /// <summary>Key of the markers' display names (id to name) in the locked panel's content.</summary>
    public const string DisplayNamesKey = "marker_display_names";

    public static FeatureLabels Of(LoadedPanel loaded)
    {
        var features = loaded.Features;
        if (features.IsEmpty) return FeatureLabels.None;
        return new FeatureLabels(features.DisplayNames,
            features.Annotations.Select(a => new KeyValuePair<string, IReadOnlyList<string>>(a.Name, a.Values)).ToArray());
    }

    /// <summary>The display names of the given markers, keyed by id; markers without one are left out.</summary>
    public static JsonObject? DisplayNames(LoadedPanel loaded, IEnumerable<string> markers)
    {
        if (loaded.Features.DisplayNames is null) return null;
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        var ids = loaded.Features.FeatureIds;
        for (int f = 0; f < ids.Count; f++) index[ids[f]] = f;
        var names = new JsonObject();
        foreach (var marker in markers)
            if (index.TryGetValue(marker, out int f) && loaded.Features.DisplayName(f) is { Length: > 0 } name) names[marker] = name;
        return names.Count == 0 ? null : names;
    }

    public static Dictionary<string, string> ReadDisplayNames(JsonObject content)
    {
        var names = new Dictionary<string, string>(StringComparer.Ordinal);
        if (content[DisplayNamesKey] is JsonObject stored)
            foreach (var (id, node) in stored)
                if (node is JsonValue value && value.TryGetValue(out string? name)) names[id] = name;
        return names;
    }

    /// <summary>"display name (id)", or the id alone.</summary>
    public static string Label(string id, IReadOnlyDictionary<string, string> displayNames) =>
        displayNames.TryGetValue(id, out var name) && name.Length > 0 && name != id ? name + " (" + id + ")" : id;
}
