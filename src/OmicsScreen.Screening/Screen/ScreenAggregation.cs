using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>Turns the repeats x features matrices into per-feature summaries and the screen's order.</summary>
internal static class ScreenAggregation
{
    /// <param name="direct">The direct tests' p-values (rank test, interaction scan); a test's array is empty when it did not run.</param>
    public static FeatureSummary[] Summarise(RepeatImportances repeats, IReadOnlyList<string> featureNames,
        DecoyEvidence decoys, ReadOnlySpan<double> outcomePermutationP, DirectTestEvidence direct)
    {
        ArgumentNullException.ThrowIfNull(direct);
        var rankTestP = direct.FeatureRankP;
        var interactionP = direct.FeatureInteractionP;
        int featureCount = repeats.FeatureCount, repeatCount = repeats.RepeatCount;
        var frequency = SelectionStability.SelectionFrequencies(repeats.Selected, featureCount);
        var correctedMean = new double[featureCount];
        var column = new double[repeatCount];
        var summaries = new (double Median, double Q1, double Q3, double CMean, double CSd, double PMean, double PSd, double IMean, double ISd)[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            for (int r = 0; r < repeatCount; r++) column[r] = repeats.CombinedRank[r * featureCount + f];
            Array.Sort(column);
            double median = Quantile.OfSorted(column, 0.5, QuantileDefinition.Linear);
            double q1 = Quantile.OfSorted(column, 0.25, QuantileDefinition.Linear);
            double q3 = Quantile.OfSorted(column, 0.75, QuantileDefinition.Linear);
            var (cMean, cSd) = SampleMoments.OfColumn(repeats.Corrected, featureCount, f);
            var (pMean, pSd) = SampleMoments.OfColumn(repeats.Permutation, featureCount, f);
            var (iMean, iSd) = SampleMoments.OfColumn(repeats.Impurity, featureCount, f);
            correctedMean[f] = cMean;
            summaries[f] = (median, q1, q3, cMean, cSd, pMean, pSd, iMean, iSd);
        }

        // With decoys, each feature's mean corrected importance is compared with the decoys' means:
        // a decoy is permuted once per run, so its mean carries a persistent chance association as
        // a null feature's does, and the two share one law (DecoyNull). Without decoys the only
        // null at hand is the mirrored non-positive means (Janitza et al. 2018), which understates
        // the right-skewed tail of a null feature's mean: the tool warns that such p-values are
        // approximate.
        var nullP = decoys.DecoyCount > 0 ? DecoyNull.PValues(decoys.Means, correctedMean) : JanitzaNull.PValues(correctedMean);
        bool permuted = outcomePermutationP.Length == featureCount;
        var forestP = permuted ? outcomePermutationP.ToArray() : nullP;
        // The forest's evidence and the direct tests', combined by the Cauchy combination test (Liu &
        // Xie 2020): the rank test is the most powerful screen for a monotone shift, the forest finds
        // thresholds and shapes a rank test misses, the interaction scan the pairs that act only
        // together, which a greedy forest rarely splits on; any of them can carry a marker.
        bool combined = rankTestP.Length == featureCount;
        bool scanned = interactionP.Length == featureCount;
        var combinedP = new double[featureCount];
        for (int f = 0; f < featureCount; f++)
            combinedP[f] = Combine(forestP[f], combined ? rankTestP[f] : double.NaN, scanned ? interactionP[f] : double.NaN, direct.Weights);
        // The combination is then calibrated against the decoys' combinations, computed the same
        // way: whatever the rank test's normal approximation or the combination's tail gets wrong
        // on this panel, it gets wrong for the decoys too.
        var pValues = decoys.DecoyCount > 0 ? DecoyNull.PValues(decoys.CombinedP.Length > 0 ? DecoyEvidence.Surprise(decoys.CombinedP) : [], DecoyEvidence.Surprise(combinedP)) : combinedP;
        var qValues = BenjaminiHochberg.Adjust(pValues);

        var order = FinalOrder(frequency, summaries.Select(s => s.Median).ToArray(), correctedMean);
        var position = new int[featureCount];
        for (int i = 0; i < order.Length; i++) position[order[i]] = i + 1;

        var result = new FeatureSummary[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            var s = summaries[f];
            result[f] = new FeatureSummary(f, featureNames[f], frequency[f], s.Median, s.Q1, s.Q3, s.CMean, s.CSd,
                s.PMean, s.PSd, s.IMean, s.ISd, nullP[f], permuted ? outcomePermutationP[f] : double.NaN,
                pValues[f], qValues[f], position[f])
            {
                ForestP = forestP[f],
                CombinedP = combinedP[f],
                RankTestP = combined ? rankTestP[f] : double.NaN,
                InteractionP = scanned ? interactionP[f] : double.NaN,
                InteractionPartner = scanned ? direct.InteractionPartners[f] : -1,
            };
        }
        return result;
    }

