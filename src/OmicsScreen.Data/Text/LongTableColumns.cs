namespace OmicsScreen.Data.Text;

/// <summary>
/// The columns of a long table (one row per sample and feature): which hold the sample, the
/// feature, the value, the optional per-row detection limit and flags, the sample attributes
/// (outcome, cohort, subject, annotations, repeated on each of a sample's rows) and the
/// feature-describing columns (repeated on each of a feature's rows).
/// </summary>
internal sealed class LongTableColumns
{
    public const string DefaultSample = "sample";
    public const string DefaultFeature = "feature";
    public const string DefaultValue = "value";

    public required int Sample { get; init; }
    public required int Feature { get; init; }
    public required int Value { get; init; }
    public int Limit { get; init; } = -1;
    public int BelowFlag { get; init; } = -1;
    public int QualityFlag { get; init; } = -1;
    public required int[] SampleAttributes { get; init; }
    public required int[] FeatureAnnotations { get; init; }
    public required string[] Header { get; init; }

    public static LongTableColumns Resolve(string[] header, PanelLoadOptions options, string path)
    {
        int sample = Find(header, options.SampleIdColumn, DefaultSample, "--id-column", path, required: true);
        string featureName = options.FeatureColumns is { Count: > 0 } named ? named[0] : DefaultFeature;
        int feature = Find(header, featureName, null, "--feature-columns", path, required: true);
        int value = Find(header, options.ValueColumn, DefaultValue, "--value-column", path, required: true);
        int limit = options.DetectionLimitColumn is { } limitName
            ? Find(header, limitName, null, "--detection-limit", path, required: options.FeatureSheetPath is null)
            : Array.IndexOf(header, Assembly.FeatureSheetJoin.DefaultDetectionLimitColumn);
        int below = options.BelowDetectionFlagColumn is { } belowName ? Find(header, belowName, null, "--below-detection-flag", path, required: true) : -1;
        int quality = options.QualityFlagColumn is { } qualityName ? Find(header, qualityName, null, "--quality-flag", path, required: true) : -1;
        var attributes = new List<int>();
        foreach (var name in options.SampleAttributeNames())
            if (Array.IndexOf(header, name) is var c and >= 0) attributes.Add(c);
        var annotations = new List<int>();
        if (options.FeatureColumns is { } describing)
            foreach (var name in describing.Skip(1))
                annotations.Add(Find(header, name, null, "--feature-columns", path, required: true));
        var used = new List<int> { sample, feature, value, limit, below, quality };
        used.AddRange(attributes);
        used.AddRange(annotations);
        if (used.Where(c => c >= 0).GroupBy(c => c).FirstOrDefault(g => g.Count() > 1) is { } twice)
            throw PanelInputException.At(path, 1, header[twice.Key],
                "this column is named for two roles of the long table (sample, feature, value, limit, flags, attributes).",
                "Give each role its own column with --id-column, --feature-columns, --value-column, --detection-limit, --below-detection-flag and --quality-flag.");
        return new LongTableColumns
        {
            Sample = sample, Feature = feature, Value = value, Limit = limit, BelowFlag = below, QualityFlag = quality,
            SampleAttributes = attributes.ToArray(), FeatureAnnotations = annotations.ToArray(), Header = header,
        };
    }

    private static int Find(string[] header, string? named, string? fallback, string option, string path, bool required)
    {
        string name = named ?? fallback!;
        int index = Array.IndexOf(header, name);
        if (index >= 0 || !required) return index;
        string fix = named is null
            ? $"Name the column with {option} (the default is '{fallback}'); names are case-sensitive."
            : $"Give {option} an existing column; names are case-sensitive.";
        throw PanelInputException.At(path, 1, null,
            $"is read as a long table (one row per sample and feature) but has no column '{Display.Name(name)}'; its columns are {Display.List(header, 12)}.",
            fix);
    }
}
