namespace OmicsScreen.Engine.Panels;

/// <summary>
/// A categorical sample attribute such as cohort, batch or subject: a level code per sample and
/// the level names.
/// </summary>
public sealed class SampleGrouping
{
    private readonly int[] _sampleLevels;

    public SampleGrouping(string columnName, IReadOnlyList<string> levelNames, int[] sampleLevels)
    {
        ArgumentNullException.ThrowIfNull(levelNames);
        ArgumentNullException.ThrowIfNull(sampleLevels);
        foreach (int level in sampleLevels)
            if ((uint)level >= (uint)levelNames.Count) throw new ArgumentException($"Level code {level} is out of range.");
        ColumnName = columnName;
        LevelNames = levelNames.ToArray();
        _sampleLevels = sampleLevels;
    }

    public string ColumnName { get; }
    public IReadOnlyList<string> LevelNames { get; }
    public int LevelCount => LevelNames.Count;
    public ReadOnlySpan<int> SampleLevels => _sampleLevels;

    public SampleGrouping SelectSamples(ReadOnlySpan<int> samples)
    {
        var codes = new int[samples.Length];
        for (int i = 0; i < samples.Length; i++) codes[i] = _sampleLevels[samples[i]];
        return new SampleGrouping(ColumnName, LevelNames, codes);
    }

    /// <summary>Builds a grouping from text labels; levels are ordered ordinally by name.</summary>
    public static SampleGrouping FromLabels(string columnName, IReadOnlyList<string> labels)
    {
        var names = labels.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int i = 0; i < names.Length; i++) index[names[i]] = i;
        var codes = new int[labels.Count];
        for (int i = 0; i < labels.Count; i++) codes[i] = index[labels[i]];
        return new SampleGrouping(columnName, names, codes);
    }
}
