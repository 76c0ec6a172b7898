using System.Globalization;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The vocabulary of a screen's settings, in the order the help lists them: every option of
/// `screen` that changes a result, with its manifest key and report label (DEVELOPERS.md lists it).
/// </summary>
public static class ScreenParameters
{
    public static IReadOnlyList<ScreenParameter> All { get; } =
    [
        new("--trees", nameof(ScreenOptions.TreesPerForest), "Trees per forest", s => s.Options.TreesPerForest, s => Integer(s.Options.TreesPerForest)),
        new("--features-per-split", nameof(ScreenOptions.FeaturesPerSplit), "Features tried at each split", s => s.FeaturesPerSplit,
            FeaturesPerSplitText),
        new("--min-leaf", nameof(ScreenOptions.MinLeafSize), "Smallest leaf (samples)", s => s.MinLeafSize,
            s => Integer(s.MinLeafSize) + (s.Options.MinLeafSize == 0 && s.MinLeafSize != 1 ? " (the default of this outcome kind)" : "")),
        new("--balance", nameof(ScreenOptions.Balance), "Class-balanced trees", s => BalanceText(s.Options.Balance),
            s => (s.ClassBalanced ? "yes" : "no") + " (" + BalanceText(s.Options.Balance) + ")"),
        new("--pairs", nameof(ScreenOptions.HalfSamplePairs), "Half-sample pairs", s => s.Options.HalfSamplePairs,
            s => Integer(s.Options.HalfSamplePairs) + " (" + Integer(s.RepeatCount) + " repeats)"),
        new("--repeat-level", nameof(ScreenOptions.RepeatSelectionLevel), "Per-repeat selection level", s => s.Options.RepeatSelectionLevel, s => Number(s.Options.RepeatSelectionLevel)),
        new("--per-repeat-cap", nameof(ScreenOptions.SelectedPerRepeat), "Most features a repeat may select", s => s.Options.SelectedPerRepeat > 0 ? s.Options.SelectedPerRepeat : null,
            s => s.Options.SelectedPerRepeat > 0 ? Integer(s.Options.SelectedPerRepeat) : "no cap"),
        new("--min-frequency", nameof(ScreenOptions.FrequencyThreshold), "Smallest selection frequency", s => s.Options.FrequencyThreshold,
            s => s.Options.FrequencyThreshold > 0 ? Number(s.Options.FrequencyThreshold) : "none (frequency orders the list)"),
        new("--max-q", nameof(ScreenOptions.QValueThreshold), "Largest q-value", s => s.Options.QValueThreshold, s => Number(s.Options.QValueThreshold)),
        new("--shortlist-rule", nameof(ScreenOptions.Rule), "Shortlist rule", s => RuleText(s.Options.Rule), s => RuleText(s.Options.Rule)),
        new("--decoys", nameof(ScreenOptions.DecoyCount), "Decoys (each permuted once per run)", s => s.DecoyCount,
            s => s.Options.DecoyCount >= 0 ? Integer(s.DecoyCount)
                : Integer(s.DecoyCount) + " (automatic: one per feature, " + Integer(s.Options.AutomaticDecoyFloor) + " to " + Integer(s.Options.AutomaticDecoyCeiling) + ")"),
        new("--interaction-scan", nameof(ScreenOptions.InteractionScan), "Pairwise interaction scan", s => s.InteractionScan ? "on" : "off",
            s => (s.InteractionScan ? "on" : "off") + " (" + ModeText(s.Options.InteractionScan)
                + (s.Options.InteractionScan == InteractionScanMode.Auto ? ": on up to " + s.Options.InteractionScanPairLimit.ToString("N0", CultureInfo.InvariantCulture) + " feature pairs" : "")
                + (s.DecoyCount == 0 ? "; needs decoys" : "") + ")"),
        new("--outcome-permutations", nameof(ScreenOptions.OutcomePermutations), "Outcome permutations", s => s.Options.OutcomePermutations,
            s => s.Options.OutcomePermutations > 0 ? Integer(s.Options.OutcomePermutations) : "none"),
        new("--redundancy-rho", nameof(ScreenOptions.RedundancyCorrelation), "Redundancy correlation (Spearman |rho|)", s => s.Options.RedundancyCorrelation, s => Number(s.Options.RedundancyCorrelation)),
        new("--curve-folds", nameof(ScreenOptions.CurveFolds), "Panel-size curve folds", s => s.Options.CurveFolds, s => s.Options.CurveFolds > 0 ? Integer(s.Options.CurveFolds) : "none (curve skipped)"),
        new("--curve-repeats", nameof(ScreenOptions.CurveFoldRepeats), "Repeats of the curve folds", s => s.Options.CurveFoldRepeats, s => Integer(s.Options.CurveFoldRepeats)),
        new("--curve-inner-pairs", nameof(ScreenOptions.CurveInnerPairs), "Half-sample pairs inside each curve fold", s => s.Options.CurveInnerPairs, s => Integer(s.Options.CurveInnerPairs)),
        new("--max-panel-size", nameof(ScreenOptions.CurveMaxPanelSize), "Largest panel size on the curve", s => s.Options.CurveMaxPanelSize, s => Integer(s.Options.CurveMaxPanelSize)),
        new("--seed", nameof(ScreenOptions.Seed), "Run seed", s => s.Options.Seed, s => s.Options.Seed.ToString(CultureInfo.InvariantCulture)),
        new("--threads", nameof(ScreenOptions.ThreadCount), "Threads", s => s.Options.ThreadCount > 0 ? s.Options.ThreadCount : null,
            s => s.Options.ThreadCount > 0 ? Integer(s.Options.ThreadCount) : "all cores"),
    ];

    /// <summary>
    /// What each forest kind tried: the clean forests, the forests carrying permuted copies and
    /// decoys (wider, so an automatic value is larger there), the outcome-permutation forests, and
    /// a panel's forest (the square root of its own marker count).
    /// </summary>
    private static string FeaturesPerSplitText(ScreenSettings s)
    {
        bool automatic = s.Options.FeaturesPerSplit <= 0;
        string text = Integer(s.FeaturesPerSplit) + (automatic ? " (square root of the feature count)" : "");
        if (s.CorrectedForestFeaturesPerSplit != s.FeaturesPerSplit)
            text += "; " + Integer(s.CorrectedForestFeaturesPerSplit) + " in the forests carrying permuted copies and decoys ("
                + Integer(2 * s.FeatureCount + s.DecoyCount) + " columns)";
        if (s.OutcomePermutationForestFeaturesPerSplit > 0 && s.OutcomePermutationForestFeaturesPerSplit != s.FeaturesPerSplit)
            text += "; " + Integer(s.OutcomePermutationForestFeaturesPerSplit) + " in the outcome-permutation forests ("
                + Integer(2 * s.FeatureCount) + " columns)";
        if (automatic) text += "; a panel's forest tries the square root of its marker count";
        return text;
    }

    /// <summary>The option's own spelling of a shortlist rule.</summary>
    public static string RuleText(ShortlistRule rule) => rule == ShortlistRule.QValue ? "q-value" : "decoy-bound";

    /// <summary>The option's own spelling of a balance setting (auto, on, off).</summary>
    public static string BalanceText(BalanceMode mode) => mode.ToString().ToLowerInvariant();

    /// <summary>The option's own spelling of the interaction scan setting (auto, on, off).</summary>
    public static string ModeText(InteractionScanMode mode) => mode.ToString().ToLowerInvariant();

    private static string Integer(int value) => value.ToString(CultureInfo.InvariantCulture);

    private static string Number(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
