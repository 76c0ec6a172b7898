using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

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

    /// <summary>
    /// A measured panel on a cohort with the outcome known: R² and RMSE of the predictions, the
    /// calibration line (observed on predicted, <see cref="CalibrationLine"/>) and groups of
    /// samples by rank of prediction, as <see cref="Calibrate"/> groups probabilities.
    /// </summary>
    public static LockedMeasuredPerformance EvaluateMeasured(LockedMeasuredScores scores, ReadOnlySpan<double> observed)
    {
        ArgumentNullException.ThrowIfNull(scores);
        if (observed.Length != scores.SampleCount) throw new ArgumentException("The outcome must have one value per scored sample.");
        int n = scores.SampleCount;
        var predicted = scores.Predictions;
        var fit = SquaredErrorFit.Of(observed, predicted);
        return new LockedMeasuredPerformance(n, fit.RSquared, fit.RootMeanSquaredError, CalibrationLine.Fit(predicted, observed),
            GroupByPrediction(predicted, observed), predicted.ToArray(), observed.ToArray());
    }

    /// <summary>
    /// A follow-up panel on a cohort with follow-up known: Harrell's C of the risk score with its
    /// interval, the cumulative/dynamic AUC at the horizon when one is given (<see cref="TimeDependentAuc"/>),
    /// and the Kaplan-Meier curves of the two risk groups with the log-rank test between them.
    /// </summary>
    /// <exception cref="ArgumentException">The horizon has no cases or no controls in this cohort.</exception>
    public static LockedFollowUpPerformance EvaluateFollowUp(LockedFollowUpScores scores, ReadOnlySpan<double> time, ReadOnlySpan<bool> eventObserved,
        double? horizon)
    {
        ArgumentNullException.ThrowIfNull(scores);
        if (time.Length != scores.SampleCount || eventObserved.Length != scores.SampleCount)
            throw new ArgumentException("The follow-up must have one time and event per scored sample.");
        var risk = scores.RiskScores;
        TimeDependentAucEstimate? timeAuc = horizon is { } t ? TimeDependentAuc.CumulativeDynamic(time, eventObserved, risk, t) : null;
        var concordance = HarrellConcordance.Estimate(time, eventObserved, risk);

        int events = 0, highEvents = 0;
        var low = new List<int>();
        var high = new List<int>();
        for (int s = 0; s < scores.SampleCount; s++)
        {
            if (eventObserved[s]) events++;
            if (scores.HighRisk[s])
            {
                high.Add(s);
                if (eventObserved[s]) highEvents++;
            }
            else low.Add(s);
        }
        var allTimes = time.ToArray();
        var allEvents = eventObserved.ToArray();
        SurvivalCurve? Curve(List<int> group)
        {
            if (group.Count == 0) return null;
            var t = new double[group.Count];
            var e = new bool[group.Count];
            for (int i = 0; i < group.Count; i++)
            {
                t[i] = allTimes[group[i]];
                e[i] = allEvents[group[i]];
            }
            return KaplanMeier.Estimate(t, e);
        }
        var lowCurve = Curve(low);
        var highCurve = Curve(high);
        LogRankResult? logRank = low.Count > 0 && high.Count > 0 ? LogRankTest.TwoGroups(time, eventObserved, scores.HighRisk) : null;
        return new LockedFollowUpPerformance(scores.SampleCount, events, high.Count, highEvents, concordance, timeAuc, lowCurve, highCurve, logRank);
    }

    /// <summary>Groups by rank of prediction into near-equal groups, B = clamp(n / 10, 1, 10), ties kept in sample order.</summary>
    private static IReadOnlyList<MeasuredCalibrationBin> GroupByPrediction(ReadOnlySpan<double> predicted, ReadOnlySpan<double> observed)
    {
        int sampleCount = predicted.Length;
        if (sampleCount == 0) return [];
        int binCount = Math.Clamp(sampleCount / MinimumBinSize, 1, MaximumBinCount);
        var keys = predicted.ToArray();
        var order = new int[sampleCount];
        for (int i = 0; i < sampleCount; i++) order[i] = i;
        var sortedOrder = order.OrderBy(i => keys[i]).ThenBy(i => i).ToArray();
        var bins = new MeasuredCalibrationBin[binCount];
        for (int b = 0; b < binCount; b++)
        {
            int start = (int)((long)b * sampleCount / binCount), end = (int)((long)(b + 1) * sampleCount / binCount);
            double sumPredicted = 0, sumObserved = 0;
            for (int k = start; k < end; k++)
            {
                sumPredicted += keys[sortedOrder[k]];
                sumObserved += observed[sortedOrder[k]];
            }
            int count = end - start;
            bins[b] = new MeasuredCalibrationBin(keys[sortedOrder[start]], keys[sortedOrder[end - 1]], sumPredicted / count, sumObserved / count, count);
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
