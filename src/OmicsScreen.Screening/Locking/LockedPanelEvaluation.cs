using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Locking;

/// <summary>Measures a locked panel's scores against the known outcome of a validation cohort.</summary>
public static class LockedPanelEvaluation
{
    /// <summary>Calibration groups hold at least this many samples; up to ten groups (deciles of risk, Hosmer &amp; Lemeshow 1980).</summary>
    public const int MinimumBinSize = 10;
    public const int MaximumBinCount = 10;

    /// <summary>
    /// AUC with its DeLong interval (DeLong, DeLong &amp; Clarke-Pearson 1988), error and confusion at
    /// the locked call, and a calibration table. Truth classes are matched to the panel's by name.
    /// </summary>
    public static LockedPanelPerformance Evaluate(LockedPanelScores scores, ClassOutcome truth)
    {
        ArgumentNullException.ThrowIfNull(scores);
        ArgumentNullException.ThrowIfNull(truth);
        if (truth.SampleCount != scores.SampleCount) throw new ArgumentException("The outcome must have one class per scored sample.");
        int sampleCount = scores.SampleCount, classCount = scores.ClassCount, positiveClass = scores.PositiveClass;
        var truthCodes = MapClasses(scores, truth);

        var confusion = new int[classCount][];
        for (int c = 0; c < classCount; c++) confusion[c] = new int[classCount];
        int wrong = 0;
        for (int s = 0; s < sampleCount; s++)
        {
            confusion[truthCodes[s]][scores.PredictedClasses[s]]++;
            if (truthCodes[s] != scores.PredictedClasses[s]) wrong++;
        }

        var probability = new double[sampleCount];
        var isPositive = new bool[sampleCount];
        int positives = 0;
        for (int s = 0; s < sampleCount; s++)
        {
            probability[s] = scores.Probability(s, positiveClass);
            isPositive[s] = truthCodes[s] == positiveClass;
            if (isPositive[s]) positives++;
        }

        double? auc = null;
        ConfidenceInterval? interval = null;
        if (classCount == 2 && positives > 0 && positives < sampleCount)
        {
            var positiveScores = new double[positives];
            var negativeScores = new double[sampleCount - positives];
            int p = 0, n = 0;
            for (int s = 0; s < sampleCount; s++)
                if (isPositive[s]) positiveScores[p++] = probability[s];
                else negativeScores[n++] = probability[s];
            var estimate = DeLong.Estimate(positiveScores, negativeScores);
            auc = estimate.Auc;
            interval = AucInterval.Compute(estimate.Auc, estimate.StandardError);
        }
        return new LockedPanelPerformance(scores.ClassNames, positiveClass, sampleCount, scores.Threshold, auc, interval,
            sampleCount > 0 ? (double)wrong / sampleCount : double.NaN, confusion, Calibrate(probability, isPositive));
    }

    /// <summary>
    /// Groups samples by rank of predicted probability into near-equal groups (group g holds ranks
    /// g·n/B to (g+1)·n/B - 1), B = clamp(n / 10, 1, 10); samples with equal probability are kept
    /// in sample order, so a tie may straddle two groups.
    /// </summary>
    public static IReadOnlyList<CalibrationBin> Calibrate(ReadOnlySpan<double> predicted, ReadOnlySpan<bool> positive)
    {
        if (predicted.Length != positive.Length) throw new ArgumentException("One truth value is needed per prediction.");
        int sampleCount = predicted.Length;
        if (sampleCount == 0) return [];
        int binCount = Math.Clamp(sampleCount / MinimumBinSize, 1, MaximumBinCount);
        var order = new int[sampleCount];
        for (int i = 0; i < sampleCount; i++) order[i] = i;
        var keys = predicted.ToArray();
        // A stable sort: equal probabilities keep sample order.
        var sortedOrder = order.OrderBy(i => keys[i]).ThenBy(i => i).ToArray();
        var bins = new CalibrationBin[binCount];
        for (int b = 0; b < binCount; b++)
        {
            int start = (int)((long)b * sampleCount / binCount), end = (int)((long)(b + 1) * sampleCount / binCount);
            double sum = 0;
            int positives = 0;
            for (int k = start; k < end; k++)
            {
                sum += keys[sortedOrder[k]];
                if (positive[sortedOrder[k]]) positives++;
            }
            int count = end - start;
            bins[b] = new CalibrationBin(keys[sortedOrder[start]], keys[sortedOrder[end - 1]], sum / count,
                (double)positives / count, count);
        }
        return bins;
    }

    private static int[] MapClasses(LockedPanelScores scores, ClassOutcome truth)
    {
        var codeOf = new int[truth.ClassCount];
        for (int c = 0; c < truth.ClassCount; c++)
        {
            codeOf[c] = -1;
            for (int k = 0; k < scores.ClassCount; k++)
                if (string.Equals(truth.ClassNames[c], scores.ClassNames[k], StringComparison.Ordinal)) codeOf[c] = k;
        }
        var codes = new int[truth.SampleCount];
        var classes = truth.SampleClasses;
        for (int s = 0; s < codes.Length; s++)
        {
            codes[s] = codeOf[classes[s]];
            if (codes[s] < 0)
                throw new ArgumentException($"Outcome class '{truth.ClassNames[classes[s]]}' is not one of the locked panel's classes ("
                    + string.Join(", ", scores.ClassNames) + ").");
        }
        return codes;
    }
}
