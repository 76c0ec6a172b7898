using System.Globalization;
using System.Text.Json.Nodes;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
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
    /// <summary>Key of the outcome kind in the content; absent for classes, so class files read and write as before.</summary>
    public const string OutcomeKindKey = "outcome_kind";

    /// <summary>The outcome kind's name in the file, as `check --json` names it.</summary>
    public const string MeasuredKind = "measured";
    public const string TimeToEventKind = "time_to_event";

    public static JsonObject ToJson(LockedPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var forest = new JsonArray();
        foreach (var tree in panel.Trees) forest.Add(TreeToJson(tree));
        return new JsonObject
        {
            ["markers"] = Strings(panel.MarkerNames),
            ["classes"] = Strings(panel.ClassNames),
            ["positive_class"] = panel.ClassNames[panel.PositiveClass],
            ["threshold"] = panel.Threshold is { } threshold ? JsonValue.Create(threshold) : null,
            ["out_of_bag_auc"] = panel.OutOfBagAuc is { } auc ? Number(auc) : null,
            ["provenance"] = ProvenanceToJson(panel.Provenance),
            ["discovery"] = DiscoveryToJson(panel.MarkerNames, panel.Markers),
            ["forest"] = forest,
        };
    }

    /// <summary>The content of a measured panel: the kind first, then what a reader of the kind needs (FORMAT.md).</summary>
    public static JsonObject ToJson(LockedMeasuredPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var forest = new JsonArray();
        foreach (var tree in panel.Trees)
        {
            var node = TopologyToJson(tree.Topology);
            node["node_means"] = Doubles(tree.NodeMeans);
            node["impurity_decreases"] = Doubles(tree.ImpurityDecreases);
            node["sample_counts"] = Ints(tree.Topology.NodeSampleCounts);
            forest.Add(node);
        }
        return new JsonObject
        {
            [OutcomeKindKey] = MeasuredKind,
            ["markers"] = Strings(panel.MarkerNames),
            ["outcome"] = panel.OutcomeName,
            ["out_of_bag_r_squared"] = Number(panel.OutOfBagRSquared),
            ["out_of_bag_rmse"] = Number(panel.OutOfBagRootMeanSquaredError),
            ["provenance"] = ProvenanceToJson(panel.Provenance),
            ["discovery"] = DiscoveryToJson(panel.MarkerNames, panel.Markers),
            ["forest"] = forest,
        };
    }

    /// <summary>The content of a follow-up panel: the kind first, then what a reader of the kind needs (FORMAT.md).</summary>
    public static JsonObject ToJson(LockedFollowUpPanel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var forest = new JsonArray();
        foreach (var tree in panel.Trees)
        {
            var node = TopologyToJson(tree.Topology);
            node["node_mortality"] = Doubles(tree.NodeMortality);
            node["sample_counts"] = Ints(tree.Topology.NodeSampleCounts);
            forest.Add(node);
        }
        return new JsonObject
        {
            [OutcomeKindKey] = TimeToEventKind,
            ["markers"] = Strings(panel.MarkerNames),
            ["follow_up"] = panel.TimeColumn,
            ["event"] = panel.EventColumn,
            ["out_of_bag_concordance"] = Number(panel.OutOfBagConcordance),
            ["risk_group_cut"] = Number(panel.RiskGroupCut),
            ["discovery_events"] = panel.DiscoveryEventCount,
            ["provenance"] = ProvenanceToJson(panel.Provenance),
            ["discovery"] = DiscoveryToJson(panel.MarkerNames, panel.Markers),
            ["forest"] = forest,
        };
    }

    /// <summary>The outcome kind of a content object: classes when the key is absent (files written before there were other kinds).</summary>
    /// <exception cref="InvalidDataException">The kind is not one this version knows.</exception>
    public static OutcomeKind KindOf(JsonObject content)
    {
        ArgumentNullException.ThrowIfNull(content);
        if (content[OutcomeKindKey] is null) return OutcomeKind.Classes;
        string kind = ReadString(content, OutcomeKindKey);
        return kind switch
        {
            MeasuredKind => OutcomeKind.Measured,
            TimeToEventKind => OutcomeKind.TimeToEvent,
            "classes" => OutcomeKind.Classes,
            _ => throw new InvalidDataException($"{OutcomeKindKey} '{kind}' is not an outcome kind this version knows ({MeasuredKind}, {TimeToEventKind}, or none for classes)."),
        };
    }

    private static JsonObject ProvenanceToJson(LockProvenance provenance)
    {
        var inputs = new JsonObject();
        foreach (var (name, hash) in provenance.InputSha256.OrderBy(p => p.Key, StringComparer.Ordinal)) inputs[name] = hash;
        return new JsonObject
        {
            ["tool_version"] = provenance.ToolVersion,
            // A string: 64-bit seeds do not survive readers that hold every number as a double.
            ["seed"] = provenance.Seed.ToString(CultureInfo.InvariantCulture),
            ["panel_size"] = provenance.PanelSize,
            ["trees"] = provenance.TreeCount,
            ["discovery_samples"] = provenance.DiscoverySampleCount,
            ["inputs_sha256"] = inputs,
        };
    }

    private static JsonArray DiscoveryToJson(IReadOnlyList<string> markerNames, IReadOnlyList<MarkerScale> scales)
    {
        var discovery = new JsonArray();
        for (int m = 0; m < markerNames.Count; m++)
        {
            var scale = scales[m];
            discovery.Add(new JsonObject
            {
                ["marker"] = markerNames[m],
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
        return discovery;
    }

    /// <exception cref="InvalidDataException">A field is missing, of the wrong kind, or the trees do not fit the markers.</exception>
    public static LockedPanel FromJson(JsonObject content)
    {
        ArgumentNullException.ThrowIfNull(content);
        var kind = KindOf(content);
        if (kind != OutcomeKind.Classes)
            throw new InvalidDataException($"this is a locked panel for a {KindText(kind)}, not for classes.");
        var markers = ReadStrings(content, "markers");
        var classes = ReadStrings(content, "classes");
        string positiveName = ReadString(content, "positive_class");
        int positive = classes.IndexOf(positiveName);
        if (positive < 0) throw new InvalidDataException($"positive_class '{positiveName}' is not one of the classes.");
        double? threshold = content["threshold"] is null ? null : ReadDouble(content["threshold"], "threshold");
        double? auc = content["out_of_bag_auc"] is null ? null : ReadDouble(content["out_of_bag_auc"], "out_of_bag_auc");
        var provenance = ReadProvenance(content);
        var scales = ReadDiscovery(content, markers);

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

    /// <exception cref="InvalidDataException">A field is missing, of the wrong kind, or the trees do not fit the markers.</exception>
    public static LockedMeasuredPanel MeasuredFromJson(JsonObject content)
    {
        ArgumentNullException.ThrowIfNull(content);
        var kind = KindOf(content);
        if (kind != OutcomeKind.Measured) throw new InvalidDataException($"this is a locked panel for {KindText(kind)}, not for a measured outcome.");
        var markers = ReadStrings(content, "markers");
        var trees = ReadForest(content, node => new RegressionTree(TopologyFromJson(node), ReadDoubles(node, "node_means"), ReadDoubles(node, "impurity_decreases")));
        var panel = new LockedMeasuredPanel(markers, trees, ReadString(content, "outcome"), ReadDiscovery(content, markers),
            ReadNumber(content, "out_of_bag_r_squared"), ReadNumber(content, "out_of_bag_rmse"), ReadProvenance(content));
        return Validated(panel, panel.Validate);
    }

    /// <exception cref="InvalidDataException">A field is missing, of the wrong kind, or the trees do not fit the markers.</exception>
    public static LockedFollowUpPanel FollowUpFromJson(JsonObject content)
    {
        ArgumentNullException.ThrowIfNull(content);
        var kind = KindOf(content);
        if (kind != OutcomeKind.TimeToEvent) throw new InvalidDataException($"this is a locked panel for {KindText(kind)}, not for a time to an event.");
        var markers = ReadStrings(content, "markers");
        var trees = ReadForest(content, node => new LockedRiskTree(TopologyFromJson(node), ReadDoubles(node, "node_mortality")));
        var panel = new LockedFollowUpPanel(markers, trees, ReadString(content, "follow_up"), ReadString(content, "event"),
            ReadDiscovery(content, markers), ReadNumber(content, "out_of_bag_concordance"), ReadNumber(content, "risk_group_cut"),
            ReadInt(content, "discovery_events"), ReadProvenance(content));
        return Validated(panel, panel.Validate);
    }

    /// <summary>The kind in words, for messages: "classes", "a measured outcome", "a time to an event".</summary>
    public static string KindText(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "a measured outcome",
        OutcomeKind.TimeToEvent => "a time to an event",
        _ => "classes",
    };

    private static T Validated<T>(T panel, Action validate)
    {
        try
        {
            validate();
        }
        catch (ArgumentException e)
        {
            throw new InvalidDataException(e.Message, e);
        }
        return panel;
    }

    private static T[] ReadForest<T>(JsonObject content, Func<JsonObject, T> read)
    {
        var forest = ReadArray(content, "forest");
        var trees = new T[forest.Count];
        for (int t = 0; t < trees.Length; t++)
        {
            if (forest[t] is not JsonObject treeNode) throw new InvalidDataException($"forest[{t}] is not an object.");
            try
            {
                trees[t] = read(treeNode);
            }
            catch (Exception e) when (e is ArgumentException or InvalidDataException)
            {
                throw new InvalidDataException($"forest[{t}]: {e.Message}", e);
            }
        }
        return trees;
    }

    private static LockProvenance ReadProvenance(JsonObject content)
    {
        var provenanceNode = ReadObject(content, "provenance");
        string seedText = ReadString(provenanceNode, "seed");
        if (!ulong.TryParse(seedText, NumberStyles.None, CultureInfo.InvariantCulture, out ulong seed))
            throw new InvalidDataException($"provenance.seed '{seedText}' is not a whole number.");
        var inputs = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (name, hash) in ReadObject(provenanceNode, "inputs_sha256"))
            inputs[name] = hash is JsonValue v && v.TryGetValue(out string? text) ? text : throw new InvalidDataException($"provenance.inputs_sha256.{name} is not text.");
        return new LockProvenance(ReadString(provenanceNode, "tool_version"), seed, ReadInt(provenanceNode, "panel_size"),
            ReadInt(provenanceNode, "trees"), ReadInt(provenanceNode, "discovery_samples"), inputs);
    }

    private static MarkerScale[] ReadDiscovery(JsonObject content, List<string> markers)
    {
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
        return scales;
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
            thresholds.Add(ThresholdToJson(tree.Thresholds[node]));
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
        var thresholds = ReadThresholds(node);
        var routing = ReadRouting(node);
        // Bin codes are not stored: they mean something only with the discovery bin mapper, which
        // the file does not hold. A reloaded tree is for raw values, which is all scoring needs.
        int nodeCount = features.Length;
        return new DecisionTree(classCount, features, new byte[nodeCount], thresholds, new byte[nodeCount],
            routing, ReadInts(node, "left"), ReadInts(node, "right"), ReadDoubles(node, "class_weights"), ReadInts(node, "node_classes"),
            ReadDoubles(node, "impurity_decreases"), ReadInts(node, "sample_counts"));
    }

    /// <summary>The split arrays every kind's tree writes first, in the class trees' order.</summary>
    private static JsonObject TopologyToJson(SplitTopology topology)
    {
        int nodeCount = topology.NodeCount;
        var thresholds = new JsonArray();
        var routing = new JsonArray();
        for (int node = 0; node < nodeCount; node++)
        {
            thresholds.Add(ThresholdToJson(topology.Thresholds[node]));
            routing.Add((int)topology.Routing[node]);
        }
        return new JsonObject
        {
            ["features"] = Ints(topology.Features),
            ["thresholds"] = thresholds,
            ["unmeasured_routing"] = routing,
            ["left"] = Ints(topology.LeftChildren),
            ["right"] = Ints(topology.RightChildren),
        };
    }

    /// <summary>A topology for raw values (no bin codes, as for class trees).</summary>
    private static SplitTopology TopologyFromJson(JsonObject node)
    {
        var features = ReadInts(node, "features");
        int nodeCount = features.Length;
        return new SplitTopology(features, new byte[nodeCount], ReadThresholds(node), new byte[nodeCount], ReadRouting(node),
            ReadInts(node, "left"), ReadInts(node, "right"), ReadInts(node, "sample_counts"));
    }

    /// <summary>
    /// Leaves carry no threshold (NaN in memory), which JSON cannot spell; a split that sends every
    /// measured value left and only unmeasured cells right has an infinite threshold, written as
    /// the text "Infinity" or "-Infinity".
    /// </summary>
    private static JsonNode? ThresholdToJson(float threshold) =>
        float.IsNaN(threshold) ? null
            : float.IsPositiveInfinity(threshold) ? JsonValue.Create(PositiveInfinityText)
            : float.IsNegativeInfinity(threshold) ? JsonValue.Create(NegativeInfinityText)
            : JsonValue.Create(threshold);

    private static float[] ReadThresholds(JsonObject node)
    {
        var thresholdNodes = ReadArray(node, "thresholds");
        var thresholds = new float[thresholdNodes.Count];
        for (int i = 0; i < thresholds.Length; i++)
            thresholds[i] = thresholdNodes[i] is null ? float.NaN
                : thresholdNodes[i] is JsonValue v && v.TryGetValue(out float value) ? value
                : thresholdNodes[i] is JsonValue t && t.TryGetValue(out string? text) && text == PositiveInfinityText ? float.PositiveInfinity
                : thresholdNodes[i] is JsonValue u && u.TryGetValue(out string? other) && other == NegativeInfinityText ? float.NegativeInfinity
                : throw new InvalidDataException($"thresholds[{i}] is not a number.");
        return thresholds;
    }

    private static UnmeasuredRouting[] ReadRouting(JsonObject node)
    {
        var routingCodes = ReadInts(node, "unmeasured_routing");
        var routing = new UnmeasuredRouting[routingCodes.Length];
        for (int i = 0; i < routing.Length; i++)
        {
            if ((uint)routingCodes[i] > (uint)(UnmeasuredRouting.MissingLeft | UnmeasuredRouting.BelowDetectionLeft))
                throw new InvalidDataException($"unmeasured_routing[{i}] = {routingCodes[i]} is not a routing.");
            routing[i] = (UnmeasuredRouting)routingCodes[i];
        }
        return routing;
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
