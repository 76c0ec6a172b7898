using System.Globalization;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The calibration of a measured-outcome or follow-up screen (issues 17, 18) as markdown: a table
/// of shapes and designs, the goals as PASS/FAIL lines, and the uniformity of the screen's
/// p-values on features unrelated to the outcome.
/// </summary>
/// <remarks>
/// Goals (the brief of the calibration work for these kinds): null panels non-empty in at most
/// 10%; on planted panels the mean false discovery proportion and the mean decoy estimate at most
/// the level 0.10; at least as many true markers found as the univariate baseline (Benjamini-Hochberg
/// at 0.10 on the Spearman or Cox score p-values); the mean signed difference of the locked panel's
/// selection-aware estimate (R^2 or Harrell's C) from its score on a fresh cohort within 0.05.
/// </remarks>
public static class OutcomeKindCalibrationReport
{
    public const double NullShortlistShareGoal = 0.10;
    public const double Level = 0.10;
    public const double EstimateDifferenceGoal = 0.05;

    public static void Write(OutcomeKind kind, IReadOnlyList<PanelCalibration> panels, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(panels);
        ArgumentNullException.ThrowIfNull(output);
        if (kind == OutcomeKind.Classes) throw new ArgumentException("Class panels are reported by CalibrationReport.");
        string measure = kind == OutcomeKind.Measured ? "R²" : "C";
        string title = kind == OutcomeKind.Measured ? "Measured outcome" : "Censored follow-up";
        output.WriteLine($"## {title} (selection-aware and fresh {measure})");
        output.WriteLine();
        WriteTable(kind, panels, measure, output);
        output.WriteLine();
        WriteGoals(panels, measure, output);
        output.WriteLine();
        CalibrationReport.WriteUniformity(panels, output);
    }

