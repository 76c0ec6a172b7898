using System.Globalization;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// Prints the calibration suite's results as markdown (so they paste into the README): the table
/// of shapes and designs, the goals of issue 12 as PASS/FAIL lines, and the uniformity of the
/// screen's p-values on features unrelated to the outcome.
/// </summary>
public static class CalibrationReport
{
    /// <summary>The null goal is judged on at least this many null panels (8 shapes x 5 seeds).</summary>
    public const int MinimumNullPanels = 40;

    public const double NullShortlistShareGoal = 0.10;
    public const double FalseDiscoveryProportionGoal = 0.10;
    public const double DecoyAgreementGoal = 0.05;
    public const double RecallRatioGoal = 0.90;
    public const double MeanEstimateErrorGoal = 0.03;
    public const double DesignEstimateErrorGoal = 0.05;
    public const double NullEstimateGoal = 0.53;

    /// <summary>
    /// The class panels' table, goals and uniformity (issue 12), then one section per other outcome
    /// kind run (<see cref="OutcomeKindCalibrationReport"/>), so a class-only run prints what it always did.
    /// </summary>
    public static void Write(IReadOnlyList<PanelCalibration> panels, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(panels);
        ArgumentNullException.ThrowIfNull(output);
        var classPanels = panels.Where(p => p.Kind == OutcomeKind.Classes).ToList();
        if (classPanels.Count > 0) WriteClasses(classPanels, output);
        foreach (var kind in new[] { OutcomeKind.Measured, OutcomeKind.TimeToEvent })
        {
            var kindPanels = panels.Where(p => p.Kind == kind).ToList();
            if (kindPanels.Count == 0) continue;
            if (classPanels.Count > 0 || kind == OutcomeKind.TimeToEvent && panels.Any(p => p.Kind == OutcomeKind.Measured)) output.WriteLine();
            OutcomeKindCalibrationReport.Write(kind, kindPanels, output);
        }
    }

    private static void WriteClasses(IReadOnlyList<PanelCalibration> panels, TextWriter output)
    {
        var summaries = panels.GroupBy(p => p.Design).Select(g => DesignSummary.From(g.Key, g.ToList())).ToList();
        WriteTable(summaries, output);
        output.WriteLine();
        WriteGoals(panels, summaries, output);
        output.WriteLine();
        WriteUniformity(panels, output);
    }

