namespace OmicsScreen.Screening.Statistics;

/// <summary>False discovery rate control by Benjamini &amp; Hochberg (1995, JRSS-B 57:289-300).</summary>
/// <remarks>
/// NaN p-values (a test that could not be run) pass through as NaN and do not count in the number
/// of tests m: a feature with no test cannot be a discovery, and counting it would only make every
/// other q-value larger. p-values outside [0, 1] are rejected.
/// </remarks>
public static class BenjaminiHochberg
{
    /// <summary>
    /// Adjusted p-values (q-values): q_(i) = min over k &gt;= i of min(1, m p_(k) / k), so they are
    /// monotone in p and capped at 1. Rejecting every q &lt;= alpha is the step-up procedure at level alpha.
    /// </summary>
    public static void Adjust(ReadOnlySpan<double> pValues, Span<double> qValues)
    {
        if (qValues.Length != pValues.Length) throw new ArgumentException("One q-value slot is needed per p-value.", nameof(qValues));
        int[] order = TestedInAscendingOrder(pValues);
        int m = order.Length;
        for (int i = 0; i < pValues.Length; i++) qValues[i] = double.NaN;
        double running = 1.0;
        // Invariant: running = min over the tests ranked k..m of m p_(k) / k (capped at 1).
        for (int k = m; k >= 1; k--)
        {
            int index = order[k - 1];
            // m / k first: it is exactly 1 at k = m, so a q-value can never round below its p-value.
            running = Math.Min(running, pValues[index] * ((double)m / k));
            qValues[index] = running;
        }
    }

    public static double[] Adjust(ReadOnlySpan<double> pValues)
    {
        var q = new double[pValues.Length];
        Adjust(pValues, q);
        return q;
    }

    /// <summary>
    /// The step-up rejection set at FDR level <paramref name="level"/>: with k the largest rank such
    /// that p_(k) &lt;= k alpha / m, the k smallest p-values are rejected (true in the returned mask).
    /// </summary>
    public static bool[] RejectionSet(ReadOnlySpan<double> pValues, double level)
    {
        if (!(level > 0 && level <= 1)) throw new ArgumentOutOfRangeException(nameof(level), "The FDR level must lie in (0, 1].");
        int[] order = TestedInAscendingOrder(pValues);
        int m = order.Length;
        int largest = 0;
        for (int k = 1; k <= m; k++)
            if (pValues[order[k - 1]] <= k * level / m) largest = k;
        var rejected = new bool[pValues.Length];
        for (int k = 0; k < largest; k++) rejected[order[k]] = true;
        return rejected;
    }

    /// <summary>Indices of the non-NaN p-values, sorted by p ascending (index breaks ties, for determinism).</summary>
    private static int[] TestedInAscendingOrder(ReadOnlySpan<double> pValues)
    {
        int tested = 0;
        foreach (double p in pValues)
        {
            if (double.IsNaN(p)) continue;
            if (p < 0 || p > 1) throw new ArgumentException($"p-value {p} lies outside [0, 1].", nameof(pValues));
            tested++;
        }
        var keys = new double[tested];
        var order = new int[tested];
        int next = 0;
        for (int i = 0; i < pValues.Length; i++)
        {
            if (double.IsNaN(pValues[i])) continue;
            keys[next] = pValues[i];
            order[next] = i;
            next++;
        }
        Array.Sort(keys, order);
        // Array.Sort is not stable; restore index order within equal p so results never depend on it.
        int start = 0;
        while (start < tested)
        {
            int end = start + 1;
            while (end < tested && keys[end] == keys[start]) end++;
            if (end - start > 1) Array.Sort(order, start, end - start);
            start = end;
        }
        return order;
    }
}
