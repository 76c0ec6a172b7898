namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Applies the shortlist rule to a screen's feature summaries, and the same rule to its decoys for
/// the target-decoy estimate. Used by the main screen and by every inner screen, so the panel-size
/// curve and the cohort checks repeat the procedure whose panel is locked.
/// </summary>
internal static class ShortlistSelection
{
    /// <summary>The shortlisted features in screen order, and the decoy estimate of the list.</summary>
    public static (int[] Shortlisted, DecoyEstimate Decoys) Apply(IReadOnlyList<FeatureSummary> features, IReadOnlyList<int> order,
        DecoyEvidence decoys, ScreenOptions options)
    {
        bool byBound = options.Rule == ShortlistRule.DecoyBound && decoys.DecoyCount > 0;
        double cut = byBound ? BoundCut(features, decoys, options) : double.NaN;
        var shortlisted = new List<int>();
        foreach (int f in order)
        {
            var feature = features[f];
            if (!FrequentEnough(feature.SelectionFrequency, options)) continue;
            bool passes = byBound ? feature.PValue <= cut : feature.QValue <= options.QValueThreshold;
            if (passes) shortlisted.Add(f);
        }
        return (shortlisted.ToArray(), Estimate(features, shortlisted, decoys, options));
    }

    /// <summary>The frequency filter; a threshold of 0 turns it off.</summary>
    private static bool FrequentEnough(double frequency, ScreenOptions options) =>
        options.FrequencyThreshold <= 0 || frequency >= options.FrequencyThreshold;

    /// <summary>Each decoy's share of repeats that selected it.</summary>
    public static double[] DecoyFrequencies(RepeatImportances repeats)
    {
        int decoyCount = repeats.DecoyCount;
        var frequency = new double[decoyCount];
        for (int r = 0; r < repeats.RepeatCount; r++)
            for (int d = 0; d < decoyCount; d++)
                if (repeats.DecoySelected[r * decoyCount + d]) frequency[d] += 1;
        for (int d = 0; d < decoyCount; d++) frequency[d] /= Math.Max(1, repeats.RepeatCount);
        return frequency;
    }

    /// <summary>Each decoy's corrected importance averaged over repeats.</summary>
    public static double[] DecoyMeans(RepeatImportances repeats)
    {
        int decoyCount = repeats.DecoyCount;
        var means = new double[decoyCount];
        for (int r = 0; r < repeats.RepeatCount; r++)
            for (int d = 0; d < decoyCount; d++) means[d] += repeats.DecoyCorrected[r * decoyCount + d];
        for (int d = 0; d < decoyCount; d++) means[d] /= Math.Max(1, repeats.RepeatCount);
        return means;
    }

    /// <summary>
    /// Decoys passing the list's rule: frequent enough, with a p-value at or under the largest on
    /// the list. Both rules accept every feature at or under some p-value (BH's step-up cut, or the
    /// bound's), so "at or under the list's largest p-value" is the same rule for a decoy.
    /// </summary>
    internal static DecoyEstimate Estimate(IReadOnlyList<FeatureSummary> features, IReadOnlyList<int> shortlisted,
        DecoyEvidence decoys, ScreenOptions options)
    {
        int decoyCount = decoys.DecoyCount, listed = shortlisted.Count;
        if (decoyCount == 0) return new DecoyEstimate(0, 0, listed, double.NaN);
        double perDecoy = (double)features.Count / decoyCount;
        int passing = 0;
        if (listed > 0)
        {
            double cut = double.NegativeInfinity;
            foreach (int f in shortlisted) cut = Math.Max(cut, features[f].PValue);
            for (int d = 0; d < decoyCount; d++)
                if (FrequentEnough(decoys.Frequencies[d], options) && decoys.PValues[d] <= cut) passing++;
        }
        return new DecoyEstimate(decoyCount, passing, listed, listed == 0 ? 0 : Math.Min(1, perDecoy * passing / listed))
        {
            FeaturesPerDecoy = perDecoy,
            ExpectedFalseMarkers = perDecoy * passing,
            FalseDiscoveryBound = listed == 0 ? double.NaN : Math.Min(1, perDecoy * (1 + passing) / listed),
        };
    }

    /// <summary>
    /// The largest p-value cut at which the knockoff+ bound
    /// (features/decoys) x (1 + decoys at or under) / (features at or under) is at or under the
    /// level, counting only features and decoys that pass the frequency filter (Barber &amp; Candès
    /// 2015, with the decoys' count scaled to the features'). -infinity when no cut achieves it.
    /// </summary>
    internal static double BoundCut(IReadOnlyList<FeatureSummary> features, DecoyEvidence decoys, ScreenOptions options)
    {
        var candidates = new List<double>();
        foreach (var feature in features)
            if (FrequentEnough(feature.SelectionFrequency, options) && !double.IsNaN(feature.PValue)) candidates.Add(feature.PValue);
        var decoyP = new List<double>();
        for (int d = 0; d < decoys.DecoyCount; d++)
            if (FrequentEnough(decoys.Frequencies[d], options) && !double.IsNaN(decoys.PValues[d])) decoyP.Add(decoys.PValues[d]);
        candidates.Sort();
        decoyP.Sort();
        double perDecoy = (double)features.Count / decoys.DecoyCount;
        double best = double.NegativeInfinity;
        int decoysUnder = 0;
        // Walk the cut up through the candidates' p-values; at each distinct value count the
        // features and decoys at or under it. Keep the largest cut that satisfies the bound.
        for (int i = 0; i < candidates.Count; i++)
        {
            if (i + 1 < candidates.Count && candidates[i + 1] == candidates[i]) continue;
            double cut = candidates[i];
            while (decoysUnder < decoyP.Count && decoyP[decoysUnder] <= cut) decoysUnder++;
            if (perDecoy * (1 + decoysUnder) / (i + 1) <= options.QValueThreshold) best = cut;
        }
        return best;
    }
}
