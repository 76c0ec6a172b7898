using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Charts;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The values of one feature split by class, as a strip chart draws them: measured values, the
/// count of below-detection cells, the detection limit when the file gave one, and whether a log
/// axis can show every measured value. Missing cells are left out (they say nothing about the class).
/// </summary>
internal sealed class MarkerValues
{
    private MarkerValues(IReadOnlyList<StripGroup> groups, double detectionLimit, bool allPositive)
    {
        Groups = groups;
        DetectionLimit = detectionLimit;
        AllMeasuredPositive = allPositive;
    }

    public IReadOnlyList<StripGroup> Groups { get; }

    /// <summary>The largest stored limit of a below-detection cell; NaN when none was given.</summary>
    public double DetectionLimit { get; }

    /// <summary>True when every measured value is above zero, so a log axis loses nothing.</summary>
    public bool AllMeasuredPositive { get; }

    /// <param name="labelPoints">Label every point with its sample id and value (only when the user asked for sample ids).</param>
    public static MarkerValues Of(Panel panel, int feature, bool labelPoints = false)
    {
        var outcome = panel.Outcome;
        var matrix = panel.Matrix;
        var values = matrix.Column(feature);
        var states = matrix.HasUnmeasuredCells(feature) ? matrix.States(feature) : ReadOnlySpan<CellState>.Empty;
        var classes = outcome.SampleClasses;
        var measured = new List<double>[outcome.ClassCount];
        var belowDetection = new int[outcome.ClassCount];
        for (int c = 0; c < measured.Length; c++) measured[c] = new List<double>(outcome.ClassCounts[c]);
        var measuredLabels = labelPoints ? new List<string>[outcome.ClassCount] : null;
        var censoredLabels = labelPoints ? new List<string>[outcome.ClassCount] : null;
        for (int c = 0; labelPoints && c < measured.Length; c++)
        {
            measuredLabels![c] = [];
            censoredLabels![c] = [];
        }
        double limit = double.NaN;
        bool allPositive = true;
        int anyMeasured = 0;
        for (int sample = 0; sample < values.Length; sample++)
        {
            var state = states.IsEmpty ? CellState.Measured : states[sample];
            double value = values[sample];
            if (state == CellState.BelowDetection)
            {
                belowDetection[classes[sample]]++;
                censoredLabels?[classes[sample]].Add(matrix.SampleIds[sample] + ": below detection");
                // The stored value of a censored cell is its limit when the file gave one (FeatureMatrix).
                if (double.IsFinite(value) && !(value <= limit)) limit = value;
                continue;
            }
            if (state != CellState.Measured || !double.IsFinite(value)) continue;
            measured[classes[sample]].Add(value);
            measuredLabels?[classes[sample]].Add(matrix.SampleIds[sample] + ": " + value.ToString("G6", System.Globalization.CultureInfo.InvariantCulture));
            anyMeasured++;
            if (value <= 0) allPositive = false;
        }
        var groups = new StripGroup[outcome.ClassCount];
        for (int c = 0; c < groups.Length; c++)
            groups[c] = new StripGroup(outcome.ClassNames[c], measured[c], belowDetection[c],
                measuredLabels is null ? null : [.. measuredLabels[c], .. censoredLabels![c]]);
        return new MarkerValues(groups, limit, allPositive && anyMeasured > 0 && !(limit <= 0));
    }
}
