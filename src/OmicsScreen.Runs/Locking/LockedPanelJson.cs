using System.Globalization;
using System.Text.Json.Nodes;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// The content of a locked-panel file as JSON (layout in FORMAT.md beside this file).
/// Every float is written as its shortest round-trip text and read back exactly, so a reloaded
/// panel gives bit-identical probabilities from raw values. Tree bin codes are not kept (see
/// FORMAT.md): a reloaded tree answers raw-value queries only.
/// </summary>
public static class LockedPanelJson
{
    public static JsonObject ToJson(LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var discovery = new JsonArray();
        for (int m = 0; m < panel.MarkerCount; m++)
        {
            var scale = panel.Markers[m];
            discovery.Add(new JsonObject
            {
                ["marker"] = panel.MarkerNames[m],
                ["median"] = Number(scale.Median),
                ["lower_quartile"] = Number(scale.LowerQuartile),
                ["upper_quartile"] = Number(scale.UpperQuartile),
                ["minimum"] = Number(scale.Minimum),
                ["maximum"] = Number(scale.Maximum),
                ["missing_share"] = Number(scale.MissingShare),
                ["below_detection_share"] = Number(scale.BelowDetectionShare),
                ["measured_count"] = scale.MeasuredCount,
            });
        }
        var inputs = new JsonObject();
        foreach (var (name, hash) in panel.Provenance.InputSha256.OrderBy(p => p.Key, StringComparer.Ordinal)) inputs[name] = hash;
        var forest = new JsonArray();
        foreach (var tree in panel.Trees) forest.Add(TreeToJson(tree));
        return new JsonObject
        {
            ["markers"] = Strings(panel.MarkerNames),
            ["classes"] = Strings(panel.ClassNames),
            ["positive_class"] = panel.ClassNames[panel.PositiveClass],
            ["threshold"] = panel.Threshold is { } threshold ? JsonValue.Create(threshold) : null,
            ["out_of_bag_auc"] = panel.OutOfBagAuc is { } auc ? Number(auc) : null,
            ["provenance"] = new JsonObject
            {
                ["tool_version"] = panel.Provenance.ToolVersion,
                // A string: 64-bit seeds do not survive readers that hold every number as a double.
                ["seed"] = panel.Provenance.Seed.ToString(CultureInfo.InvariantCulture),
                ["panel_size"] = panel.Provenance.PanelSize,
                ["trees"] = panel.Provenance.TreeCount,
                ["discovery_samples"] = panel.Provenance.DiscoverySampleCount,
                ["inputs_sha256"] = inputs,
            },
            ["discovery"] = discovery,
            ["forest"] = forest,
        };
    }

    /// <exception cref="InvalidDataException">A field is missing, of the wrong kind, or the trees do not fit the markers.</exception>
    public static LockedPanel FromJson(JsonObject content)
    {
        ArgumentNullException.ThrowIfNull(content);
        var markers = ReadStrings(content, "markers");
        var classes = ReadStrings(content, "classes");
        string positiveName = ReadString(content, "positive_class");
        int positive = classes.IndexOf(positiveName);
        if (positive < 0) throw new InvalidDataException($"positive_class '{positiveName}' is not one of the classes.");
        double? threshold = content["threshold"] is null ? null : ReadDouble(content["threshold"], "threshold");
        double? auc = content["out_of_bag_auc"] is null ? null : ReadDouble(content["out_of_bag_auc"], "out_of_bag_auc");

        var provenanceNode = ReadObject(content, "provenance");
        string seedText = ReadString(provenanceNode, "seed");
        if (!ulong.TryParse(seedText, NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed))
            throw new InvalidDataException($"provenance.seed '{seedText}' is not a whole number.");
        var inputs = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (name, hash) in ReadObject(provenanceNode, "inputs_sha256"))
            inputs[name] = hash is JsonValue v && v.TryGetValue(out string? text) ? text : throw new InvalidDataException($"provenance.inputs_sha256.{name} is not text.");
        var provenance = new LockProvenance(ReadString(provenanceNode, "tool_version"), seed, ReadInt(provenanceNode, "panel_size"),
            ReadInt(provenanceNode, "trees"), ReadInt(provenanceNode, "discovery_samples"), inputs);

