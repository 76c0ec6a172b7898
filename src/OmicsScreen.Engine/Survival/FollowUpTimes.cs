namespace OmicsScreen.Engine.Survival;

/// <summary>
/// Censored follow-up of every sample, indexed for survival trees: the distinct event times
/// (increasing), and per sample how many of them it is at risk at and which one its event is.
/// </summary>
/// <remarks>
/// A sample is at risk at event time t_g when its own time is at least t_g (a sample censored at
/// an event time counts as at risk there, the usual convention of Kaplan-Meier and log-rank).
/// So with a_i = number of event times &lt;= time_i, sample i is at risk at event times g &lt; a_i.
/// </remarks>
public sealed class FollowUpTimes
{
    private readonly double[] _times;
    private readonly bool[] _events;
    private readonly double[] _eventTimes;
    private readonly int[] _atRiskCounts;
    private readonly int[] _eventIndices;

    public FollowUpTimes(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved)
    {
        if (time.Length != eventObserved.Length) throw new ArgumentException("Times and event flags must be parallel.");
        if (time.Length == 0) throw new ArgumentException("Follow-up needs at least one sample.");
        foreach (double t in time)
            if (!double.IsFinite(t) || t < 0) throw new ArgumentException("Follow-up times must be finite and not negative.");
        _times = time.ToArray();
        _events = eventObserved.ToArray();
        var distinct = new SortedSet<double>();
        for (int i = 0; i < _times.Length; i++)
            if (_events[i]) distinct.Add(_times[i]);
        _eventTimes = distinct.ToArray();
        _atRiskCounts = new int[_times.Length];
        _eventIndices = new int[_times.Length];
        for (int i = 0; i < _times.Length; i++)
        {
            // Number of event times <= time_i: the first index whose time exceeds it.
            int at = Array.BinarySearch(_eventTimes, _times[i]);
            _atRiskCounts[i] = at >= 0 ? at + 1 : ~at;
            _eventIndices[i] = _events[i] ? at : -1;
        }
    }

    public int SampleCount => _times.Length;
    public ReadOnlySpan<double> Times => _times;
    public ReadOnlySpan<bool> Events => _events;

    /// <summary>The distinct times at which an event was observed, increasing.</summary>
    public ReadOnlySpan<double> EventTimes => _eventTimes;

    /// <summary>Per sample, how many event times it is at risk at (those with index below this).</summary>
    public ReadOnlySpan<int> AtRiskCounts => _atRiskCounts;

    /// <summary>Per sample, the index of its event time, or -1 when censored.</summary>
    public ReadOnlySpan<int> EventIndices => _eventIndices;

    /// <summary>The follow-up of the given samples, in that order, indexed afresh.</summary>
    public FollowUpTimes SelectSamples(ReadOnlySpan<int> samples)
    {
        var times = new double[samples.Length];
        var events = new bool[samples.Length];
        for (int i = 0; i < samples.Length; i++)
        {
            times[i] = _times[samples[i]];
            events[i] = _events[samples[i]];
        }
        return new FollowUpTimes(times, events);
    }

    public int EventCount
    {
        get
        {
            int count = 0;
            foreach (bool e in _events) if (e) count++;
            return count;
        }
    }
}
