using System.Globalization;
using System.Reflection;
using System.Text.Json;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>The prose of the screen report: the answer up top, the cautions, the parameters and the method notes.</summary>
internal static class ScreenReportText
{
    /// <summary>The cautions box; the last one says whether the cohort check ran.</summary>
    public static IReadOnlyList<string> Cautions(bool cohortsChecked) =>
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

    public static IReadOnlyList<string> MethodNotes { get; } =
    [
        "Repeats. The samples are split many times into two halves of equal size (complementary pairs), and forests are grown on each half (Shah & Samworth 2013). A marker that matters should be found again and again across halves.",
        "Corrected impurity importance. Each forest measures how much a feature's splits reduce Gini impurity, corrected so that features with many distinct values or none of the signal are not favoured (Nembrini, König & Wright 2018).",
        "Permutation importance. The accuracy lost on the samples a tree did not see (out-of-bag) when one feature's values are shuffled (Breiman 2001).",
        "What noise looks like. Importances at or below zero are mirrored to form a null distribution (Janitza, Celik & Boulesteix 2018), augmented with decoys: copies of real features whose values were shuffled, so they cannot carry signal. In each repeat a feature is selected when its importance exceeds that null's upper quantile.",
        "False discoveries. p-values against that null are adjusted for the number of features with the Benjamini & Hochberg (1995) procedure (q-values). The share of decoys that would pass the shortlist rule gives a second, direct estimate of the false discovery rate.",
        "Stability. The selection frequency over repeats drives the shortlist (Meinshausen & Bühlmann 2010, with their bound on the expected number of noise features reaching the threshold). Agreement between repeats is summarised by the estimator of Nogueira, Sechidis & Brown (2018) with its 95% interval.",
        "Panel size. The whole selection is rerun inside each outer training part and judged on the held-out part, so the estimate is selection-aware; choosing markers on all samples first and then testing them is optimistic (Ambroise & McLachlan 2002). The recommended size is the smallest within one standard error of the best (the one-SE rule, Breiman, Friedman, Olshen & Stone 1984).",
        "Single-marker statistics. Direction, median ratio and the Mann-Whitney AUC compare the positive class with the rest; the AUC's 95% interval uses DeLong, DeLong & Clarke-Pearson (1988).",
    ];

    public static string Answer(Panel panel, ScreenResult result)
    {
        var options = result.Settings.Options;
        string rule = Invariant($"selected in at least {options.FrequencyThreshold * 100:0.#}% of {result.Settings.RepeatCount} half-sample repeats with q ≤ {options.QValueThreshold:0.###}");
        string forest = result.ReferenceForest.OutOfBagAuc is { } auc
            ? Invariant($" A forest on all samples and features has out-of-bag error {result.ReferenceForest.OutOfBagError:0.000} and AUC {auc:0.000}.")
            : Invariant($" A forest on all samples and features has out-of-bag error {result.ReferenceForest.OutOfBagError:0.000}.");
        if (result.Shortlist.Count == 0)
            return Invariant($"No marker was shortlisted among {panel.FeatureCount} features measured on {panel.SampleCount} samples: none was {rule}.") + forest;
        string markers = result.Shortlist.Count == 1 ? "1 marker" : Invariant($"{result.Shortlist.Count} markers");
        return Invariant($"The screen shortlisted {markers} of {panel.FeatureCount} features measured on {panel.SampleCount} samples ({rule}).") + forest;
    }

    public static string PanelSizeAnswer(PanelSizeCurve curve, ScreenOptions options)
    {
        string metric = curve.Metric == "auc" ? "AUC" : "accuracy";
        PanelSizePoint? recommended = null;
        foreach (var point in curve.Points)
            if (point.PanelSize == curve.RecommendedSize) recommended = point;
        if (recommended is null) return Invariant($"The recommended panel size is {curve.RecommendedSize} markers.");
        // A normal 95% interval from the standard error over folds: mean ± 1.96 SE (common practice).
        double low = recommended.SelectionAwareAuc - 1.96 * recommended.SelectionAwareAucStandardError;
        double high = recommended.SelectionAwareAuc + 1.96 * recommended.SelectionAwareAucStandardError;
        string folds = curve.FoldRepeats > 1 ? Invariant($"{curve.FoldCount}-fold, repeated {curve.FoldRepeats} times") : Invariant($"{curve.FoldCount}-fold");
        return Invariant($"Recommended panel size: {curve.RecommendedSize} markers, with a selection-aware held-out {metric} of {recommended.SelectionAwareAuc:0.000} (95% interval about {low:0.000} to {high:0.000}; {folds} cross-validation with the markers chosen afresh in each training part). ")
            + Invariant($"Choosing the markers once on all samples would suggest {recommended.OptimisticAuc:0.000}: that figure is optimistic and should not be quoted.");
    }

