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
        var columns = MapMarkers(panel, newMatrix);
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
        var columns = new float[matrix.FeatureCount][];
        var states = new CellState[]?[matrix.FeatureCount];
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            columns[f] = matrix.Column(f).ToArray();
            states[f] = matrix.HasUnmeasuredCells(f) ? matrix.States(f).ToArray() : null;
        }
        Array.Fill(columns[marker], (float)discovery.Median);
        states[marker] = null;
        var atMedian = new FeatureMatrix(matrix.FeatureNames, matrix.SampleIds, columns, states);
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
        // Shares are counts over the sample count, so "none of the other kind" is the exact test.
        string state = current.MissingShare == 0 ? "below the detection limit in every sample"
            : current.BelowDetectionShare == 0 ? "missing in every sample"
            : FormattableString.Invariant($"unmeasured in every sample ({current.MissingShare:P0} missing, {current.BelowDetectionShare:P0} below detection)");
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

    private static int[] MapMarkers(LockedPanel panel, FeatureMatrix newMatrix)
    {
        var byName = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int f = 0; f < newMatrix.FeatureCount; f++) byName.TryAdd(newMatrix.FeatureNames[f], f);
        var columns = new int[panel.MarkerCount];
        var missing = new List<string>();
        for (int m = 0; m < panel.MarkerCount; m++)
        {
            if (byName.TryGetValue(panel.MarkerNames[m], out int column)) columns[m] = column;
            else missing.Add(panel.MarkerNames[m]);
        }
        if (missing.Count > 0) throw new MissingMarkersException(missing, panel.MarkerCount);
        return columns;
    }
}
