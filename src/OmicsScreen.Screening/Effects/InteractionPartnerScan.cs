namespace OmicsScreen.Screening.Effects;

/// <summary>The interaction-partner scan of a shortlist: every pair of scanned markers and the null they were held against.</summary>
/// <param name="Markers">Feature indices scanned, in shortlist order (at most <see cref="InteractionPartners.MaxMarkers"/>).</param>
/// <param name="Pairs">Every pair of scanned markers, in shortlist order of the first, then of the second.</param>
/// <param name="NullLargest">The largest adjacent-split score of a marker with another marker's stratum-permuted copy: the bar a pair must pass.</param>
/// <param name="NullCount">How many marker-with-copy scores the bar is the largest of.</param>
/// <param name="CopiesPerMarker">Stratum-permuted copies of each scanned marker in the scan's forest.</param>
public sealed record InteractionPartnerScan(IReadOnlyList<int> Markers, IReadOnlyList<InteractionPair> Pairs, double NullLargest, int NullCount,
    int CopiesPerMarker)
{
    public static InteractionPartnerScan Empty { get; } = new([], [], double.NaN, 0, 0);

    /// <summary>The named partners of a feature, strongest first.</summary>
    public IReadOnlyList<int> PartnersOf(int feature)
    {
        var partners = new List<(int Feature, double Score)>();
        foreach (var pair in Pairs)
        {
            if (!pair.Named) continue;
            if (pair.First == feature) partners.Add((pair.Second, pair.Score));
            else if (pair.Second == feature) partners.Add((pair.First, pair.Score));
        }
        partners.Sort((a, b) => b.Score != a.Score ? b.Score.CompareTo(a.Score) : a.Feature.CompareTo(b.Feature));
        return partners.Select(p => p.Feature).ToArray();
    }
}
