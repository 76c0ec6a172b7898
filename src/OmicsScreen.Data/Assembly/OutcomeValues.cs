using System.Globalization;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Text;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Reads outcome columns that are not classes: a measured quantity, and the follow-up time and
/// event of a time-to-event outcome; and decides when an outcome column holds a measurement.
/// </summary>
internal static class OutcomeValues
{
    /// <summary>More distinct values than this are needed before numbers read as a measurement.</summary>
    private const int MeasurementMinimumDistinct = 10;

    /// <summary>
    /// True when the column's non-missing cells are numbers (allowing a few typing slips, fewer
    /// than 1 in 20 samples, which are then reported one by one) and more than a quarter of the
    /// distinct values belong to a single sample: a continuous variable, not class labels. Few
    /// distinct numbers (0/1, stages 1-4) stay classes.
    /// </summary>
    public static bool LooksLikeMeasurement(IReadOnlyList<string> labels)
    {
        var counts = new Dictionary<double, int>();
        int numeric = 0, other = 0;
        foreach (var label in labels)
        {
            if (CellText.Classify(label, out _) == CellKind.Missing) continue;
            if (TryNumber(label, out double value))
            {
                numeric++;
                counts[value] = counts.GetValueOrDefault(value) + 1;
            }
            else other++;
        }
        if (numeric == 0 || other * 20 >= numeric + other) return false;
        int singletons = 0;
        foreach (int count in counts.Values)
            if (count == 1) singletons++;
        return IsMeasurement(counts.Count, singletons);
    }

    /// <summary>The same rule for labels already grouped into classes (all of which must be numbers).</summary>
    public static bool LooksLikeMeasurement(IReadOnlyList<string> classNames, ReadOnlySpan<int> classCounts)
    {
        int singletons = 0;
        for (int c = 0; c < classNames.Count; c++)
        {
            if (!TryNumber(classNames[c], out _)) return false;
            if (classCounts[c] == 1) singletons++;
        }
        return IsMeasurement(classNames.Count, singletons);
    }

    private static bool IsMeasurement(int distinctCount, int singletonCount) =>
        distinctCount > MeasurementMinimumDistinct && singletonCount * 4 > distinctCount;

    /// <summary>A measured outcome: every cell a finite number; a missing or non-numeric cell stops the load at its line.</summary>
    public static double[] Measured(SampleAttribute column, IReadOnlyList<string> sampleIds, bool isTableRow)
    {
        var values = new double[column.Values.Length];
        for (int i = 0; i < values.Length; i++)
        {
            string text = column.Values[i];
            if (CellText.Classify(text, out _) == CellKind.Missing)
                throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                    $"sample '{Display.Name(sampleIds[i])}' has no outcome value ('{Display.Name(text)}').",
                    "Fill in its value, or remove the sample from the matrix and the sample sheet.", isTableRow: isTableRow);
            if (!TryNumber(text, out values[i]))
                throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                    $"sample '{Display.Name(sampleIds[i])}' has the outcome '{Display.Name(text)}', which is not a number, in a measured outcome.",
                    "Write the value as a plain number with a decimal point (such as 61.5); if the outcome names classes, add --outcome-kind classes.",
                    isTableRow: isTableRow);
        }
        return values;
    }

    /// <summary>Follow-up times: numbers, not negative; zero is kept with a warning (an event or censoring on day 0 is often a data-entry slip).</summary>
    public static double[] Times(SampleAttribute column, IReadOnlyList<string> sampleIds, bool isTableRow,
        List<InspectionFinding> findings)
    {
        var times = new double[column.Values.Length];
        int zeros = 0;
        string? firstZero = null;
        for (int i = 0; i < times.Length; i++)
        {
            string text = column.Values[i];
            string sample = Display.Name(sampleIds[i]);
            if (CellText.Classify(text, out _) == CellKind.Missing)
                throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                    $"sample '{sample}' has no follow-up time ('{Display.Name(text)}').",
                    "Fill in the time from entry to the event or to the last contact, or remove the sample from the matrix and the sample sheet.",
                    isTableRow: isTableRow);
            if (!TryNumber(text, out times[i]))
                throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                    $"sample '{sample}' has the follow-up time '{Display.Name(text)}', which is not a number.",
                    "Write follow-up times as plain numbers in one unit (such as days or months), with a decimal point.",
                    isTableRow: isTableRow);
            if (times[i] < 0)
                throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                    FormattableString.Invariant($"sample '{sample}' has a negative follow-up time ({times[i]})."),
                    "Follow-up runs from entry to the event or last contact, so it cannot be negative: correct the dates it was computed from.",
                    isTableRow: isTableRow);
            if (times[i] == 0 && zeros++ == 0) firstZero = sample;
        }
        if (zeros > 0)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "zero-follow-up", FormattableString.Invariant(
                $"{zeros} samples have a follow-up time of 0 in '{column.Name}' (the first is '{firstZero}'); they are kept, but check that the event or last contact did not happen on the day of entry by mistake.")));
        return times;
    }

    /// <summary>Event codes 1/0, true/false, yes/no (any case); anything else stops the load, listing the codes found.</summary>
    public static bool[] Events(SampleAttribute column, IReadOnlyList<string> sampleIds, bool isTableRow)
    {
        var events = new bool[column.Values.Length];
        for (int i = 0; i < events.Length; i++)
        {
            switch (column.Values[i].Trim().ToLowerInvariant())
            {
                case "1" or "true" or "yes":
                    events[i] = true;
                    break;
                case "0" or "false" or "no":
                    events[i] = false;
                    break;
                default:
                    var found = column.Values.Select(v => v.Trim()).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList();
                    throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                        $"sample '{Display.Name(sampleIds[i])}' has the event code '{Display.Name(column.Values[i])}'; the column holds the codes {Display.List(found, 12)}.",
                        "Code each sample 1 (the event was observed) or 0 (censored: followed without the event); true/false and yes/no are read too.",
                        isTableRow: isTableRow);
            }
        }
        return events;
    }

    internal static bool TryNumber(string text, out double value) =>
        double.TryParse(text.AsSpan().Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out value) && double.IsFinite(value);

    private static long? Line(SampleAttribute column, int sample) =>
        column.Lines[sample] > 0 ? column.Lines[sample] : null;
}