    private static void WriteTable(OutcomeKind kind, IReadOnlyList<PanelCalibration> panels, string measure, TextWriter output)
    {
        string events = kind == OutcomeKind.TimeToEvent ? " mean event share |" : "";
        string eventsRule = kind == OutcomeKind.TimeToEvent ? " ---: |" : "";
        output.WriteLine($"| shape or design | panels |{events} non-empty shortlist | mean shortlist | mean FDP | mean decoy estimate | true found: ours / baseline (ratio) | threshold found: ours / baseline | no locked panel | curve folds without a panel | mean selection-aware {measure} | mean fresh {measure} | mean signed difference | mean abs. difference | max abs. difference |");
        output.WriteLine($"| --- | ---: |{eventsRule} ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
        foreach (var group in panels.GroupBy(p => p.Design))
        {
            var list = group.ToList();
            var s = DesignSummary.From(group.Key, list);
            string eventShare = kind == OutcomeKind.TimeToEvent ? " " + Number(Mean(list.Select(p => p.EventShare)), "F2") + " |" : "";
            string recall = s.IsNull ? "-" : Invariant($"{s.MeanTrueDiscoveries:F1} / {s.MeanBaselineTrueDiscoveries:F1} ({Number(s.RecallRatio, "F2")})");
            string threshold = s.ThresholdPanels == 0 ? "-" : Invariant($"{s.ThresholdFound}/{s.ThresholdPanels} / {s.BaselineThresholdFound}/{s.ThresholdPanels}");
            double signed = Mean(list.Where(p => p.HasEstimatePair).Select(p => p.EstimateDifference));
            var curves = list.Where(p => p.CurveFolds > 0).ToList();
            string foldsWithout = curves.Count == 0 ? "-" : Invariant($"{curves.Sum(p => p.FoldsWithoutPanel)} of {curves.Sum(p => p.CurveFolds)}");
            output.WriteLine(Invariant(
                $"| {s.Design} | {s.Panels} |{eventShare} {(s.IsNull ? Number(s.NonEmptyShare, "P0") : "-")} | {s.MeanShortlisted:F1} | {s.MeanFalseDiscoveryProportion:F3} | {Number(s.MeanDecoyEstimate, "F3")} | {recall} | {threshold} | {s.NoLockedPanel} | {foldsWithout} | {Number(s.MeanSelectionAware, "F3")} | {Number(s.MeanFresh, "F3")} | {Signed(signed)} | {Number(s.MeanEstimateError, "F3")} | {Number(s.MaxEstimateError, "F3")} |"));
        }
        output.WriteLine();
        output.WriteLine(Invariant($"FDP = false / max(1, shortlisted); on null panels every shortlisted feature is false. Baseline: {(kind == OutcomeKind.Measured ? "Spearman's test" : "the Cox score test on the feature's ranks")} per feature with Benjamini-Hochberg at 0.10. Ratio = our true discoveries / the baseline's, summed over panels. Selection-aware = `LockedPanelEstimate` of the locked panel; fresh = {(kind == OutcomeKind.Measured ? "R² (SST about the fresh mean)" : "Harrell's C")} on {CalibrationSettings.FreshCohortSize:N0} new samples of the same model of a forest on the locked markers grown on the discovery panel with the screen's forest options. Signed difference = selection-aware - fresh, over panels with both. A curve fold whose inner screen locks nothing scores as chance (R² of the training mean, C = 0.5) in the selection-aware estimate."));
    }

    private static void WriteGoals(IReadOnlyList<PanelCalibration> panels, string measure, TextWriter output)
    {
        output.WriteLine("Goals:");
        output.WriteLine();
        var nulls = panels.Where(p => p.IsNull).ToList();
        var planted = panels.Where(p => !p.IsNull).ToList();
        if (nulls.Count == 0) Goal(output, null, "null panels: non-empty shortlist in at most 10%", "no null panel run");
        else
        {
            int nonEmpty = nulls.Count(p => p.Shortlisted > 0);
            double share = nonEmpty / (double)nulls.Count;
            // The binomial SE of a 10% share over m panels is sqrt(0.09 / m): 0.067 over 20 panels.
            Goal(output, share <= NullShortlistShareGoal, "null panels: non-empty shortlist in at most 10%",
                Invariant($"{nonEmpty} of {nulls.Count} null panels ({share:P1}; binomial SE of a true 10% over {nulls.Count} panels {Math.Sqrt(0.09 / nulls.Count):F3})"));
        }

        if (planted.Count == 0)
        {
            Goal(output, null, "planted designs", "no planted panel run");
        }
        else
        {
            double fdp = planted.Average(p => p.FalseDiscoveryProportion);
            Goal(output, fdp <= Level, "planted: mean FDP <= 0.10", Invariant($"mean FDP {fdp:F3} over {Panels(planted.Count)}"));
            var withDecoys = planted.Where(p => double.IsFinite(p.DecoyEstimate)).ToList();
            if (withDecoys.Count == 0) Goal(output, null, "planted: mean decoy estimate <= 0.10", "no decoy estimate");
            else
            {
                double decoy = withDecoys.Average(p => p.DecoyEstimate);
                Goal(output, decoy <= Level, "planted: mean decoy estimate <= 0.10",
                    Invariant($"decoy estimate {decoy:F3} (true FDP {withDecoys.Average(p => p.FalseDiscoveryProportion):F3}) over {Panels(withDecoys.Count)}"));
            }
            double ours = planted.Sum(p => p.TrueDiscoveries), baseline = planted.Sum(p => p.BaselineTrueDiscoveries);
            Goal(output, ours >= baseline, "planted: true markers found at least the baseline's",
                Invariant($"{ours:F0} true discoveries vs the baseline's {baseline:F0}{(baseline > 0 ? $" (ratio {ours / baseline:F2})" : "")}"));
            var thresholds = planted.Where(p => p.ThresholdFound is not null).ToList();
            if (thresholds.Count > 0)
                output.WriteLine(Invariant($"- (information) planted: threshold marker found in {thresholds.Count(p => p.ThresholdFound == true)} of {thresholds.Count}; baseline {thresholds.Count(p => p.BaselineThresholdFound == true)} of {thresholds.Count}"));

            var pairs = planted.Where(p => p.HasEstimatePair).ToList();
            if (pairs.Count == 0) Goal(output, null, $"locked panel: mean signed difference (selection-aware - fresh {measure}) within 0.05", "no planted panel with both estimates");
            else
            {
                double bias = pairs.Average(p => p.EstimateDifference);
                Goal(output, Math.Abs(bias) <= EstimateDifferenceGoal, $"locked panel: mean signed difference (selection-aware - fresh {measure}) within 0.05",
                    Invariant($"{Signed(bias)} over {Panels(pairs.Count)} (selection-aware {pairs.Average(p => p.SelectionAwareEstimate):F3} vs fresh {pairs.Average(p => p.FreshEstimate):F3}); mean |difference| {pairs.Average(p => p.EstimateError):F3}, max {pairs.Max(p => p.EstimateError):F3}"));
            }
        }

        var nullLocked = nulls.Where(p => p.HasEstimatePair).ToList();
        if (nullLocked.Count > 0)
            output.WriteLine(Invariant($"- (information) null panels that locked a panel: {nullLocked.Count}; selection-aware {measure} {nullLocked.Average(p => p.SelectionAwareEstimate):F3} vs fresh {nullLocked.Average(p => p.FreshEstimate):F3} (chance: {(measure == "C" ? "0.5" : "0 or below")})"));
    }

    private static void Goal(TextWriter output, bool? passed, string goal, string detail)
    {
        string status = passed switch { true => "PASS", false => "FAIL", null => "NOT RUN" };
        output.WriteLine($"- {status}: {goal}: {detail}");
    }

    private static double Mean(IEnumerable<double> values)
    {
        var finite = values.Where(double.IsFinite).ToList();
        return finite.Count == 0 ? double.NaN : finite.Average();
    }

    private static string Panels(int count) => count == 1 ? "1 panel" : count.ToString(CultureInfo.InvariantCulture) + " panels";

    private static string Signed(double value) => double.IsNaN(value) ? "n/a" : value.ToString("+0.000;-0.000", CultureInfo.InvariantCulture);

    private static string Number(double value, string format) =>
        double.IsNaN(value) ? "n/a" : value.ToString(format, CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
