using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>The prose of the screen report: the answer up top, the cautions, the parameters and the method notes.</summary>
internal static class ScreenReportText
{
    /// <summary>The cautions box; the last one says whether the cohort check ran.</summary>
    public static IReadOnlyList<string> Cautions(bool cohortsChecked, OutcomeKind kind = OutcomeKind.Classes)
    {
        var cautions = new List<string>(ClassCautions(cohortsChecked));
        if (kind == OutcomeKind.TimeToEvent)
            cautions.Add("Concordance says how well markers rank patients by risk; it does not show that any predicted risk is right at a given time (calibration over time is not measured here). "
                + "Prognostic claims need follow-up in an independent cohort, with the same event definition and comparable treatment.");
        if (kind == OutcomeKind.Measured)
            cautions.Add("R² here is how much of the outcome's spread the markers explain in these samples' held-out parts; it depends on how much the outcome varies in the cohort, "
                + "so it does not carry over to a cohort with a narrower or wider range.");
        if (kind != OutcomeKind.Classes)
            cautions.Add("Screens of measured and time-to-event outcomes are new in this version and calibrated on fewer designs than class screens (README, How well the error control holds): "
                + "with the decoy tail bound, null measured panels gave no list in 20 and null time-to-event panels a list in 2 of 20 (at a level of 10%), the false share on planted designs was 0.03 and 0.00, "
                + "the selection-aware R² was conservative by about 0.04, and the time-to-event screen found fewer true markers than a single-marker Cox test (7 against 12 over 5 planted panels). "
                + "Read the list and its estimates with that margin.");
        return cautions;
    }

    private static IReadOnlyList<string> ClassCautions(bool cohortsChecked) =>
    [
        "Research use only. A screen ranks candidates for a validation study; it is not a diagnostic test and says nothing about any individual patient.",
        "Every shortlisted marker needs confirmation in independent cohorts, measured with the assay that will be used later, before any further use.",
        "Follow your local ethics approvals, data-protection rules and licensed clinical practice; where they differ from anything here, they take precedence.",
        cohortsChecked
            ? "A marker that tracks a batch, centre or cohort rather than the outcome is not a marker. The cohort check below flags markers whose signal is explained by cohort or differs between cohorts; read it before choosing markers."
            : NoCohortCaution,
    ];

    public const string NoCohortCaution =
        "A marker that tracks a batch, centre or cohort rather than the outcome is not a marker. No cohort column was given, so batch and cohort artefacts were not checked; "
        + "if the samples come from several centres, batches or cohorts, rerun with --cohort naming that column.";

