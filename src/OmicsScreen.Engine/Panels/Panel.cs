namespace OmicsScreen.Engine.Panels;

/// <summary>
/// A discovery panel ready to screen: the measurements, the outcome of every sample and the
/// optional cohort (or batch) and subject groupings, all in the same sample order.
/// </summary>
/// <remarks>
/// The outcome is of one <see cref="OutcomeKind"/>: classes, a measured quantity or a censored
/// time to an event. Code written for classes reads <see cref="Outcome"/>, which refuses the other
/// kinds loudly rather than letting a class screen run on something that is not classes.
/// </remarks>
public sealed class Panel
{
    private readonly ClassOutcome? _classes;

    public Panel(FeatureMatrix matrix, ClassOutcome outcome, SampleGrouping? cohort = null,
        SampleGrouping? subject = null, IReadOnlyDictionary<string, string[]>? extraColumns = null)
        : this(matrix, OutcomeKind.Classes, outcome, null, null, cohort, subject, extraColumns)
    {
    }

    public Panel(FeatureMatrix matrix, MeasuredOutcome outcome, SampleGrouping? cohort = null,
        SampleGrouping? subject = null, IReadOnlyDictionary<string, string[]>? extraColumns = null)
        : this(matrix, OutcomeKind.Measured, null, outcome, null, cohort, subject, extraColumns)
    {
    }

    public Panel(FeatureMatrix matrix, FollowUpOutcome outcome, SampleGrouping? cohort = null,
        SampleGrouping? subject = null, IReadOnlyDictionary<string, string[]>? extraColumns = null)
        : this(matrix, OutcomeKind.TimeToEvent, null, null, outcome, cohort, subject, extraColumns)
    {
    }

    private Panel(FeatureMatrix matrix, OutcomeKind kind, ClassOutcome? classes, MeasuredOutcome? measured,
        FollowUpOutcome? followUp, SampleGrouping? cohort, SampleGrouping? subject,
        IReadOnlyDictionary<string, string[]>? extraColumns)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int outcomeSamples = kind switch
        {
            OutcomeKind.Classes => (classes ?? throw new ArgumentNullException("outcome")).SampleCount,
            OutcomeKind.Measured => (measured ?? throw new ArgumentNullException("outcome")).SampleCount,
            _ => (followUp ?? throw new ArgumentNullException("outcome")).SampleCount,
        };
        if (outcomeSamples != matrix.SampleCount)
            throw new ArgumentException("The outcome must have one value per sample.");
        if (cohort is not null && cohort.SampleLevels.Length != matrix.SampleCount)
            throw new ArgumentException("The cohort grouping must have one level per sample.");
        if (subject is not null && subject.SampleLevels.Length != matrix.SampleCount)
            throw new ArgumentException("The subject grouping must have one level per sample.");
        Matrix = matrix;
        Kind = kind;
        _classes = classes;
        Measured = measured;
        FollowUp = followUp;
        Cohort = cohort;
        Subject = subject;
        ExtraColumns = extraColumns ?? new Dictionary<string, string[]>();
    }

    public FeatureMatrix Matrix { get; }

    public OutcomeKind Kind { get; }

    /// <summary>The class of every sample; only a class panel has one.</summary>
    /// <exception cref="InvalidOperationException">The outcome is a measured quantity or a time to an event.</exception>
    public ClassOutcome Outcome => _classes ?? throw new InvalidOperationException(
        $"This panel's outcome is {Describe(Kind)}, not classes; code that needs classes must check Panel.Kind first.");

    /// <summary>The measured outcome, when <see cref="Kind"/> is <see cref="OutcomeKind.Measured"/>; otherwise null.</summary>
    public MeasuredOutcome? Measured { get; }

    /// <summary>Follow-up time and event, when <see cref="Kind"/> is <see cref="OutcomeKind.TimeToEvent"/>; otherwise null.</summary>
    public FollowUpOutcome? FollowUp { get; }

    /// <summary>The column (or for a time to an event, the time column) the outcome was read from.</summary>
    public string OutcomeColumn => Kind switch
    {
        OutcomeKind.Classes => _classes!.ColumnName,
        OutcomeKind.Measured => Measured!.ColumnName,
        _ => FollowUp!.TimeColumn,
    };

    /// <summary>Recruitment centre, cohort or processing batch, when the sample sheet names one.</summary>
    public SampleGrouping? Cohort { get; }
    /// <summary>Subject of each sample, when replicates or repeated visits share a subject.</summary>
    public SampleGrouping? Subject { get; }
    /// <summary>Other sample-sheet columns, as text, in sample order.</summary>
    public IReadOnlyDictionary<string, string[]> ExtraColumns { get; }

    /// <summary>Clinical covariates named for the screen (age, sex, ...), in sample order; empty when none were named.</summary>
    public IReadOnlyList<Covariate> Covariates { get; private init; } = [];

    /// <summary>This panel with <paramref name="covariates"/> (one value per sample each) as its covariates.</summary>
    public Panel WithCovariates(IReadOnlyList<Covariate> covariates)
    {
        foreach (var covariate in covariates)
            if (covariate.SampleCount != SampleCount)
                throw new ArgumentException("Every covariate must have one value per sample.", nameof(covariates));
        return new Panel(Matrix, Kind, _classes, Measured, FollowUp, Cohort, Subject, ExtraColumns) { Covariates = covariates };
    }

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
        return new Panel(Matrix.SelectSamples(samples), Kind, _classes?.SelectSamples(samples),
            Measured?.SelectSamples(samples), FollowUp?.SelectSamples(samples),
            Cohort?.SelectSamples(samples), Subject?.SelectSamples(samples), extra)
        {
            Covariates = SelectCovariates(samples),
        };
    }

    private Covariate[] SelectCovariates(ReadOnlySpan<int> samples)
    {
        var picked = new Covariate[Covariates.Count];
        for (int c = 0; c < picked.Length; c++) picked[c] = Covariates[c].SelectSamples(samples);
        return picked;
    }

    public Panel SelectFeatures(ReadOnlySpan<int> features) =>
        new(Matrix.SelectFeatures(features), Kind, _classes, Measured, FollowUp, Cohort, Subject, ExtraColumns) { Covariates = Covariates };

    private static string Describe(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "a measured quantity",
        OutcomeKind.TimeToEvent => "a time to an event",
        _ => "classes",
    };
}
