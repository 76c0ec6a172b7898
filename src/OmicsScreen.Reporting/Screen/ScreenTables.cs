using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The machine-readable tables of a screen: one row per feature (or panel size), a header row,
/// invariant numbers, spreadsheet-safe names. Column names are documented in the README.
/// </summary>
public static class ScreenTables
{
    private static readonly NumberFormat Importance = NumberFormat.Significant(6);
    private static readonly NumberFormat Probability = NumberFormat.Significant(4);
    private static readonly NumberFormat Share = NumberFormat.Fixed(4);

    public static int WriteShortlist(TextWriter writer, ScreenResult result, FeatureLabels? labels = null)
    {
        var columns = new List<TsvColumn<ShortlistEntry>>
        {
            TsvColumn<ShortlistEntry>.Integer("rank", e => e.Rank),
            TsvColumn<ShortlistEntry>.Text("feature", e => e.Forest.Feature),
            TsvColumn<ShortlistEntry>.Integer("redundancy_group", e => e.RedundancyGroup),
            TsvColumn<ShortlistEntry>.Text("cohort_flag", e => result.Cohorts?.Marker(e.Forest.FeatureIndex) is { } m ? CohortTables.FlagText(m.Flag) : ""),
        };
        // With covariates (class outcomes): the covariates each marker only tracks, "" for none.
        if (result.CovariateTracking is { } tracking)
            columns.Add(TsvColumn<ShortlistEntry>.Text("tracks", e => string.Join(",", tracking.TracksOf(e.Forest.FeatureIndex))));
        columns.AddRange(new[]
        {
            TsvColumn<ShortlistEntry>.Number("selection_frequency", e => e.Forest.SelectionFrequency, Share),
            TsvColumn<ShortlistEntry>.Number("median_rank", e => e.Forest.MedianRank, NumberFormat.Fixed(1)),
            TsvColumn<ShortlistEntry>.Number("rank_q1", e => e.Forest.RankLowerQuartile, NumberFormat.Fixed(1)),
            TsvColumn<ShortlistEntry>.Number("rank_q3", e => e.Forest.RankUpperQuartile, NumberFormat.Fixed(1)),
            TsvColumn<ShortlistEntry>.Number("corrected_importance", e => e.Forest.CorrectedMean, Importance),
            TsvColumn<ShortlistEntry>.Number("corrected_importance_sd", e => e.Forest.CorrectedSd, Importance),
            TsvColumn<ShortlistEntry>.Number("permutation_importance", e => e.Forest.PermutationMean, Importance),
            TsvColumn<ShortlistEntry>.Number("permutation_importance_sd", e => e.Forest.PermutationSd, Importance),
            TsvColumn<ShortlistEntry>.Number(ImpurityColumn(result.Kind), e => e.Forest.ImpurityMean, Importance),
            TsvColumn<ShortlistEntry>.Number(ImpurityColumn(result.Kind) + "_sd", e => e.Forest.ImpuritySd, Importance),
            TsvColumn<ShortlistEntry>.Number("group_permutation_importance", e => e.GroupPermutationImportance, Importance),
            TsvColumn<ShortlistEntry>.Number("p_value", e => e.Forest.PValue, Probability),
            TsvColumn<ShortlistEntry>.Number("q_value", e => e.Forest.QValue, Probability),
        });
        columns.AddRange(result.Kind switch
        {
            OutcomeKind.Measured => MeasuredColumns(),
            OutcomeKind.TimeToEvent => FollowUpColumns(),
            _ => ClassColumns(),
        });
        columns.Add(TsvColumn<ShortlistEntry>.Integer("univariate_rank", e => e.UnivariateRank));
        columns.AddRange(EffectTables.ShortlistColumns(result));
        AddLabelColumns(columns, labels, e => e.Forest.FeatureIndex);
        return new TsvTableWriter<ShortlistEntry>(columns).Write(writer, result.Shortlist);
    }

