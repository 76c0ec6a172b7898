namespace OmicsScreen.Engine.Panels;

/// <summary>
/// A discovery panel ready to screen: the measurements, the outcome of every sample and the
/// optional cohort (or batch) and subject groupings, all in the same sample order.
/// </summary>
public sealed class Panel
{
    public Panel(FeatureMatrix matrix, ClassOutcome outcome, SampleGrouping? cohort = null,
        SampleGrouping? subject = null, IReadOnlyDictionary<string, string[]>? extraColumns = null)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(outcome);
        if (outcome.SampleCount != matrix.SampleCount)
            throw new ArgumentException("The outcome must have one class per sample.");
        if (cohort is not null && cohort.SampleLevels.Length != matrix.SampleCount)
            throw new ArgumentException("The cohort grouping must have one level per sample.");
        if (subject is not null && subject.SampleLevels.Length != matrix.SampleCount)
            throw new ArgumentException("The subject grouping must have one level per sample.");
        Matrix = matrix;
        Outcome = outcome;
        Cohort = cohort;
        Subject = subject;
        ExtraColumns = extraColumns ?? new Dictionary<string, string[]>();
    }

    public FeatureMatrix Matrix { get; }
    public ClassOutcome Outcome { get; }
    /// <summary>Recruitment centre, cohort or processing batch, when the sample sheet names one.</summary>
    public SampleGrouping? Cohort { get; }
    /// <summary>Subject of each sample, when replicates or repeated visits share a subject.</summary>
    public SampleGrouping? Subject { get; }
    /// <summary>Other sample-sheet columns, as text, in sample order.</summary>
    public IReadOnlyDictionary<string, string[]> ExtraColumns { get; }

    public int SampleCount => Matrix.SampleCount;
    public int FeatureCount => Matrix.FeatureCount;

    public Panel SelectSamples(ReadOnlySpan<int> samples)
    {
        var extra = new Dictionary<string, string[]>(StringComparer.Ordinal);
        foreach (var (name, values) in ExtraColumns)
        {
            var picked = new string[samples.Length];
            for (int i = 0; i < samples.Length; i++) picked[i] = values[samples[i]];
            extra[name] = picked;
        }
        return new Panel(Matrix.SelectSamples(samples), Outcome.SelectSamples(samples),
            Cohort?.SelectSamples(samples), Subject?.SelectSamples(samples), extra);
    }

    public Panel SelectFeatures(ReadOnlySpan<int> features) =>
        new(Matrix.SelectFeatures(features), Outcome, Cohort, Subject, ExtraColumns);
}
