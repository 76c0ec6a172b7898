namespace OmicsScreen.Engine.Panels;

/// <summary>A measured quantity as the outcome: one finite value per sample, in sample order.</summary>
public sealed class MeasuredOutcome
{
    private readonly double[] _values;

    public MeasuredOutcome(string columnName, double[] values)
    {
        ArgumentNullException.ThrowIfNull(columnName);
        ArgumentNullException.ThrowIfNull(values);
        foreach (double value in values)
            if (!double.IsFinite(value)) throw new ArgumentException("A measured outcome needs a finite value for every sample.");
        ColumnName = columnName;
        _values = values;
    }

    public string ColumnName { get; }
    public int SampleCount => _values.Length;

    /// <summary>The outcome of each sample.</summary>
    public ReadOnlySpan<double> Values => _values;

    public MeasuredOutcome SelectSamples(ReadOnlySpan<int> samples)
    {
        var picked = new double[samples.Length];
        for (int i = 0; i < samples.Length; i++) picked[i] = _values[samples[i]];
        return new MeasuredOutcome(ColumnName, picked);
    }
}
