using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>The TSV tables of `omicsscreen apply`.</summary>
public static class ApplyTables
{
    /// <summary>
    /// sample_id, probability_&lt;class&gt; per class (round-trip digits, so the file holds exactly
    /// what was computed), called_class, and the known class when there is one.
    /// </summary>
    public static void WriteScores(TextWriter writer, LockedPanelScores scores, IReadOnlyList<string>? knownClasses)
    {
        var columns = new List<TsvColumn<int>> { TsvColumn<int>.Text("sample_id", s => scores.SampleIds[s]) };
        for (int c = 0; c < scores.ClassCount; c++)
        {
            int classCode = c;
            columns.Add(TsvColumn<int>.Number("probability_" + scores.ClassNames[c], s => scores.Probability(s, classCode), NumberFormat.RoundTrip));
        }
        columns.Add(TsvColumn<int>.Text("called_class", s => scores.ClassNames[scores.PredictedClasses[s]]));
        if (knownClasses is not null) columns.Add(TsvColumn<int>.Text("known_class", s => knownClasses[s]));
        new TsvTableWriter<int>(columns).Write(writer, Enumerable.Range(0, scores.SampleCount));
    }

    /// <summary>One row per known class: how many of its samples were called each class.</summary>
    public static void WriteConfusion(TextWriter writer, LockedPanelPerformance performance)
    {
        var columns = new List<TsvColumn<int>> { TsvColumn<int>.Text("known_class", c => performance.ClassNames[c]) };
        for (int called = 0; called < performance.ClassNames.Count; called++)
        {
            int calledClass = called;
            columns.Add(TsvColumn<int>.Integer("called_" + performance.ClassNames[called], c => performance.Confusion[c][calledClass]));
        }
        new TsvTableWriter<int>(columns).Write(writer, Enumerable.Range(0, performance.ClassNames.Count));
    }

    public static void WriteCalibration(TextWriter writer, LockedPanelPerformance performance)
    {
        var columns = new List<TsvColumn<CalibrationBin>>
        {
            TsvColumn<CalibrationBin>.Number("lowest_predicted", b => b.LowestPredicted, NumberFormat.Significant(6)),
            TsvColumn<CalibrationBin>.Number("highest_predicted", b => b.HighestPredicted, NumberFormat.Significant(6)),
            TsvColumn<CalibrationBin>.Number("mean_predicted", b => b.MeanPredicted, NumberFormat.Significant(6)),
            TsvColumn<CalibrationBin>.Number("observed_positive_rate", b => b.ObservedPositiveRate, NumberFormat.Significant(6)),
            TsvColumn<CalibrationBin>.Integer("samples", b => b.SampleCount),
        };
        new TsvTableWriter<CalibrationBin>(columns).Write(writer, performance.Calibration);
    }
}