    /// <summary>
    /// Each test's p-value enters the combination capped at this value, so a test can subtract
    /// little from another's evidence (at most its weight times tan(0.4 pi), about 3.1). Without
    /// the cap a p-value near 1 becomes a huge negative Cauchy variable (tan((0.5 - p) pi)) that
    /// wipes out any evidence beside it: a strongly shifted marker's interaction scan often sits at
    /// p = 1 (its largest chi-square below every decoy's), and such markers combined to p = 1
    /// (measured: 6 of 30 planted markers lost at 200 x 10,000). A cap at 0.5 would let no test
    /// subtract anything, but it piles every feature whose three p-values exceed 0.5 onto one
    /// combined value, an atom that makes the p-values far from uniform (KS distance 0.16-0.22 on
    /// every calibration shape); at 0.9 that atom is negligible. The cap is applied to the decoys
    /// alike, so the calibration against them stays exact.
    /// </summary>
    public const double CombinationCap = 0.9;

    /// <summary>The combination with <see cref="CombinationWeights.Even"/> weights (class and measured screens).</summary>
    public static double Combine(double forestP, double rankTestP, double interactionP) =>
        Combine(forestP, rankTestP, interactionP, CombinationWeights.Even);

    /// <summary>The weighted Cauchy combination of the forest's p-value and the direct tests' (NaN where a test did not run), each capped at <see cref="CombinationCap"/>.</summary>
    public static double Combine(double forestP, double rankTestP, double interactionP, CombinationWeights weights)
    {
        ArgumentNullException.ThrowIfNull(weights);
        Span<double> pValues = [Math.Min(forestP, CombinationCap), Math.Min(rankTestP, CombinationCap), Math.Min(interactionP, CombinationCap)];
        Span<double> weightValues = [weights.Forest, weights.RankTest, weights.InteractionScan];
        return CauchyCombination.Combine(pValues, weightValues);
    }

    /// <summary>Feature indices in the screen's final order (<see cref="FeatureSummary.Order"/>).</summary>
    public static int[] OrderOf(IReadOnlyList<FeatureSummary> features)
    {
        var order = new int[features.Count];
        foreach (var feature in features) order[feature.Order - 1] = feature.FeatureIndex;
        return order;
    }

    /// <summary>Selection frequency (high first), then median combined rank (low first), then mean corrected importance, then feature order.</summary>
    public static int[] FinalOrder(double[] frequency, double[] medianRank, double[] correctedMean)
    {
        var order = Enumerable.Range(0, frequency.Length).ToArray();
        Array.Sort(order, (a, b) =>
        {
            int c = frequency[b].CompareTo(frequency[a]);
            if (c != 0) return c;
            c = medianRank[a].CompareTo(medianRank[b]);
            if (c != 0) return c;
            c = correctedMean[b].CompareTo(correctedMean[a]);
            return c != 0 ? c : a.CompareTo(b);
        });
        return order;
    }
}