        var discovery = ReadArray(content, "discovery");
        if (discovery.Count != markers.Count) throw new InvalidDataException("discovery must hold one entry per marker.");
        var scales = new MarkerScale[markers.Count];
        for (int m = 0; m < scales.Length; m++)
        {
            if (discovery[m] is not JsonObject entry) throw new InvalidDataException($"discovery[{m}] is not an object.");
            if (ReadString(entry, "marker") != markers[m]) throw new InvalidDataException($"discovery[{m}] does not describe marker '{markers[m]}'.");
            scales[m] = new MarkerScale(ReadNumber(entry, "median"), ReadNumber(entry, "lower_quartile"), ReadNumber(entry, "upper_quartile"),
                ReadNumber(entry, "minimum"), ReadNumber(entry, "maximum"), ReadNumber(entry, "missing_share"),
                ReadNumber(entry, "below_detection_share"), ReadInt(entry, "measured_count"));
        }

        var forest = ReadArray(content, "forest");
        var trees = new DecisionTree[forest.Count];
        for (int t = 0; t < trees.Length; t++)
        {
            if (forest[t] is not JsonObject treeNode) throw new InvalidDataException($"forest[{t}] is not an object.");
            try
            {
                trees[t] = TreeFromJson(treeNode, classes.Count);
            }
            catch (ArgumentException e)
            {
                throw new InvalidDataException($"forest[{t}]: {e.Message}", e);
            }
        }
        var panel = new LockedPanel(markers, trees, classes, positive, scales, threshold, auc, provenance);
        try
        {
            panel.Validate();
        }
        catch (ArgumentException e)
        {
            throw new InvalidDataException(e.Message, e);
        }
        return panel;
    }

    /// <summary>One tree through its JSON form and back; what the file format does to every tree.</summary>
    internal static DecisionTree TreeJsonRoundTrip(DecisionTree tree) =>
        TreeFromJson(JsonNode.Parse(TreeToJson(tree).ToJsonString())!.AsObject(), tree.ClassCount);

    private const string PositiveInfinityText = "Infinity";
    private const string NegativeInfinityText = "-Infinity";

    private static JsonObject TreeToJson(DecisionTree tree)
    {
        int nodeCount = tree.NodeCount;
        var thresholds = new JsonArray();
        var routing = new JsonArray();
        for (int node = 0; node < nodeCount; node++)
        {
            float threshold = tree.Thresholds[node];
            // Leaves carry no threshold (NaN in memory), which JSON cannot spell; a split that
            // sends every measured value left and only unmeasured cells right has an infinite
            // threshold, written as the text "Infinity" or "-Infinity".
            thresholds.Add(float.IsNaN(threshold) ? null
                : float.IsPositiveInfinity(threshold) ? JsonValue.Create(PositiveInfinityText)
                : float.IsNegativeInfinity(threshold) ? JsonValue.Create(NegativeInfinityText)
                : JsonValue.Create(threshold));
            routing.Add((int)tree.Routing[node]);
        }
        return new JsonObject
        {
            ["features"] = Ints(tree.Features),
            ["thresholds"] = thresholds,
            ["unmeasured_routing"] = routing,
            ["left"] = Ints(tree.LeftChildren),
            ["right"] = Ints(tree.RightChildren),
            ["node_classes"] = Ints(tree.NodeClasses),
            ["class_weights"] = Doubles(tree.ClassWeights),
            ["impurity_decreases"] = Doubles(tree.ImpurityDecreases),
            ["sample_counts"] = Ints(tree.NodeSampleCounts),
        };
    }

    private static DecisionTree TreeFromJson(JsonObject node, int classCount)
    {
        var features = ReadInts(node, "features");
        var thresholdNodes = ReadArray(node, "thresholds");
        var thresholds = new float[thresholdNodes.Count];
        for (int i = 0; i < thresholds.Length; i++)
            thresholds[i] = thresholdNodes[i] is null ? float.NaN
                : thresholdNodes[i] is JsonValue v && v.TryGetValue(out float value) ? value
                : thresholdNodes[i] is JsonValue t && t.TryGetValue(out string? text) && text == PositiveInfinityText ? float.PositiveInfinity
                : thresholdNodes[i] is JsonValue u && u.TryGetValue(out string? other) && other == NegativeInfinityText ? float.NegativeInfinity
                : throw new InvalidDataException($"thresholds[{i}] is not a number.");
        var routingCodes = ReadInts(node, "unmeasured_routing");
        var routing = new UnmeasuredRouting[routingCodes.Length];
        for (int i = 0; i < routing.Length; i++)
        {
            if ((uint)routingCodes[i] > (uint)(UnmeasuredRouting.MissingLeft | UnmeasuredRouting.BelowDetectionLeft))
                throw new InvalidDataException($"unmeasured_routing[{i}] = {routingCodes[i]} is not a routing.");
            routing[i] = (UnmeasuredRouting)routingCodes[i];
        }
        // Bin codes are not stored: they mean something only with the discovery bin mapper, which
        // the file does not hold. A reloaded tree is for raw values, which is all scoring needs.
        int nodeCount = features.Length;
        return new DecisionTree(classCount, features, new byte[nodeCount], thresholds, new byte[nodeCount],
            routing, ReadInts(node, "left"), ReadInts(node, "right"), ReadDoubles(node, "class_weights"), ReadInts(node, "node_classes"),
            ReadDoubles(node, "impurity_decreases"), ReadInts(node, "sample_counts"));
    }

    private static JsonNode? Number(double value) => double.IsFinite(value) ? JsonValue.Create(value) : null;

    private static JsonArray Strings(IReadOnlyList<string> values)
    {
        var array = new JsonArray();
        foreach (var value in values) array.Add(value);
        return array;
    }

    private static JsonArray Ints(ReadOnlySpan<int> values)
    {
        var array = new JsonArray();
        foreach (int value in values) array.Add(value);
        return array;
    }

    private static JsonArray Doubles(ReadOnlySpan<double> values)
    {
        var array = new JsonArray();
        foreach (double value in values) array.Add(Number(value));
        return array;
    }

    private static JsonObject ReadObject(JsonObject parent, string name) =>
        parent[name] as JsonObject ?? throw new InvalidDataException($"{name} is missing or not an object.");

    private static JsonArray ReadArray(JsonObject parent, string name) =>
        parent[name] as JsonArray ?? throw new InvalidDataException($"{name} is missing or not an array.");

    private static string ReadString(JsonObject parent, string name) =>
        parent[name] is JsonValue v && v.TryGetValue(out string? text) && text is not null ? text
            : throw new InvalidDataException($"{name} is missing or not text.");

    private static int ReadInt(JsonObject parent, string name) =>
        parent[name] is JsonValue v && v.TryGetValue(out int value) ? value
            : throw new InvalidDataException($"{name} is missing or not a whole number.");

    /// <summary>A number, or NaN where the writer had a value that is not finite (written as null).</summary>
    private static double ReadNumber(JsonObject parent, string name) =>
        parent[name] is null ? double.NaN : ReadDouble(parent[name], name);

    private static double ReadDouble(JsonNode? node, string name) =>
        node is JsonValue v && v.TryGetValue(out double value) ? value
            : throw new InvalidDataException($"{name} is not a number.");

    private static List<string> ReadStrings(JsonObject parent, string name)
    {
        var array = ReadArray(parent, name);
        var values = new List<string>(array.Count);
        for (int i = 0; i < array.Count; i++)
            values.Add(array[i] is JsonValue v && v.TryGetValue(out string? text) && text is not null ? text
                : throw new InvalidDataException($"{name}[{i}] is not text."));
        return values;
    }

    private static int[] ReadInts(JsonObject parent, string name)
    {
        var array = ReadArray(parent, name);
        var values = new int[array.Count];
        for (int i = 0; i < values.Length; i++)
            values[i] = array[i] is JsonValue v && v.TryGetValue(out int value) ? value
                : throw new InvalidDataException($"{name}[{i}] is not a whole number.");
        return values;
    }

    private static double[] ReadDoubles(JsonObject parent, string name)
    {
        var array = ReadArray(parent, name);
        var values = new double[array.Count];
        for (int i = 0; i < values.Length; i++)
            values[i] = array[i] is null ? double.NaN : ReadDouble(array[i], $"{name}[{i}]");
        return values;
    }
}
