namespace OmicsScreen.Screening.Statistics.Survival;

/// <summary>Checks shared by the survival statistics: one time and one event flag per sample.</summary>
internal static class FollowUp
{
    public static void Check(ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved)
    {
        if (time.Length != eventObserved.Length)
            throw new ArgumentException("Follow-up needs one time and one event flag per sample.");
        for (int i = 0; i < time.Length; i++)
            if (!(time[i] >= 0) || double.IsInfinity(time[i]))
                throw new ArgumentException($"Follow-up time {time[i]} of sample {i} is not a finite non-negative number.");
    }

    /// <summary>Sample indices in ascending order of time (stable, so ties keep their input order).</summary>
    public static int[] OrderByTime(ReadOnlySpan<double> time)
    {
        var order = new int[time.Length];
        for (int i = 0; i < order.Length; i++) order[i] = i;
        var keys = time.ToArray();
        Array.Sort(keys, order);
        // Array.Sort is not stable; restore input order within tied times so results never depend on it.
        int start = 0;
        while (start < order.Length)
        {
            int end = start + 1;
            while (end < order.Length && keys[end] == keys[start]) end++;
            if (end - start > 1) Array.Sort(order, start, end - start);
            start = end;
        }
        return order;
    }
}
