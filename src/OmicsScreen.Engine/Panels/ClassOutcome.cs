namespace OmicsScreen.Engine.Panels;

/// <summary>
/// The outcome of every sample as a class code 0..ClassCount-1, with the class names and counts.
/// </summary>
/// <remarks>
/// Class codes follow the order of <see cref="ClassNames"/>, which callers fix (the loader sorts
/// names ordinally) so that codes never depend on the order samples appear in a file.
/// </remarks>
public sealed class ClassOutcome
{
    private readonly int[] _sampleClasses;
    private readonly int[] _classCounts;

    public ClassOutcome(string columnName, IReadOnlyList<string> classNames, int[] sampleClasses, int positiveClass = -1)
    {
        ArgumentNullException.ThrowIfNull(classNames);
        ArgumentNullException.ThrowIfNull(sampleClasses);
        if (classNames.Count < 1) throw new ArgumentException("An outcome needs at least one class.");
        ColumnName = columnName;
        ClassNames = classNames.ToArray();
        _sampleClasses = sampleClasses;
        _classCounts = new int[classNames.Count];
        foreach (int c in sampleClasses)
        {
            if ((uint)c >= (uint)classNames.Count) throw new ArgumentException($"Class code {c} is out of range.");
            _classCounts[c]++;
        }
        PositiveClass = positiveClass >= 0 ? positiveClass : DefaultPositiveClass(_classCounts);
        if (PositiveClass >= classNames.Count) throw new ArgumentException("The positive class is out of range.");
    }

    public string ColumnName { get; }
    public IReadOnlyList<string> ClassNames { get; }
    public int ClassCount => ClassNames.Count;
    public int SampleCount => _sampleClasses.Length;

    /// <summary>The class code of each sample.</summary>
    public ReadOnlySpan<int> SampleClasses => _sampleClasses;

    public ReadOnlySpan<int> ClassCounts => _classCounts;

    /// <summary>
    /// The class whose probability is scored by the AUC and whose direction of effect is reported.
    /// Defaults to the smallest class (cases are usually the minority), ties to the first name.
    /// </summary>
    public int PositiveClass { get; }

    public ClassOutcome SelectSamples(ReadOnlySpan<int> samples)
    {
        var codes = new int[samples.Length];
        for (int i = 0; i < samples.Length; i++) codes[i] = _sampleClasses[samples[i]];
        return new ClassOutcome(ColumnName, ClassNames, codes, PositiveClass);
    }

    private static int DefaultPositiveClass(int[] counts)
    {
        int best = 0;
        for (int c = 1; c < counts.Length; c++)
            if (counts[c] < counts[best]) best = c;
        return best;
    }
}