    public static int WriteFeatures(TextWriter writer, ScreenResult result, FeatureLabels? labels = null)
    {
        var shortlisted = result.Shortlist.Select(e => e.Forest.FeatureIndex).ToHashSet();
        var columns = new List<TsvColumn<FeatureSummary>>
        {
            TsvColumn<FeatureSummary>.Integer("order", f => f.Order),
            TsvColumn<FeatureSummary>.Text("feature", f => f.Feature),
            TsvColumn<FeatureSummary>.Text("shortlisted", f => shortlisted.Contains(f.FeatureIndex) ? "yes" : "no"),
            TsvColumn<FeatureSummary>.Number("selection_frequency", f => f.SelectionFrequency, Share),
            TsvColumn<FeatureSummary>.Number("median_rank", f => f.MedianRank, NumberFormat.Fixed(1)),
            TsvColumn<FeatureSummary>.Number("rank_q1", f => f.RankLowerQuartile, NumberFormat.Fixed(1)),
            TsvColumn<FeatureSummary>.Number("rank_q3", f => f.RankUpperQuartile, NumberFormat.Fixed(1)),
            TsvColumn<FeatureSummary>.Number("corrected_importance", f => f.CorrectedMean, Importance),
            TsvColumn<FeatureSummary>.Number("corrected_importance_sd", f => f.CorrectedSd, Importance),
            TsvColumn<FeatureSummary>.Number("permutation_importance", f => f.PermutationMean, Importance),
            TsvColumn<FeatureSummary>.Number("permutation_importance_sd", f => f.PermutationSd, Importance),
            TsvColumn<FeatureSummary>.Number(ImpurityColumn(result.Kind), f => f.ImpurityMean, Importance),
            TsvColumn<FeatureSummary>.Number(ImpurityColumn(result.Kind) + "_sd", f => f.ImpuritySd, Importance),
            TsvColumn<FeatureSummary>.Number("null_p", f => f.NullP, Probability),
            TsvColumn<FeatureSummary>.Number("outcome_permutation_p", f => f.OutcomePermutationP, Probability),
            TsvColumn<FeatureSummary>.Number("rank_test_p", f => f.RankTestP, Probability),
            TsvColumn<FeatureSummary>.Number("interaction_p", f => f.InteractionP, Probability),
            TsvColumn<FeatureSummary>.Text("interaction_partner", f => f.InteractionPartner >= 0 ? result.Features[f.InteractionPartner].Feature : ""),
            TsvColumn<FeatureSummary>.Number("combined_p", f => f.CombinedP, Probability),
            TsvColumn<FeatureSummary>.Number("p_value", f => f.PValue, Probability),
            TsvColumn<FeatureSummary>.Number("q_value", f => f.QValue, Probability),
            TsvColumn<FeatureSummary>.Integer("univariate_rank", f => result.UnivariateRanks[f.FeatureIndex]),
        };
        AddLabelColumns(columns, labels, f => f.FeatureIndex);
        return new TsvTableWriter<FeatureSummary>(columns).Write(writer, result.Order.Select(f => result.Features[f]));
    }

