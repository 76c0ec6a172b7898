namespace OmicsScreen.Screening.Effects;

/// <summary>Strata of the interaction-partner scan's stratum-permuted copies.</summary>
public static class PartnerStrata
{
    /// <summary>
    /// Equal-count bins by rank: the value at rank r (0-based, ties by position so the result never
    /// depends on a sort's stability) goes to bin floor(binCount r / n); fewer bins when there are
    /// fewer values than bins.
    /// </summary>
    public static int[] RankBins(double[] values, int binCount)
    {
        ArgumentNullException.ThrowIfNull(values);
        int count = values.Length;
        int bins = Math.Max(1, Math.Min(binCount, count));
        var order = new int[count];
        for (int i = 0; i < count; i++) order[i] = i;
        Array.Sort(order, (a, b) => values[a] != values[b] ? values[a].CompareTo(values[b]) : a.CompareTo(b));
        var strata = new int[count];
        for (int rank = 0; rank < count; rank++) strata[order[rank]] = (int)((long)bins * rank / count);
        return strata;
    }
}