    /// <summary>The method notes in the words of the outcome kind.</summary>
    public static IReadOnlyList<string> MethodNotesFor(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured =>
        [
            MethodNotes[0],
            "Forests. Regression forests (Breiman 2001): each split lowers the squared error of the outcome most, each leaf predicts the mean of its samples (CART, Breiman, Friedman, Olshen & Stone 1984); leaves keep at least 5 samples unless set otherwise.",
            "Corrected impurity importance. Each forest measures how much a feature's splits reduce the squared error (variance) of the outcome, corrected so that features with many distinct values or none of the signal are not favoured (Nembrini, König & Wright 2018).",
            "Permutation importance. The rise in mean squared error on the samples a tree did not see (out-of-bag) when one feature's values are shuffled (Breiman 2001).",
            MethodNotes[3], MethodNotes[4], MethodNotes[5],
            MethodNotes[6].Replace("judged on the held-out part", "judged on the held-out part by R² (one minus the squared error over the held-out samples' own spread)", StringComparison.Ordinal),
            "Single-marker statistics. Spearman's rho with the outcome, its t-approximation p-value and a 95% interval on Fisher's z with Bonett & Wright's (2000) variance; q-values by Benjamini & Hochberg (1995). Below-detection cells rank lowest. The rank test combined with the forest's evidence is the same Spearman test.",
        ],
        OutcomeKind.TimeToEvent =>
        [
            MethodNotes[0],
            "Forests. Random survival forests (Ishwaran, Kogalur, Blackstone & Lauer 2008): each split separates the follow-up of its two sides most by the log-rank statistic, each leaf holds the Nelson-Aalen cumulative hazard of its samples, and a sample's risk is the forest's ensemble mortality; leaves keep at least 5 samples unless set otherwise.",
            "Corrected impurity importance. Each forest sums the log-rank statistics of a feature's splits, corrected with permuted copies so that features with many distinct values or none of the signal are not favoured (Nembrini, König & Wright 2018).",
            "Permutation importance. The drop in concordance (Harrell's C) on the samples a tree did not see (out-of-bag) when one feature's values are shuffled (Breiman 2001; Ishwaran et al. 2008).",
            MethodNotes[3], MethodNotes[4], MethodNotes[5],
            MethodNotes[6].Replace("judged on the held-out part", "judged on the held-out part by Harrell's C of the forest's risk", StringComparison.Ordinal),
            "Single-marker statistics. Harrell's C of the marker as a risk score with its infinitesimal-jackknife interval (Harrell et al. 1982), and a single-marker Cox model (Cox 1972; Efron 1977 ties) giving the hazard ratio per SD with its Wald interval and the score-test p-value; q-values by Benjamini & Hochberg (1995). The rank test combined with the forest's evidence is the Cox score test on the marker's ranks.",
        ],
        _ => MethodNotes,
    };

    public static IReadOnlyList<string> MethodNotes { get; } =
    [
        "Repeats. The samples are split many times into two halves of equal size (complementary pairs), and forests are grown on each half (Shah & Samworth 2013). A marker that matters should be found again and again across halves.",
        "Corrected impurity importance. Each forest measures how much a feature's splits reduce Gini impurity, corrected so that features with many distinct values or none of the signal are not favoured (Nembrini, König & Wright 2018).",
        "Permutation importance. The accuracy lost on the samples a tree did not see (out-of-bag) when one feature's values are shuffled (Breiman 2001).",
        "What noise looks like. Decoys are copies of real features whose values were permuted once for the whole run and kept in every repeat: like a real marker unrelated to the outcome, a decoy keeps whatever chance association it has with the outcome in every half-sample, so its importance averaged over repeats follows the same law. In each repeat a feature is selected when its importance exceeds the upper decile of that repeat's decoys.",
        "False discoveries. Each feature's averaged importance gets a p-value against the decoys' averaged importances; beyond the few largest decoys the tail is a generalized Pareto fit (Knijnenburg et al. 2009), so small p-values keep their resolution. The p-values are adjusted for the number of features with the Benjamini & Hochberg (1995) procedure (q-values). The decoys that pass the same rule, scaled from decoys to features, estimate how many listed markers are false (target-decoy reasoning; the +1 form of Barber & Candès 2015 gives an upper figure).",
        "Stability. The selection frequency over repeats is part of the shortlist rule. How much a list of the shortlist's length changes between half-samples is summarised by the estimator of Nogueira, Sechidis & Brown (2018) with its 95% interval; the Meinshausen & Bühlmann (2010) bound is quoted only where it is smaller than the list.",
        "Panel size. The whole selection is rerun inside each outer training part and judged on the held-out part, so the estimate is selection-aware; choosing markers on all samples first and then testing them is optimistic (Ambroise & McLachlan 2002). The recommended size is the smallest within one standard error of the best (the one-SE rule, Breiman, Friedman, Olshen & Stone 1984). The locked panel is the shortlist or its prefix chosen by that rule among sizes no longer than the list; its estimate repeats the screen, the rule and the size choice inside every fold, with the size chosen on the other folds' scores only.",
        "Single-marker statistics. Direction, median ratio and the Mann-Whitney AUC compare the positive class with the rest; the AUC's 95% interval uses DeLong, DeLong & Clarke-Pearson (1988).",
    ];

