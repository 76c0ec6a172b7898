namespace OmicsScreen.Engine.Panels;

/// <summary>
/// A clinical covariate of every sample (age, sex, body mass, a standard lab value), in panel
/// sample order: numbers, or the codes 0 .. levels - 1 of a categorical column's levels.
/// </summary>
/// <remarks>
/// A categorical covariate enters a forest as its level codes in one column. For trees that is
/// enough: a two-level column splits the only way it can, and a column of more levels splits on
/// any cut of the codes' order, which a forest of many trees with random splits makes up for by
/// reaching a level from either side over several splits (common practice; ranger's default
/// "ignore" handling of unordered factors does the same, from memory). One-hot columns would instead thin every level's chance of
/// being tried at a split.
/// </remarks>
public sealed class Covariate
{
    private readonly double[] _values;

    private Covariate(string name, double[] values, IReadOnlyList<string> levels)
    {
        Name = name;
        _values = values;
        Levels = levels;
    }

    /// <summary>A numeric covariate; every value must be finite.</summary>
    public static Covariate Numeric(string name, double[] values)
    {
        ArgumentNullException.ThrowIfNull(name);
        foreach (double value in values)
            if (!double.IsFinite(value)) throw new ArgumentException("A numeric covariate needs a finite value for every sample.", nameof(values));
        return new Covariate(name, values, []);
    }

    /// <summary>A categorical covariate: each sample's level as an index into <paramref name="levels"/>.</summary>
    public static Covariate Categorical(string name, IReadOnlyList<string> levels, int[] sampleLevels)
    {
        ArgumentNullException.ThrowIfNull(name);
        if (levels.Count == 0) throw new ArgumentException("A categorical covariate needs at least one level.", nameof(levels));
        var values = new double[sampleLevels.Length];
        for (int i = 0; i < sampleLevels.Length; i++)
        {
            if ((uint)sampleLevels[i] >= (uint)levels.Count) throw new ArgumentOutOfRangeException(nameof(sampleLevels));
            values[i] = sampleLevels[i];
        }
        return new Covariate(name, values, levels);
    }

    /// <summary>The sample-sheet column the covariate was read from.</summary>
    public string Name { get; }

    /// <summary>True when the column holds levels (some value is not a number) rather than numbers.</summary>
    public bool IsCategorical => Levels.Count > 0;

    /// <summary>The levels of a categorical covariate, in ordinal order; empty for a numeric one.</summary>
    public IReadOnlyList<string> Levels { get; }

    public int SampleCount => _values.Length;

    /// <summary>Each sample's value, or its level's code for a categorical covariate.</summary>
    public ReadOnlySpan<double> Values => _values;

    /// <summary>The sample's level (categorical covariates only).</summary>
    public int LevelOf(int sample) => (int)_values[sample];

    public Covariate SelectSamples(ReadOnlySpan<int> samples)
    {
        var picked = new double[samples.Length];
        for (int i = 0; i < samples.Length; i++) picked[i] = _values[samples[i]];
        return new Covariate(Name, picked, Levels);
    }
}
