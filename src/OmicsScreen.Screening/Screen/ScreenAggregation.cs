using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>Turns the repeats x features matrices into per-feature summaries and the screen's order.</summary>
internal static class ScreenAggregation
{
    public static FeatureSummary[] Summarise(RepeatImportances repeats, IReadOnlyList<string> featureNames,
        ReadOnlySpan<double> decoyMeans, ReadOnlySpan<double> outcomePermutationP)
    {
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
            var (cMean, cSd) = MeanAndSd(repeats.Corrected, f, featureCount, repeatCount);
            var (pMean, pSd) = MeanAndSd(repeats.Permutation, f, featureCount, repeatCount);
            var (iMean, iSd) = MeanAndSd(repeats.Impurity, f, featureCount, repeatCount);
            correctedMean[f] = cMean;
            summaries[f] = (median, q1, q3, cMean, cSd, pMean, pSd, iMean, iSd);
        }

        // Janitza et al. (2018): the null is built from the non-positive mean corrected
        // importances and their mirror images, here joined by the decoys'; averaging over repeats
        // keeps noise symmetric about 0.
        var nullP = DecoyAugmentedNull.PValues(correctedMean, decoyMeans, correctedMean);
        bool permuted = outcomePermutationP.Length == featureCount;
        var pValues = permuted ? outcomePermutationP.ToArray() : nullP;
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
                pValues[f], qValues[f], position[f]);
        }
        return result;
    }

    /// <summary>The order of a screen's features without the p-values: what the panel-size curve's inner screens need.</summary>
    public static int[] OrderOf(RepeatImportances repeats)
    {
        int featureCount = repeats.FeatureCount, repeatCount = repeats.RepeatCount;
        var frequency = SelectionStability.SelectionFrequencies(repeats.Selected, featureCount);
        var median = new double[featureCount];
        var correctedMean = new double[featureCount];
        var column = new double[repeatCount];
        for (int f = 0; f < featureCount; f++)
        {
            for (int r = 0; r < repeatCount; r++) column[r] = repeats.CombinedRank[r * featureCount + f];
            Array.Sort(column);
            median[f] = Quantile.OfSorted(column, 0.5, QuantileDefinition.Linear);
            correctedMean[f] = MeanAndSd(repeats.Corrected, f, featureCount, repeatCount).Mean;
        }
        return FinalOrder(frequency, median, correctedMean);
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

    /// <summary>Mean and sample SD (n - 1) of one feature's column; SD is NaN for a single repeat.</summary>
    private static (double Mean, double Sd) MeanAndSd(double[] matrix, int feature, int featureCount, int repeatCount)
    {
        double sum = 0;
        for (int r = 0; r < repeatCount; r++) sum += matrix[r * featureCount + feature];
        double mean = sum / repeatCount;
        if (repeatCount < 2) return (mean, double.NaN);
        double squares = 0;
        for (int r = 0; r < repeatCount; r++)
        {
            double d = matrix[r * featureCount + feature] - mean;
            squares += d * d;
        }
        return (mean, Math.Sqrt(squares / (repeatCount - 1)));
    }
}
