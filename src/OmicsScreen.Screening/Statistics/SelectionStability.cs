namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// Selection frequencies and the stability estimator of Nogueira, Sechidis &amp; Brown (2018, JMLR
/// 18(174):1-54) for a binary selection matrix.
/// </summary>
/// <remarks>
/// The selection matrix Z is given row-major as repeats x features: element r * featureCount + f is
/// true when repeat r selected feature f. With M repeats, d features, p_f the selection frequency of
/// feature f, k_r the size of repeat r's selection and k-bar their mean:
/// Phi = 1 - (1/d) sum_f s_f^2 / ((k-bar/d)(1 - k-bar/d)), s_f^2 = M/(M - 1) p_f (1 - p_f) (paper, Definition 4).
/// Its variance (paper, Theorem 9 and its estimator) is Var = 4/M^2 sum_r (phi_r - phi-bar)^2 with
/// phi_r = [ (1/d) sum_f Z_rf p_f - k_r k-bar / d^2 + (Phi/2)(2 k_r k-bar / d^2 - k_r/d - k-bar/d + 1) ] / ((k-bar/d)(1 - k-bar/d)).
/// This is algebraically the same as the authors' Fleiss-kappa form of the estimator.
/// Stability is undefined (NaN) when every repeat selects nothing or everything, or with one repeat.
/// </remarks>
public static class SelectionStability
{
    /// <summary>The fraction of repeats that selected each feature.</summary>
    public static void SelectionFrequencies(ReadOnlySpan<bool> selections, int featureCount, Span<double> frequencies)
    {
        int repeatCount = RepeatCount(selections, featureCount);
        if (frequencies.Length != featureCount) throw new ArgumentException("One frequency slot is needed per feature.", nameof(frequencies));
        frequencies.Clear();
        for (int r = 0; r < repeatCount; r++)
        {
            var row = selections.Slice(r * featureCount, featureCount);
            for (int f = 0; f < featureCount; f++)
                if (row[f]) frequencies[f] += 1;
        }
        for (int f = 0; f < featureCount; f++) frequencies[f] /= repeatCount;
    }

    public static double[] SelectionFrequencies(ReadOnlySpan<bool> selections, int featureCount)
    {
        var frequencies = new double[featureCount];
        SelectionFrequencies(selections, featureCount, frequencies);
        return frequencies;
    }

    /// <summary>The mean number of features selected per repeat (k-bar, or q in Meinshausen &amp; Buhlmann).</summary>
    public static double MeanSelectedCount(ReadOnlySpan<bool> selections, int featureCount)
    {
        int repeatCount = RepeatCount(selections, featureCount);
        long selected = 0;
        foreach (bool s in selections)
            if (s) selected++;
        return (double)selected / repeatCount;
    }

    /// <summary>Nogueira's stability with its variance and a normal interval at <paramref name="level"/>.</summary>
    public static StabilityEstimate Nogueira(ReadOnlySpan<bool> selections, int featureCount, double level = 0.95)
    {
        int repeatCount = RepeatCount(selections, featureCount);
        double d = featureCount, m = repeatCount;
        var frequencies = SelectionFrequencies(selections, featureCount);
        double meanSelected = 0, spread = 0;
        for (int f = 0; f < featureCount; f++)
        {
            meanSelected += frequencies[f];
            spread += frequencies[f] * (1 - frequencies[f]);
        }
        double denominator = meanSelected / d * (1 - meanSelected / d);
        if (repeatCount < 2 || !(denominator > 0))
            return new StabilityEstimate(double.NaN, double.NaN, ConfidenceInterval.Undefined(level), meanSelected, repeatCount, featureCount);
        double stability = 1 - m / (m - 1) * (spread / d) / denominator;

        var perRepeat = new double[repeatCount];
        double perRepeatMean = 0;
        for (int r = 0; r < repeatCount; r++)
        {
            var row = selections.Slice(r * featureCount, featureCount);
            double selectedHere = 0, agreement = 0;
            for (int f = 0; f < featureCount; f++)
            {
                if (!row[f]) continue;
                selectedHere += 1;
                agreement += frequencies[f];
            }
            perRepeat[r] = (agreement / d - selectedHere * meanSelected / (d * d)
                + stability / 2 * (2 * selectedHere * meanSelected / (d * d) - selectedHere / d - meanSelected / d + 1)) / denominator;
            perRepeatMean += perRepeat[r];
        }
        perRepeatMean /= m;
        double squares = 0;
        foreach (double phi in perRepeat) squares += (phi - perRepeatMean) * (phi - perRepeatMean);
        double variance = 4 / (m * m) * squares;
        double halfWidth = NormalTail.TwoSidedCritical(level) * Math.Sqrt(variance);
        return new StabilityEstimate(stability, variance,
            new ConfidenceInterval(stability - halfWidth, stability + halfWidth, level), meanSelected, repeatCount, featureCount);
    }

    private static int RepeatCount(ReadOnlySpan<bool> selections, int featureCount)
    {
        if (featureCount < 1) throw new ArgumentOutOfRangeException(nameof(featureCount));
        if (selections.Length == 0 || selections.Length % featureCount != 0)
            throw new ArgumentException("The selection matrix must hold whole rows of featureCount entries.", nameof(selections));
        return selections.Length / featureCount;
    }
}
