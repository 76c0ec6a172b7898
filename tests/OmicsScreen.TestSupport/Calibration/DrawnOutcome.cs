using OmicsScreen.Engine.Panels;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// The outcome a calibration model drew for the samples of one cohort, of one kind: classes, a
/// measured quantity, or follow-up time with an event flag.
/// </summary>
public sealed class DrawnOutcome
{
    private readonly int[]? _classes;
    private readonly double[]? _values;
    private readonly double[]? _times;
    private readonly bool[]? _events;

    private DrawnOutcome(OutcomeKind kind, int[]? classes, double[]? values, double[]? times, bool[]? events)
    {
        Kind = kind;
        _classes = classes;
        _values = values;
        _times = times;
        _events = events;
    }

    public OutcomeKind Kind { get; }

    public static DrawnOutcome OfClasses(int[] classes) =>
        new(OutcomeKind.Classes, classes ?? throw new ArgumentNullException(nameof(classes)), null, null, null);

    public static DrawnOutcome OfMeasured(double[] values) =>
        new(OutcomeKind.Measured, null, values ?? throw new ArgumentNullException(nameof(values)), null, null);

    public static DrawnOutcome OfFollowUp(double[] times, bool[] events)
    {
        ArgumentNullException.ThrowIfNull(times);
        ArgumentNullException.ThrowIfNull(events);
        if (times.Length != events.Length) throw new ArgumentException("Times and event flags must be parallel.");
        return new(OutcomeKind.TimeToEvent, null, null, times, events);
    }

    /// <summary>The panel of this outcome on <paramref name="matrix"/>; class names and the positive class are read only for classes.</summary>
    public Panel ToPanel(FeatureMatrix matrix, IReadOnlyList<string> classNames, int positiveClass) => Kind switch
    {
        OutcomeKind.Classes => new Panel(matrix, new ClassOutcome("outcome", classNames, _classes!, positiveClass)),
        OutcomeKind.Measured => new Panel(matrix, new MeasuredOutcome("outcome", _values!)),
        _ => new Panel(matrix, new FollowUpOutcome("follow_up_time", "event", _times, _events)),
    };
}
