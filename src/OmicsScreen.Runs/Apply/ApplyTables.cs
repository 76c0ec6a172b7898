using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Statistics.Survival;

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

    /// <summary>sample_id, predicted (round-trip digits), and the known value when there is one.</summary>
    public static void WriteMeasuredScores(TextWriter writer, LockedMeasuredScores scores, IReadOnlyList<double>? observed)
    {
        var columns = new List<TsvColumn<int>>
        {
            TsvColumn<int>.Text("sample_id", s => scores.SampleIds[s]),
            TsvColumn<int>.Number("predicted", s => scores.Predictions[s], NumberFormat.RoundTrip),
        };
        if (observed is not null) columns.Add(TsvColumn<int>.Number("observed", s => observed[s], NumberFormat.RoundTrip));
        new TsvTableWriter<int>(columns).Write(writer, Enumerable.Range(0, scores.SampleCount));
    }

    /// <summary>Groups of samples by rank of prediction: their range, mean prediction and mean observed outcome.</summary>
    public static void WriteMeasuredCalibration(TextWriter writer, LockedMeasuredPerformance performance)
    {
        var columns = new List<TsvColumn<MeasuredCalibrationBin>>
        {
            TsvColumn<MeasuredCalibrationBin>.Number("lowest_predicted", b => b.LowestPredicted, NumberFormat.Significant(6)),
            TsvColumn<MeasuredCalibrationBin>.Number("highest_predicted", b => b.HighestPredicted, NumberFormat.Significant(6)),
            TsvColumn<MeasuredCalibrationBin>.Number("mean_predicted", b => b.MeanPredicted, NumberFormat.Significant(6)),
            TsvColumn<MeasuredCalibrationBin>.Number("mean_observed", b => b.MeanObserved, NumberFormat.Significant(6)),
            TsvColumn<MeasuredCalibrationBin>.Integer("samples", b => b.SampleCount),
        };
        new TsvTableWriter<MeasuredCalibrationBin>(columns).Write(writer, performance.Groups);
    }

    /// <summary>
    /// sample_id, risk_score (round-trip digits), risk_group (high above the discovery median,
    /// else low), and the known follow-up time and event (1/0) when there are.
    /// </summary>
    public static void WriteFollowUpScores(TextWriter writer, LockedFollowUpScores scores, IReadOnlyList<double>? times, IReadOnlyList<bool>? events)
    {
        var columns = new List<TsvColumn<int>>
        {
            TsvColumn<int>.Text("sample_id", s => scores.SampleIds[s]),
            TsvColumn<int>.Number("risk_score", s => scores.RiskScores[s], NumberFormat.RoundTrip),
            TsvColumn<int>.Text("risk_group", s => scores.HighRisk[s] ? "high" : "low"),
        };
        if (times is not null && events is not null)
        {
            columns.Add(TsvColumn<int>.Number("follow_up_time", s => times[s], NumberFormat.RoundTrip));
            columns.Add(TsvColumn<int>.Integer("event", s => events[s] ? 1 : 0));
        }
        new TsvTableWriter<int>(columns).Write(writer, Enumerable.Range(0, scores.SampleCount));
    }

    /// <summary>The Kaplan-Meier curve of each risk group at its event times: group, time, at_risk, events, survival, greenwood_se.</summary>
    public static void WriteRiskGroupCurves(TextWriter writer, LockedFollowUpPerformance performance)
    {
        var rows = new List<(string Group, SurvivalCurve Curve, int Index)>();
        foreach (var (group, curve) in new[] { ("low", performance.LowRisk), ("high", performance.HighRisk) })
            if (curve is not null)
                for (int i = 0; i < curve.Time.Length; i++) rows.Add((group, curve, i));
        var columns = new List<TsvColumn<(string Group, SurvivalCurve Curve, int Index)>>
        {
            TsvColumn<(string Group, SurvivalCurve Curve, int Index)>.Text("risk_group", r => r.Group),
            TsvColumn<(string Group, SurvivalCurve Curve, int Index)>.Number("time", r => r.Curve.Time[r.Index], NumberFormat.RoundTrip),
            TsvColumn<(string Group, SurvivalCurve Curve, int Index)>.Integer("at_risk", r => r.Curve.AtRisk[r.Index]),
            TsvColumn<(string Group, SurvivalCurve Curve, int Index)>.Integer("events", r => r.Curve.Events[r.Index]),
            TsvColumn<(string Group, SurvivalCurve Curve, int Index)>.Number("survival", r => r.Curve.Survival[r.Index], NumberFormat.Significant(6)),
            TsvColumn<(string Group, SurvivalCurve Curve, int Index)>.Number("greenwood_se", r => r.Curve.GreenwoodError[r.Index], NumberFormat.Significant(6)),
        };
        new TsvTableWriter<(string Group, SurvivalCurve Curve, int Index)>(columns).Write(writer, rows);
    }
}