    public static string Confidence(ScreenResult result)
    {
        var options = result.Settings.Options;
        var decoys = result.Decoys;
        var stability = result.Stability;
        string decoyText = decoys.DecoyCount > 0
            ? double.IsFinite(decoys.EstimatedFalseDiscoveryRate)
                ? Invariant($"{decoys.DecoysPassing} of {decoys.DecoyCount} decoys (shuffled copies of real features) passed the shortlist rule, which puts the estimated false discovery rate of the shortlist at {decoys.EstimatedFalseDiscoveryRate * 100:0.#}%.")
                : Invariant($"{decoys.DecoysPassing} of {decoys.DecoyCount} decoys passed the shortlist rule.")
            : "No decoys were used (the panel has too many features for automatic decoys), so there is no decoy estimate of the false discovery rate.";
        return "How confident the screen is: " + decoyText
            + Invariant($" Every shortlisted marker has a Benjamini-Hochberg q-value of at most {options.QValueThreshold:0.###} and a selection frequency of at least {options.FrequencyThreshold:0.##}.")
            + Invariant($" Repeats selected {stability.MeanSelectedPerRepeat:0.#} features on average; at most {stability.ExpectedFalseSelectionsBound:0.##} noise features are expected to reach that frequency (Meinshausen-Bühlmann bound). ")
            + Invariant($"Agreement between repeats (Nogueira stability) is {stability.Stability.Stability:0.00} [95% interval {stability.Stability.Interval.Lower:0.00} to {stability.Stability.Interval.Upper:0.00}] on a scale where 1 means every repeat chose the same features.");
    }

    /// <summary>Every screen parameter in plain words, with the values resolved for this panel.</summary>
    public static IReadOnlyList<KeyValuePair<string, string>> Parameters(ScreenSettings settings)
    {
        var o = settings.Options;
        return
        [
            new("Run seed", o.Seed.ToString(CultureInfo.InvariantCulture)),
            new("Half-sample pairs (repeats)", Invariant($"{o.HalfSamplePairs} ({settings.RepeatCount} repeats)")),
            new("Trees per forest", Integer(o.TreesPerForest)),
            new("Features tried at each split", o.FeaturesPerSplit > 0 ? Integer(settings.FeaturesPerSplit) : Invariant($"{settings.FeaturesPerSplit} (square root of the feature count)")),
            new("Smallest leaf (samples)", Integer(o.MinLeafSize)),
            new("Class-balanced trees", Invariant($"{(settings.ClassBalanced ? "yes" : "no")} (setting: {o.Balance})")),
            new("Per-repeat selection level", Invariant($"{o.RepeatSelectionLevel:0.###}")),
            new("Cap on features selected per repeat", o.SelectedPerRepeat > 0 ? Integer(o.SelectedPerRepeat) : "none"),
            new("Selection frequency threshold", Invariant($"{o.FrequencyThreshold:0.###}")),
            new("q-value threshold", Invariant($"{o.QValueThreshold:0.###}")),
            new("Decoys per repeat", o.DecoyCount >= 0 ? Integer(settings.DecoyCount) : Invariant($"{settings.DecoyCount} (automatic; off above {o.AutomaticDecoyFeatureLimit} features)")),
            new("Outcome permutations", o.OutcomePermutations > 0 ? Integer(o.OutcomePermutations) : "none"),
            new("Redundancy correlation (Spearman |rho|)", Invariant($"{o.RedundancyCorrelation:0.###}")),
            new("Panel-size curve", o.CurveFolds > 0
                ? Invariant($"{o.CurveFolds} outer folds x {o.CurveFoldRepeats}, {o.CurveInnerPairs} inner half-sample pairs, sizes up to {o.CurveMaxPanelSize}")
                : "skipped"),
            new("Threads", o.ThreadCount > 0 ? Integer(o.ThreadCount) : "all cores"),
        ];
    }

    /// <summary>
    /// Every property of <see cref="ScreenOptions"/> under the name the manifest uses (snake case),
    /// found by reflection so that an option added later can never be left out of the report.
    /// </summary>
    public static IReadOnlyList<KeyValuePair<string, string>> RawParameters(ScreenSettings settings)
    {
        var properties = typeof(ScreenOptions).GetProperties(BindingFlags.Public | BindingFlags.Instance);
        // Declaration order, which reflection does not promise; metadata tokens follow it.
        Array.Sort(properties, (a, b) => a.MetadataToken.CompareTo(b.MetadataToken));
        var entries = new List<KeyValuePair<string, string>>(properties.Length + 3);
        foreach (var property in properties)
        {
            if (property.GetIndexParameters().Length > 0 || property.Name == "EqualityContract") continue;
            object? value = property.GetValue(settings.Options);
            string text = value switch
            {
                Enum e => JsonNamingPolicy.SnakeCaseLower.ConvertName(e.ToString()),
                IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
                _ => value?.ToString() ?? "",
            };
            entries.Add(new(JsonNamingPolicy.SnakeCaseLower.ConvertName(property.Name), text));
        }
        entries.Add(new("resolved features_per_split", Integer(settings.FeaturesPerSplit)));
        entries.Add(new("resolved class_balanced", settings.ClassBalanced ? "true" : "false"));
        entries.Add(new("resolved decoys", Integer(settings.DecoyCount)));
        return entries;
    }

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