    public static string Answer(Panel panel, ScreenResult result)
    {
        var options = result.Settings.Options;
        string rule = options.FrequencyThreshold > 0
            ? Invariant($"selected in at least {options.FrequencyThreshold * 100:0.#}% of {result.Settings.RepeatCount} half-sample repeats with q ≤ {options.QValueThreshold:0.###}")
            : Invariant($"q ≤ {options.QValueThreshold:0.###}");
        string forest = OutcomeKindReport.ReferenceForestSentence(result.ReferenceForest);
        if (result.Shortlist.Count == 0)
            return Invariant($"No marker was shortlisted among {panel.FeatureCount} features measured on {panel.SampleCount} samples: none was {rule}.") + forest;
        string markers = result.Shortlist.Count == 1 ? "1 marker" : Invariant($"{result.Shortlist.Count} markers");
        return Invariant($"The screen shortlisted {markers} of {panel.FeatureCount} features measured on {panel.SampleCount} samples ({rule}).") + forest;
    }

    public static string PanelSizeAnswer(PanelSizeCurve curve, ScreenOptions options)
    {
        string metric = OutcomeKindReport.MetricName(curve.Metric);
        PanelSizePoint? recommended = null;
        foreach (var point in curve.Points)
            if (point.PanelSize == curve.RecommendedSize) recommended = point;
        if (recommended is null) return Invariant($"The recommended panel size is {curve.RecommendedSize} markers.");
        // A normal 95% interval from the standard error over folds: mean ± 1.96 SE (common practice).
        double low = recommended.SelectionAwareAuc - 1.96 * recommended.SelectionAwareAucStandardError;
        double high = recommended.SelectionAwareAuc + 1.96 * recommended.SelectionAwareAucStandardError;
        string folds = curve.FoldRepeats > 1 ? Invariant($"{curve.FoldCount}-fold, repeated {curve.FoldRepeats} times") : Invariant($"{curve.FoldCount}-fold");
        // A measured outcome's error in its own units beside R²: the held-out RMSE, mean over folds.
        string rmse = curve.Metric == "r_squared" && double.IsFinite(recommended.SelectionAwareRootMeanSquaredError)
            ? "Its selection-aware held-out root mean squared error is " + ReportNumber.Significant(recommended.SelectionAwareRootMeanSquaredError, 3)
                + " in the outcome's units (mean over outer folds). "
            : "";
        return Invariant($"Recommended panel size: {curve.RecommendedSize} markers, with a selection-aware held-out {metric} of {recommended.SelectionAwareAuc:0.000} (95% interval about {low:0.000} to {high:0.000}; {folds} cross-validation with the markers chosen afresh in each training part). ")
            + rmse
            + Invariant($"Choosing the markers once on all samples would suggest {recommended.OptimisticAuc:0.000}: that figure is optimistic and should not be quoted.");
    }

    public static string Confidence(ScreenResult result) =>
        "How confident the screen is: " + string.Join(" ", ErrorControlText.Lines(result)) + " " + ErrorControlText.LockedPanelSentence(result);

    /// <summary>Every setting under its report label, with the option that sets it, as the run used it.</summary>
    public static IReadOnlyList<KeyValuePair<string, string>> Parameters(ScreenSettings settings) =>
        ScreenParameters.All.Select(p => new KeyValuePair<string, string>(p.Label + " (" + p.Option + ")", p.Text(settings))).ToList();

    public static string StageName(ScreenStage stage) => stage switch
    {
        ScreenStage.Binning => "Binning the features",
        ScreenStage.UnivariateStatistics => "Single-marker statistics",
        ScreenStage.ReferenceForest => "Forest on all samples",
        ScreenStage.Repeats => "Half-sample repeats",
        ScreenStage.OutcomePermutations => "Outcome permutations",
        ScreenStage.PanelSizeCurve => "Panel-size curve",
        _ => stage.ToString(),
    };

    private static string Integer(int value) => value.ToString(CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
