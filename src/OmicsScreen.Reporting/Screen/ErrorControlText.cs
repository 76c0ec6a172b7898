using System.Globalization;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// What the error control promises, in plain words, shared by the console summary and the report
/// so both say the same thing: the expected number of false markers on the list and how it was
/// estimated, the rule that cut the list, how stable a list of that length is, and what was locked.
/// </summary>
public static class ErrorControlText
{
    /// <summary>The headline: how many markers on this list are expected to be false, and how that is known.</summary>
    public static string Headline(ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var decoys = result.Decoys;
        int listed = result.Shortlist.Count;
        var options = result.Settings.Options;
        if (decoys.DecoyCount == 0)
            return "No decoys were grown (--decoys 0), so there is no estimate of how many listed markers are false; "
                + (options.OutcomePermutations > 0
                    ? Invariant($"the p-values come from {options.OutcomePermutations} outcome permutations (Altmann et al. 2010).")
                    : "the p-values come from the mirrored non-positive importances (Janitza et al. 2018), which understate a null marker's upper tail: treat the q-values as approximate.");
        if (listed == 0)
            return Invariant($"No marker passed the rule, so no false marker is on the list; {decoys.DecoyCount} decoys (copies of real markers permuted once per run) were screened beside the real ones.");
        string bound = double.IsNaN(decoys.FalseDiscoveryBound) ? "" : Invariant($", and at most {Percent(decoys.FalseDiscoveryBound)} with the +1 correction of Barber & Candès (2015)");
        return Invariant($"Expected false markers on this list of {listed}: about {decoys.ExpectedFalseMarkers:0.#} ({Percent(decoys.EstimatedFalseDiscoveryRate)} of the list{bound}). ")
            + Invariant($"Estimated from decoys: {decoys.DecoyCount} copies of real markers, each permuted once per run and screened beside them; {decoys.DecoysPassing} passed the same rule, and each stands for {decoys.FeaturesPerDecoy:0.##} real feature{(decoys.FeaturesPerDecoy == 1 ? "" : "s")}.");
    }

    /// <summary>The rule that cut the list, in one sentence.</summary>
    public static string Rule(ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var options = result.Settings.Options;
        string frequency = options.FrequencyThreshold > 0
            ? Invariant($"selected in at least {options.FrequencyThreshold * 100:0.#}% of {result.Settings.RepeatCount} half-sample repeats, and ")
            : "";
        string forest = options.OutcomePermutations > 0 ? Invariant($"the forest's importance against {options.OutcomePermutations} outcome permutations")
            : result.Decoys.DecoyCount > 0 ? Invariant($"the forest's importance averaged over {result.Settings.RepeatCount} half-sample repeats against the decoys'")
            : "the forest's importance against the mirrored null";
        string scan = result.Settings.InteractionScan ? " and with a scan for a partner marker it acts with" : "";
        string evidence = Invariant($"p-values combine {forest} with a rank test of the marker{scan} (Cauchy combination, Liu & Xie 2020)");
        if (options.Rule == ShortlistRule.DecoyBound && result.Decoys.DecoyCount > 0)
            return Invariant($"Rule: {frequency}cut where the decoy bound (with its +1 correction) stays at or under {Percent(options.QValueThreshold)}; {evidence}.");
        return Invariant($"Rule: {frequency}a Benjamini-Hochberg q-value of at most {options.QValueThreshold:0.###}, which keeps the expected share of false markers at or under {Percent(options.QValueThreshold)}; {evidence}.");
    }

    /// <summary>How much a list of this length moves between halves of the samples, and the stability bound where it says something.</summary>
    public static string Stability(ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var stability = result.Stability;
        int listed = result.Shortlist.Count;
        string list = double.IsNaN(stability.ListStability.Stability)
            ? listed == 0 ? "Stability of the list: not defined for an empty list."
                : "Stability of the list: not defined when the list holds every feature (or with a single repeat)."
            : Invariant($"Stability of a list of {listed}: {stability.ListStability.Stability:0.00} [95% interval {stability.ListStability.Interval.Lower:0.00} to {stability.ListStability.Interval.Upper:0.00}] (Nogueira, Sechidis & Brown 2018, over each repeat's top {listed}; 1 means every half-sample gives the same list).");
        if (listed > 0 && stability.BoundIsInformative(listed))
            list += Invariant($" Meinshausen & Bühlmann (2010) bound: at most {stability.ExpectedFalseSelectionsBound:0.##} noise features expected at this frequency.");
        return list;
    }

    /// <summary>What was locked for `apply`, and the selection-aware estimate of that procedure.</summary>
    public static string LockedPanelSentence(ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        int listed = result.Shortlist.Count, locked = result.LockedPanelSize;
        if (locked == 0)
            return "No panel locked: no marker passed error control, so there is nothing to carry into an assay (any curve shown is for information only).";
        var curve = result.PanelSize;
        string what = locked == listed ? Invariant($"all {listed} shortlisted markers") : Invariant($"the top {locked} of the {listed} shortlisted markers");
        const string label = "Locked panel";
        if (curve is null)
            return Invariant($"{label}: {what} (no panel-size curve was computed, so there is no selection-aware estimate).");
        string metric = OutcomeKindReport.MetricName(curve.Metric);
        string text = Invariant($"{label}: {what}. Selection-aware {metric} of this procedure: {curve.LockedEstimate:0.000} ± {curve.LockedEstimateStandardError:0.000} (the same screen, rule and size choice repeated inside each of {curve.FoldCount * curve.FoldRepeats} outer folds, the size chosen on the other folds only");
        text += curve.FoldsWithoutPanel > 0
            ? Invariant($"; {curve.FoldsWithoutPanel} folds shortlisted nothing and count as chance).")
            : ").";
        if (curve.RecommendedSize > locked)
            text += Invariant($" The curve favours {curve.RecommendedSize} markers, more than pass error control; only shortlisted markers are locked.");
        return text;
    }

    /// <summary>Every sentence of the error control, in reading order.</summary>
    public static IReadOnlyList<string> Lines(ScreenResult result) => [Headline(result), Rule(result), Stability(result)];

    private static string Percent(double share) => Invariant($"{share * 100:0.#}%");

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