    private static void WriteTable(IReadOnlyList<DesignSummary> summaries, TextWriter output)
    {
        output.WriteLine("| shape or design | panels | non-empty shortlist | mean shortlist | mean FDP | mean decoy estimate | true found: ours / baseline (ratio) | interaction found: ours / baseline | threshold found: ours / baseline | no locked panel | mean selection-aware | mean fresh | mean abs. difference | max abs. difference |");
        output.WriteLine("| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
        foreach (var s in summaries)
        {
            string name = s.ClassCount > 2 ? s.Design + " (accuracy)" : s.Design;
            string recall = s.IsNull ? "-" : Invariant($"{s.MeanTrueDiscoveries:F1} / {s.MeanBaselineTrueDiscoveries:F1} ({Number(s.RecallRatio, "F2")})");
            string pair = s.PairPanels == 0 ? "-" : Invariant($"{s.PairFound}/{s.PairPanels} / {s.BaselinePairFound}/{s.PairPanels}");
            string threshold = s.ThresholdPanels == 0 ? "-" : Invariant($"{s.ThresholdFound}/{s.ThresholdPanels} / {s.BaselineThresholdFound}/{s.ThresholdPanels}");
            output.WriteLine(Invariant(
                $"| {name} | {s.Panels} | {(s.IsNull ? Number(s.NonEmptyShare, "P0") : "-")} | {s.MeanShortlisted:F1} | {s.MeanFalseDiscoveryProportion:F3} | {Number(s.MeanDecoyEstimate, "F3")} | {recall} | {pair} | {threshold} | {s.NoLockedPanel} | {Number(s.MeanSelectionAware, "F3")} | {Number(s.MeanFresh, "F3")} | {Number(s.MeanEstimateError, "F3")} | {Number(s.MaxEstimateError, "F3")} |"));
        }
        output.WriteLine();
        output.WriteLine("FDP = false / max(1, shortlisted); on null panels every shortlisted feature is false. Baseline: Mann-Whitney per feature (Kruskal-Wallis for three classes) with Benjamini-Hochberg at 0.10. Ratio = our true discoveries / the baseline's, summed over panels. Selection-aware = `LockedPanelEstimate` of the locked panel; fresh = the locked panel's AUC on 2,000 new samples of the same model (accuracy for three classes).");
    }

    private static void WriteGoals(IReadOnlyList<PanelCalibration> panels, IReadOnlyList<DesignSummary> summaries, TextWriter output)
    {
        output.WriteLine("Goals of issue 12:");
        output.WriteLine();
        var nulls = panels.Where(p => p.IsNull).ToList();
        var planted = panels.Where(p => !p.IsNull).ToList();

        if (nulls.Count == 0) Goal(output, null, "null panels: non-empty shortlist in at most 10%", "no null panel run");
        else
        {
            double share = nulls.Count(p => p.Shortlisted > 0) / (double)nulls.Count;
            string detail = Invariant($"{nulls.Count(p => p.Shortlisted > 0)} of {nulls.Count} null panels ({share:P1})");
            if (nulls.Count < MinimumNullPanels)
                output.WriteLine(Invariant($"- INCONCLUSIVE: null panels: non-empty shortlist in at most 10%: {detail}; the goal needs at least {MinimumNullPanels} null panels"));
            else Goal(output, share <= NullShortlistShareGoal, "null panels: non-empty shortlist in at most 10%", detail);
        }

        if (planted.Count == 0)
        {
            Goal(output, null, "planted designs", "no planted panel run");
        }
        else
        {
            double fdp = planted.Average(p => p.FalseDiscoveryProportion);
            Goal(output, fdp <= FalseDiscoveryProportionGoal, "planted: mean FDP <= 0.10", Invariant($"mean FDP {fdp:F3} over {Panels(planted.Count)}"));

            var withDecoys = planted.Where(p => double.IsFinite(p.DecoyEstimate)).ToList();
            if (withDecoys.Count == 0) Goal(output, null, "planted: mean decoy estimate within 0.05 of mean FDP", "no decoy estimate");
            else
            {
                double decoy = withDecoys.Average(p => p.DecoyEstimate), trueFdp = withDecoys.Average(p => p.FalseDiscoveryProportion);
                Goal(output, Math.Abs(decoy - trueFdp) <= DecoyAgreementGoal, "planted: mean decoy estimate within 0.05 of mean FDP",
                    Invariant($"decoy {decoy:F3} vs FDP {trueFdp:F3} over {Panels(withDecoys.Count)}"));
            }

            double ours = planted.Sum(p => p.TrueDiscoveries), baseline = planted.Sum(p => p.BaselineTrueDiscoveries);
            if (baseline == 0) Goal(output, null, "planted: recall >= 90% of the baseline's", "the baseline found no true feature");
            else Goal(output, ours / baseline >= RecallRatioGoal, "planted: recall >= 90% of the baseline's",
                Invariant($"{ours:F0} true discoveries vs the baseline's {baseline:F0} (ratio {ours / baseline:F2})"));

            var pairs = planted.Where(p => p.PairFound is not null).ToList();
            if (pairs.Count > 0) Goal(output, pairs.All(p => p.PairFound == true), "planted: interacting pair found (both members) in every panel",
                Invariant($"{pairs.Count(p => p.PairFound == true)} of {pairs.Count}; baseline {pairs.Count(p => p.BaselinePairFound == true)} of {pairs.Count}"));
            if (pairs.Count > 0)
            {
                // Partner rates (information, no goal): how often the planted pair is named as
                // partners, and how often a shortlisted marker names a false partner.
                int links = pairs.Sum(p => p.PartnerLinks), falseLinks = pairs.Sum(p => p.FalsePartnerLinks);
                output.WriteLine(Invariant($"- (information) planted: forest partners on the interaction design: planted pair named in {pairs.Count(p => p.PairNamedAsPartners == true)} of {pairs.Count} panels ({pairs.Count(p => p.PairNamedAsPartners == true && p.PairFound == true)} of the {pairs.Count(p => p.PairFound == true)} with both shortlisted); a false partner named in {pairs.Count(p => p.FalsePartnerLinks > 0)} of {pairs.Count} panels ({falseLinks} of {links} partner links)"));
            }
            var thresholds = planted.Where(p => p.ThresholdFound is not null).ToList();
            if (thresholds.Count > 0) Goal(output, thresholds.All(p => p.ThresholdFound == true), "planted: threshold marker found in every panel",
                Invariant($"{thresholds.Count(p => p.ThresholdFound == true)} of {thresholds.Count}; baseline {thresholds.Count(p => p.BaselineThresholdFound == true)} of {thresholds.Count}"));
        }

        // The selection-aware estimate is a cross-validated AUC on the discovery samples: even
        // unbiased, it differs from the locked panel's true AUC by its sampling error. So the goal
        // "within 0.03 on average" is judged on the mean signed difference (the bias), and the mean
        // absolute difference is printed beside the floor an unbiased estimate with the measured
        // sampling error would reach: E|N(0, se)| = se sqrt(2 / pi).
        var binaryPairs = panels.Where(p => p.ClassCount == 2 && p.HasEstimatePair).ToList();
        if (binaryPairs.Count == 0) Goal(output, null, "locked panel: mean signed difference (selection-aware - fresh AUC) within 0.03", "no locked two-class panel with both estimates");
        else
        {
            double error = binaryPairs.Average(p => p.EstimateError);
            double bias = binaryPairs.Average(p => p.EstimateDifference);
            Goal(output, Math.Abs(bias) <= MeanEstimateErrorGoal, "locked panel: mean signed difference (selection-aware - fresh AUC) within 0.03",
                Invariant($"{bias:+0.000;-0.000} over {Panels(binaryPairs.Count)}"));
            output.WriteLine(Invariant($"- (information) locked panel: mean |selection-aware - fresh AUC| {error:F3}; an unbiased estimate with the measured sampling error would reach {NoiseFloor(binaryPairs):F3} (mean DeLong SE {Mean(binaryPairs.Select(p => p.EstimateStandardError)):F3})"));
        }
        foreach (var s in summaries.Where(s => !s.IsNull))
        {
            var designPairs = binaryPairs.Where(p => p.Design == s.Design).ToList();
            if (designPairs.Count == 0) Goal(output, null, $"locked panel on {s.Design}: mean signed difference within 0.05", "no panel with both estimates");
            else
            {
                double bias = designPairs.Average(p => p.EstimateDifference);
                Goal(output, Math.Abs(bias) <= DesignEstimateErrorGoal, $"locked panel on {s.Design}: mean signed difference within 0.05",
                    Invariant($"{bias:+0.000;-0.000} over {Panels(designPairs.Count)}; mean |difference| {s.MeanEstimateError:F3} (max {s.MaxEstimateError:F3}), unbiased floor {NoiseFloor(designPairs):F3}"));
            }
        }

        var nullLocked = panels.Where(p => p.IsNull && p.ClassCount == 2 && p.LockedPanelSize > 0 && double.IsFinite(p.SelectionAwareEstimate)).ToList();
        int nullTwoClass = panels.Count(p => p.IsNull && p.ClassCount == 2);
        if (nullLocked.Count == 0)
            Goal(output, nullTwoClass == 0 ? null : true, "null panels: mean selection-aware AUC <= 0.53 where a panel is locked",
                Invariant($"no two-class null panel locked a panel ({nullTwoClass} run)"));
        else
        {
            double mean = nullLocked.Average(p => p.SelectionAwareEstimate);
            Goal(output, mean <= NullEstimateGoal, "null panels: mean selection-aware AUC <= 0.53 where a panel is locked",
                Invariant($"{mean:F3} over {nullLocked.Count} of {nullTwoClass} two-class null panels"));
        }
    }

    /// <summary>sqrt(2 / pi) times the mean standard error: the mean |difference| of an unbiased normal estimate.</summary>
    private static double NoiseFloor(IEnumerable<PanelCalibration> panels) => Math.Sqrt(2 / Math.PI) * Mean(panels.Select(p => p.EstimateStandardError));

    private static double Mean(IEnumerable<double> values)
    {
        var finite = values.Where(double.IsFinite).ToList();
        return finite.Count == 0 ? double.NaN : finite.Average();
    }

    internal static void WriteUniformity(IReadOnlyList<PanelCalibration> panels, TextWriter output)
    {
        output.WriteLine("Uniformity of the screen's p-values (`Features[i].PValue`) on features unrelated to the outcome, pooled over seeds:");
        output.WriteLine();
        output.WriteLine("| shape or design | null p-values | KS distance to U(0,1) | 5% critical value if independent | median p | share p <= 0.01 | share p <= 0.001 |");
        output.WriteLine("| --- | ---: | ---: | ---: | ---: | ---: | ---: |");
        foreach (var group in panels.GroupBy(p => p.Design))
        {
            var pValues = group.SelectMany(p => p.NullFeaturePValues).ToList();
            int tested = pValues.Count(p => !double.IsNaN(p));
            output.WriteLine(Invariant(
                $"| {group.Key} | {tested} | {Number(PValueUniformity.KolmogorovSmirnovDistance(pValues), "F3")} | {(tested == 0 ? "-" : Number(PValueUniformity.CriticalDistance(tested), "F3"))} | {Number(PValueUniformity.Median(pValues), "F3")} | {Number(PValueUniformity.ShareAtOrBelow(pValues, 0.01), "F4")} | {Number(PValueUniformity.ShareAtOrBelow(pValues, 0.001), "F4")} |"));
        }
        output.WriteLine();
        output.WriteLine("Under a valid null the median is about 0.5 and the shares about 0.01 and 0.001; a median well above 0.5 with a large distance means p-values piled near 1 (a conservative null, which costs power), shares above the levels a liberal one (false discoveries). Features in correlated blocks are not independent, so a pooled distance may exceed the critical value without the p-values being wrong; a distance well above it, or a share of small p-values above the level, is a miscalibrated null.");
    }

    /// <summary>One goal line; <paramref name="passed"/> null means the goal could not be judged on this run.</summary>
    private static void Goal(TextWriter output, bool? passed, string goal, string detail)
    {
        string status = passed switch { true => "PASS", false => "FAIL", null => "NOT RUN" };
        output.WriteLine($"- {status}: {goal}: {detail}");
    }

    private static string Panels(int count) => count == 1 ? "1 panel" : count.ToString(CultureInfo.InvariantCulture) + " panels";

    private static string Number(double value, string format) =>
        double.IsNaN(value) ? "n/a" : value.ToString(format, CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
