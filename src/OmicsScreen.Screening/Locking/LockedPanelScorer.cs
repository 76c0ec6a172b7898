using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Locking;

/// <summary>Scores a new cohort with a locked panel, matching markers by name and checking their scale.</summary>
public static class LockedPanelScorer
{
    /// <summary>A new median beyond the discovery quartiles by this many IQRs flags a marker (Tukey's far-out fence, Tukey 1977).</summary>
    public const double FenceInterquartileRanges = 3.0;

    /// <summary>A spread (IQR) this many times larger or smaller than in discovery flags a marker; common practice.</summary>
    public const double SpreadRatioLimit = 4.0;

    /// <exception cref="MissingMarkersException">Some markers are not columns of the new matrix.</exception>
    public static LockedPanelScores Score(LockedPanel panel, FeatureMatrix newMatrix)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(newMatrix);
        var columns = MapMarkers(panel.MarkerNames, newMatrix);
        var matrix = newMatrix.SelectFeatures(columns);
        var (probabilities, predicted) = Vote(panel, matrix);

        var warnings = new List<ScaleWarning>();
        for (int m = 0; m < panel.MarkerCount; m++)
        {
            var scale = MarkerScale.Describe(matrix, m);
            var warning = scale.MeasuredCount == 0
                ? UnmeasuredWarning(panel, matrix, m, scale, probabilities, predicted)
                : ScaleCheck(panel.MarkerNames[m], panel.Markers[m], scale);
            if (warning is not null) warnings.Add(warning);
        }
        return new LockedPanelScores(matrix.SampleIds, panel.ClassNames, panel.PositiveClass, panel.Threshold,
            probabilities, predicted, warnings);
    }

    /// <summary>Fraction of trees voting for each class (sample-major) and the class called for each sample.</summary>
    private static (double[] Probabilities, int[] Predicted) Vote(LockedPanel panel, FeatureMatrix matrix)
    {
        int sampleCount = matrix.SampleCount, classCount = panel.ClassCount;
        var votes = new int[sampleCount * classCount];
        foreach (var tree in panel.Trees)
            for (int s = 0; s < sampleCount; s++) votes[s * classCount + tree.PredictClass(matrix, s)]++;

        int treeCount = panel.Trees.Count;
        var probabilities = new double[votes.Length];
        for (int i = 0; i < votes.Length; i++) probabilities[i] = (double)votes[i] / treeCount;
        var predicted = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++)
            predicted[s] = Call(panel, probabilities.AsSpan(s * classCount, classCount));
        return (probabilities, predicted);
    }

    /// <summary>
    /// A marker measured in no sample of the new cohort (every cell missing or below detection)
    /// sends every sample down the trees' missing-value branches, so the scores rest on the other
    /// markers alone. Its effect is measured by scoring again with the marker set to its discovery
    /// median in every sample: the calls that change and the mean shift of the positive class's score.
    /// </summary>
    private static ScaleWarning? UnmeasuredWarning(LockedPanel panel, FeatureMatrix matrix, int marker, MarkerScale current,
        double[] probabilities, int[] predicted)
    {
        var discovery = panel.Markers[marker];
        if (discovery.MeasuredCount == 0 || double.IsNaN(discovery.Median)) return null;
        var atMedian = AtDiscoveryMedian(matrix, marker, discovery.Median);
        var (imputedProbabilities, imputedCalls) = Vote(panel, atMedian);

        int changed = 0;
        double shift = 0;
        int classCount = panel.ClassCount, sampleCount = matrix.SampleCount;
        for (int s = 0; s < sampleCount; s++)
        {
            if (imputedCalls[s] != predicted[s]) changed++;
            int i = s * classCount + panel.PositiveClass;
            shift += Math.Abs(imputedProbabilities[i] - probabilities[i]);
        }
        string state = UnmeasuredState(current);
        var message = FormattableString.Invariant(
            $"{panel.MarkerNames[marker]} is {state} of the new cohort (discovery measured it in {1 - discovery.MissingShare - discovery.BelowDetectionShare:P0} of samples), so every sample takes the trees' missing-value branches for it and the scores rest on the other markers only. ")
            + FormattableString.Invariant(
            $"Set to its discovery median instead, {changed} of {sampleCount} calls would change and the {panel.ClassNames[panel.PositiveClass]} score would move by {(sampleCount > 0 ? shift / sampleCount : 0):0.000} on average. Measure it, or do not trust these scores.");
        return new ScaleWarning(panel.MarkerNames[marker], message) { Unmeasured = true };
    }

    /// <summary>
    /// The class called for one sample: with a threshold, positive at or above it and otherwise the
    /// other class; without one, the majority vote, a tie going to the first class in class order.
    /// </summary>
    public static int Call(LockedPanel panel, ReadOnlySpan<double> probabilities)
    {
        if (panel.Threshold is { } threshold)
            return probabilities[panel.PositiveClass] >= threshold ? panel.PositiveClass : 1 - panel.PositiveClass;
        int best = 0;
        for (int c = 1; c < probabilities.Length; c++)
            if (probabilities[c] > probabilities[best]) best = c;
        return best;
    }

    /// <summary>
    /// A warning when the new median lies outside [Q1 - 3 IQR, Q3 + 3 IQR] of discovery or the IQR
    /// changed by more than a factor of 4; null when the marker looks comparable or cannot be judged.
    /// </summary>
    public static ScaleWarning? ScaleCheck(string marker, MarkerScale discovery, MarkerScale current)
    {
        if (current.MeasuredCount == 0 || discovery.MeasuredCount == 0) return null;
        double iqr = discovery.InterquartileRange;
        bool outside = current.Median < discovery.LowerQuartile - FenceInterquartileRanges * iqr
            || current.Median > discovery.UpperQuartile + FenceInterquartileRanges * iqr;
        bool spread = false;
        // An IQR of zero on either side (a marker mostly at one value) carries no ratio to judge.
        if (iqr > 0 && current.InterquartileRange > 0)
        {
            double ratio = current.InterquartileRange / iqr;
            spread = ratio > SpreadRatioLimit || ratio < 1 / SpreadRatioLimit;
        }
        if (!outside && !spread) return null;
        var message = FormattableString.Invariant(
            $"{marker} looks measured on another scale: median {current.Median:G4} vs discovery {discovery.Median:G4} (quartiles {current.LowerQuartile:G4} to {current.UpperQuartile:G4} vs discovery {discovery.LowerQuartile:G4} to {discovery.UpperQuartile:G4})")
            + ". Check units, log transform and normalisation before trusting its scores.";
        return new ScaleWarning(marker, message);
    }

    /// <summary>A copy of the matrix with one marker set to its discovery median in every sample.</summary>
    private static FeatureMatrix AtDiscoveryMedian(FeatureMatrix matrix, int marker, double median)
    {
        var columns = new float[matrix.FeatureCount][];
        var states = new CellState[]?[matrix.FeatureCount];
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            columns[f] = matrix.Column(f).ToArray();
            states[f] = matrix.HasUnmeasuredCells(f) ? matrix.States(f).ToArray() : null;
        }
        Array.Fill(columns[marker], (float)median);
        states[marker] = null;
        return new FeatureMatrix(matrix.FeatureNames, matrix.SampleIds, columns, states);
    }

    private static string UnmeasuredState(MarkerScale current) =>
        // Shares are counts over the sample count, so "none of the other kind" is the exact test.
        current.MissingShare == 0 ? "below the detection limit in every sample"
            : current.BelowDetectionShare == 0 ? "missing in every sample"
            : FormattableString.Invariant($"unmeasured in every sample ({current.MissingShare:P0} missing, {current.BelowDetectionShare:P0} below detection)");

    /// <summary>
    /// Scores a new cohort with a locked measured panel: each sample's prediction is the mean of
    /// the trees' leaf means, from raw values, so a reloaded panel predicts exactly as the panel it was saved from.
    /// </summary>
    /// <exception cref="MissingMarkersException">Some markers are not columns of the new matrix.</exception>
    public static LockedMeasuredScores ScoreMeasured(LockedMeasuredPanel panel, FeatureMatrix newMatrix)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(newMatrix);
        var matrix = newMatrix.SelectFeatures(MapMarkers(panel.MarkerNames, newMatrix));
        var predictions = Predict(panel, matrix);
        var warnings = ValueWarnings(panel.MarkerNames, panel.Markers, matrix, predictions, m => Predict(panel, m), null,
            "predictions", "prediction");
        return new LockedMeasuredScores(matrix.SampleIds, panel.OutcomeName, predictions, warnings);
    }

    /// <summary>
    /// Scores a new cohort with a locked follow-up panel: each sample's risk score (ensemble
    /// mortality) and its group, high when the score is above the discovery median.
    /// </summary>
    /// <exception cref="MissingMarkersException">Some markers are not columns of the new matrix.</exception>
    public static LockedFollowUpScores ScoreFollowUp(LockedFollowUpPanel panel, FeatureMatrix newMatrix)
    {
        ArgumentNullException.ThrowIfNull(panel);
        ArgumentNullException.ThrowIfNull(newMatrix);
        var matrix = newMatrix.SelectFeatures(MapMarkers(panel.MarkerNames, newMatrix));
        var risk = Risk(panel, matrix);
        var high = new bool[risk.Length];
        for (int s = 0; s < risk.Length; s++) high[s] = panel.IsHighRisk(risk[s]);
        var warnings = ValueWarnings(panel.MarkerNames, panel.Markers, matrix, risk, m => Risk(panel, m), panel.IsHighRisk,
            "risk scores", "risk score");
        return new LockedFollowUpScores(matrix.SampleIds, risk, high, panel.RiskGroupCut, warnings);
    }

    /// <summary>Mean over trees of the leaf means, trees summed in order (so the result is the same bits every time).</summary>
    private static double[] Predict(LockedMeasuredPanel panel, FeatureMatrix matrix)
    {
        var predictions = new double[matrix.SampleCount];
        for (int s = 0; s < predictions.Length; s++)
        {
            double sum = 0;
            foreach (var tree in panel.Trees) sum += tree.Predict(matrix, s);
            predictions[s] = sum / panel.Trees.Count;
        }
        return predictions;
    }

    /// <summary>The ensemble mortality: mean over trees of the reached leaf's mortality (Ishwaran et al. 2008).</summary>
    private static double[] Risk(LockedFollowUpPanel panel, FeatureMatrix matrix)
    {
        var risk = new double[matrix.SampleCount];
        for (int s = 0; s < risk.Length; s++)
        {
            double sum = 0;
            foreach (var tree in panel.Trees) sum += tree.MortalityOf(matrix, s);
            risk[s] = sum / panel.Trees.Count;
        }
        return risk;
    }

    /// <summary>
    /// The scale checks of a panel that scores a number per sample, and for a marker measured in
    /// no sample, its effect: the mean shift of the score (and the group changes, when the score
    /// is cut into groups) with the marker set to its discovery median instead.
    /// </summary>
    private static List<ScaleWarning> ValueWarnings(IReadOnlyList<string> markerNames, IReadOnlyList<MarkerScale> discovery, FeatureMatrix matrix,
        double[] scores, Func<FeatureMatrix, double[]> score, Func<double, bool>? group, string plural, string singular)
    {
        var warnings = new List<ScaleWarning>();
        for (int m = 0; m < markerNames.Count; m++)
        {
            var current = MarkerScale.Describe(matrix, m);
            if (current.MeasuredCount > 0)
            {
                if (ScaleCheck(markerNames[m], discovery[m], current) is { } warning) warnings.Add(warning);
                continue;
            }
            if (discovery[m].MeasuredCount == 0 || double.IsNaN(discovery[m].Median)) continue;
            var imputed = score(AtDiscoveryMedian(matrix, m, discovery[m].Median));
            double shift = 0;
            int changed = 0;
            for (int s = 0; s < scores.Length; s++)
            {
                shift += Math.Abs(imputed[s] - scores[s]);
                if (group is not null && group(imputed[s]) != group(scores[s])) changed++;
            }
            int sampleCount = scores.Length;
            string groups = group is null ? "" : FormattableString.Invariant($"{changed} of {sampleCount} risk groups would change and ");
            var message = FormattableString.Invariant(
                $"{markerNames[m]} is {UnmeasuredState(current)} of the new cohort (discovery measured it in {1 - discovery[m].MissingShare - discovery[m].BelowDetectionShare:P0} of samples), so every sample takes the trees' missing-value branches for it and the {plural} rest on the other markers only. ")
                + FormattableString.Invariant(
                $"Set to its discovery median instead, {groups}the {singular} would move by {(sampleCount > 0 ? shift / sampleCount : 0):G4} on average. Measure it, or do not trust these scores.");
            warnings.Add(new ScaleWarning(markerNames[m], message) { Unmeasured = true });
        }
        return warnings;
    }

    private static int[] MapMarkers(IReadOnlyList<string> markerNames, FeatureMatrix newMatrix)
    {
        var byName = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int f = 0; f < newMatrix.FeatureCount; f++) byName.TryAdd(newMatrix.FeatureNames[f], f);
        var columns = new int[markerNames.Count];
        var missing = new List<string>();
        for (int m = 0; m < markerNames.Count; m++)
        {
            if (byName.TryGetValue(markerNames[m], out int column)) columns[m] = column;
            else missing.Add(markerNames[m]);
        }
        if (missing.Count > 0) throw new MissingMarkersException(missing, markerNames.Count);
        return columns;
    }
}