    public static int WritePanelSizeCurve(TextWriter writer, PanelSizeCurve curve)
    {
        string metric = curve.Metric;
        var columns = new List<TsvColumn<PanelSizePoint>>
        {
            TsvColumn<PanelSizePoint>.Integer("panel_size", p => p.PanelSize),
            TsvColumn<PanelSizePoint>.Text("recommended", p => p.PanelSize == curve.RecommendedSize ? "yes" : "no"),
            TsvColumn<PanelSizePoint>.Number($"selection_aware_{metric}", p => p.SelectionAwareAuc, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Number($"selection_aware_{metric}_sd", p => p.SelectionAwareAucSd, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Number($"selection_aware_{metric}_se", p => p.SelectionAwareAucStandardError, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Number("selection_aware_error", p => p.SelectionAwareError, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Number($"optimistic_{metric}", p => p.OptimisticAuc, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Number($"optimistic_{metric}_sd", p => p.OptimisticAucSd, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Number("optimistic_error", p => p.OptimisticError, NumberFormat.Fixed(4)),
            TsvColumn<PanelSizePoint>.Integer("outer_folds", p => p.FoldCount),
        };
        // A measured outcome's curve also gives the held-out RMSE (outcome units) beside R²;
        // the other kinds' tables keep their columns.
        if (metric == "r_squared")
        {
            columns.Insert(6, TsvColumn<PanelSizePoint>.Number("selection_aware_rmse", p => p.SelectionAwareRootMeanSquaredError, NumberFormat.Fixed(4)));
            columns.Insert(10, TsvColumn<PanelSizePoint>.Number("optimistic_rmse", p => p.OptimisticRootMeanSquaredError, NumberFormat.Fixed(4)));
        }
        return new TsvTableWriter<PanelSizePoint>(columns).Write(writer, curve.Points);
    }

    /// <summary>The uncorrected impurity importance is named for what it sums: Gini decrease, variance decrease or log-rank statistic.</summary>
    public static string ImpurityColumn(OutcomeKind kind) => kind switch
    {
        OutcomeKind.Measured => "variance_decrease",
        OutcomeKind.TimeToEvent => "log_rank_statistic",
        _ => "gini_decrease",
    };

    /// <summary>The positive class against the rest: direction, median ratio, AUC with interval, rank-test q.</summary>
    private static TsvColumn<ShortlistEntry>[] ClassColumns() =>
    [
        TsvColumn<ShortlistEntry>.Text("direction", e => DirectionText(e.Univariate!)),
        TsvColumn<ShortlistEntry>.Number("log2_median_ratio", e => e.Univariate!.Log2MedianRatio, NumberFormat.Fixed(3)),
        TsvColumn<ShortlistEntry>.Number("auc", e => e.Univariate!.Auc, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("auc_low95", e => e.Univariate!.AucInterval.Lower, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("auc_high95", e => e.Univariate!.AucInterval.Upper, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("rank_test_q", e => e.Univariate!.QValue, Probability),
    ];

    /// <summary>Spearman's rho with its Fisher-z interval and q against a measured outcome.</summary>
    private static TsvColumn<ShortlistEntry>[] MeasuredColumns() =>
    [
        TsvColumn<ShortlistEntry>.Text("direction", e => e.Measured!.Direction),
        TsvColumn<ShortlistEntry>.Number("spearman_rho", e => e.Measured!.Rho, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("rho_low95", e => e.Measured!.Interval.Lower, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("rho_high95", e => e.Measured!.Interval.Upper, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("rank_test_q", e => e.Measured!.QValue, Probability),
    ];

    /// <summary>Harrell's C with its interval, the Cox hazard ratio per SD with its Wald interval, and the score test's q.</summary>
    private static TsvColumn<ShortlistEntry>[] FollowUpColumns() =>
    [
        TsvColumn<ShortlistEntry>.Text("direction", e => e.FollowUp!.Direction),
        TsvColumn<ShortlistEntry>.Number("concordance", e => e.FollowUp!.Concordance.Concordance, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("concordance_low95", e => e.FollowUp!.Concordance.Interval.Lower, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("concordance_high95", e => e.FollowUp!.Concordance.Interval.Upper, NumberFormat.Fixed(4)),
        TsvColumn<ShortlistEntry>.Number("hazard_ratio_per_sd", e => e.FollowUp!.HazardRatioPerSd, NumberFormat.Significant(4)),
        TsvColumn<ShortlistEntry>.Number("hazard_ratio_low95", e => e.FollowUp!.HazardRatioInterval.Lower, NumberFormat.Significant(4)),
        TsvColumn<ShortlistEntry>.Number("hazard_ratio_high95", e => e.FollowUp!.HazardRatioInterval.Upper, NumberFormat.Significant(4)),
        TsvColumn<ShortlistEntry>.Number("rank_test_q", e => e.FollowUp!.QValue, Probability),
    ];

    /// <summary>
    /// The display name right after the feature id, and each annotation column at the end under
    /// its own name (prefixed feature_ when a column of the table already has that name).
    /// </summary>
    private static void AddLabelColumns<TRecord>(List<TsvColumn<TRecord>> columns, FeatureLabels? labels, Func<TRecord, int> featureIndex)
    {
        if (labels is null) return;
        if (labels.HasDisplayNames)
        {
            int after = columns.FindIndex(c => c.Header == "feature") + 1;
            columns.Insert(after, TsvColumn<TRecord>.Text("display_name", r => labels.DisplayName(featureIndex(r))));
        }
        var taken = new HashSet<string>(columns.Select(c => SpreadsheetSafeText.Sanitise(c.Header)), StringComparer.Ordinal);
        foreach (var (name, values) in labels.Annotations)
        {
            string header = name;
            while (!taken.Add(SpreadsheetSafeText.Sanitise(header))) header = "feature_" + header;
            columns.Add(TsvColumn<TRecord>.Text(header, r => values[featureIndex(r)]));
        }
    }

    /// <summary>A shortlisted marker's direction in words (the positive class's contrast for classes).</summary>
    public static string DirectionOf(ShortlistEntry entry, ScreenResult result)
    {
        ArgumentNullException.ThrowIfNull(entry);
        return entry.Univariate is { } row ? DirectionText(row) : DirectionOf(result, entry.Forest.FeatureIndex);
    }

    /// <summary>A shortlisted marker's single-marker effect: its AUC, Spearman's rho or Harrell's C.</summary>
    public static double EffectOf(ShortlistEntry entry)
    {
        ArgumentNullException.ThrowIfNull(entry);
        return entry.Measured?.Rho ?? entry.FollowUp?.Concordance.Concordance ?? entry.Univariate!.Auc;
    }

    /// <summary>A feature's direction in words for any outcome kind (for classes, against the first contrast).</summary>
    public static string DirectionOf(ScreenResult result, int featureIndex)
    {
        ArgumentNullException.ThrowIfNull(result);
        return result.Kind switch
        {
            OutcomeKind.Measured => result.MeasuredMarkers[featureIndex].Direction,
            OutcomeKind.TimeToEvent => result.FollowUpMarkers[featureIndex].Direction,
            _ => DirectionText(result.Univariate.Row(featureIndex, 0)),
        };
    }

    /// <summary>"higher in case" style text: what a lab reads first about a marker.</summary>
    public static string DirectionText(MarkerStatistics row) => row.Direction switch
    {
        EffectDirection.Higher => $"higher in {row.ContrastClass}",
        EffectDirection.Lower => $"lower in {row.ContrastClass}",
        EffectDirection.NoDifference => "no difference",
        _ => "undetermined",
    };
}
