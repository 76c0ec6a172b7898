using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>The tables of the screen report; every cell is plain text that <see cref="HtmlBuilder"/> encodes.</summary>
internal static class ScreenReportTables
{
    public const string ShortlistCaption = "Shortlisted markers";
    public const string ShortlistStatisticsCaption = "Shortlisted markers: single-marker statistics";
    public const string LockedPanelCaption = "Markers of the locked panel";
    public const int FallbackFeatureCount = 10;
    public const string TracksHeader = "Only tracks";

    /// <summary>
    /// The forest evidence of each shortlisted marker. The shortlist is split in two tables (this
    /// one and <see cref="ShortlistStatistics"/>), each with rank and feature, because its twelve
    /// columns did not fit a 1,280-pixel window or an A4 page.
    /// </summary>
    public static HtmlTable Shortlist(ScreenResult result, FeatureLabels labels)
    {
        // Numeric headers do not wrap (the style sheet keeps figures on one line), so the wide
        // columns are text columns with wrapping headers.
        // With --covariates, the covariates each marker only tracks (shortlist.tsv's tracks; see
        // "Markers that track a covariate"), beside the group so a proxy is seen before its figures.
        var tracking = result.CovariateTracking;
        var headers = new List<HtmlTableColumn>
        {
            new("Rank", ColumnAlignment.Numeric),
            new(labels.HasDisplayNames ? "Marker (feature id)" : "Feature"),
            new("Group", ColumnAlignment.Numeric),
        };
        if (tracking is not null) headers.Add(new(TracksHeader));
        headers.AddRange(
        [
            new("Selection frequency"),
            new("Median rank [IQR]"),
            new("Corrected importance ± SD"),
            new("Permutation importance ± SD"),
            new("q-value", ColumnAlignment.Numeric),
        ]);
        var table = new HtmlTable(ShortlistCaption, headers) { FirstColumnIsRowHeader = false };
        foreach (var entry in result.Shortlist)
        {
            var forest = entry.Forest;
            var cells = new List<string>
            {
                ReportNumber.Integer(entry.Rank),
                labels.Label(forest.FeatureIndex, forest.Feature),
                ReportNumber.Integer(entry.RedundancyGroup),
            };
            if (tracking is not null) cells.Add(string.Join(", ", tracking.TracksOf(forest.FeatureIndex)));
            cells.Add(ReportNumber.Fixed(forest.SelectionFrequency, 2));
            cells.Add(MedianRank(forest));
            cells.Add(ReportNumber.MeanSd(forest.CorrectedMean, forest.CorrectedSd, 2));
            cells.Add(ReportNumber.MeanSd(forest.PermutationMean, forest.PermutationSd, 2));
            cells.Add(ReportNumber.Significant(forest.QValue, 2));
            table.AddRow([.. cells]);
        }
        return table;
    }

    /// <summary>Each shortlisted marker on its own: direction, effect size with its interval, and its rank by the univariate test among all features.</summary>
    public static HtmlTable ShortlistStatistics(ScreenResult result, FeatureLabels labels)
    {
        string[] effects = result.Kind switch
        {
            OutcomeKind.Measured => ["Spearman rho [95% CI]"],
            OutcomeKind.TimeToEvent => ["Harrell's C [95% CI]", "Hazard ratio per SD [95% CI]"],
            _ => ["log2 ratio", "AUC [95% CI]"],
        };
        var headers = new List<HtmlTableColumn>
        {
            new("Rank", ColumnAlignment.Numeric),
            new(labels.HasDisplayNames ? "Marker (feature id)" : "Feature"),
            new("Direction"),
        };
        headers.AddRange(effects.Select(e => new HtmlTableColumn(e, e == "log2 ratio" ? ColumnAlignment.Numeric : ColumnAlignment.Text)));
        headers.Add(new("Univariate rank", ColumnAlignment.Numeric));
        if (result.Kind == OutcomeKind.Classes) headers.Add(new("Acts with"));
        headers.Add(new("Partners in the forest"));
        var table = new HtmlTable(ShortlistStatisticsCaption, headers) { FirstColumnIsRowHeader = false };
        foreach (var entry in result.Shortlist)
        {
            var cells = new List<string>
            {
                ReportNumber.Integer(entry.Rank),
                labels.Label(entry.Forest.FeatureIndex, entry.Forest.Feature),
                EffectTables.DirectionWords(entry, result),
            };
            switch (result.Kind)
            {
                case OutcomeKind.Measured:
                    var measured = entry.Measured!;
                    cells.Add(WithInterval(measured.Rho, measured.Interval.Lower, measured.Interval.Upper, 3));
                    break;
                case OutcomeKind.TimeToEvent:
                    var followUp = entry.FollowUp!;
                    cells.Add(WithInterval(followUp.Concordance.Concordance, followUp.Concordance.Interval.Lower, followUp.Concordance.Interval.Upper, 3));
                    cells.Add(ReportNumber.Significant(followUp.HazardRatioPerSd, 3) + " [" + ReportNumber.Significant(followUp.HazardRatioInterval.Lower, 3)
                        + ", " + ReportNumber.Significant(followUp.HazardRatioInterval.Upper, 3) + "]");
                    break;
                default:
                    var univariate = entry.Univariate!;
                    cells.Add(ReportNumber.Fixed(univariate.Log2MedianRatio, 2));
                    cells.Add(WithInterval(univariate.Auc, univariate.AucInterval.Lower, univariate.AucInterval.Upper, 3));
                    break;
            }
            cells.Add(ReportNumber.Integer(entry.UnivariateRank));
            if (result.Kind == OutcomeKind.Classes)
            {
                int partner = ActsWith(entry.Forest);
                cells.Add(partner < 0 ? "" : labels.Label(partner, result.Features[partner].Feature));
            }
            cells.Add(string.Join(", ", result.Effects.Of(entry.Forest.FeatureIndex)?.Partners.Select(p => labels.Label(p, result.Features[p].Feature)) ?? []));
            table.AddRow([.. cells]);
        }
        return table;
    }

    private static string WithInterval(double value, double lower, double upper, int decimals) =>
        ReportNumber.Fixed(value, decimals) + " [" + ReportNumber.Fixed(lower, decimals) + ", " + ReportNumber.Fixed(upper, decimals) + "]";

    /// <summary>
    /// The partner the interaction scan names for a marker whose evidence lies in the pair rather
    /// than in a shift of its own (scan p-value at most 0.05 and below the rank test's); -1
    /// otherwise. For such a marker the direction and AUC alone tell the lab nothing true: it acts
    /// through its partner (same side of both medians against one of each).
    /// </summary>
    public static int ActsWith(FeatureSummary feature)
    {
        ArgumentNullException.ThrowIfNull(feature);
        if (feature.InteractionPartner < 0 || !(feature.InteractionP <= 0.05)) return -1;
        return double.IsNaN(feature.RankTestP) || feature.InteractionP < feature.RankTestP ? feature.InteractionPartner : -1;
    }

    /// <summary>
    /// The markers `apply` scores with: the first <see cref="ScreenResult.LockedPanelSize"/> of the
    /// screen order, as the locker takes them. Each has its role: the first locked member of a
    /// redundancy group leads it, a later one measures much the same signal as that lead, and a
    /// marker past the end of the shortlist is named as such.
    /// </summary>
    public static HtmlTable LockedPanel(ScreenResult result, FeatureLabels labels)
    {
        var table = new HtmlTable(LockedPanelCaption,
        [
            new("Order", ColumnAlignment.Numeric),
            new(labels.HasDisplayNames ? "Marker (feature id)" : "Feature"),
            new("Role"),
            new("Direction"),
        ])
        { FirstColumnIsRowHeader = false };
        var leads = new Dictionary<int, string>();
        // The locked panel is the first markers of the shortlist (never a marker that failed error control).
        int size = Math.Min(result.LockedPanelSize, result.Shortlist.Count);
        for (int i = 0; i < size; i++)
        {
            var entry = result.Shortlist[i];
            int featureIndex = entry.Forest.FeatureIndex;
            string feature = labels.Label(featureIndex, entry.Forest.Feature);
            string role;
            {
                if (leads.TryGetValue(entry.RedundancyGroup, out var lead))
                    role = "also in redundancy group " + ReportNumber.Integer(entry.RedundancyGroup) + ", correlated with " + lead;
                else
                {
                    leads.Add(entry.RedundancyGroup, feature);
                    int members = result.Shortlist.Count(e => e.RedundancyGroup == entry.RedundancyGroup);
                    role = members > 1
                        ? "leads redundancy group " + ReportNumber.Integer(entry.RedundancyGroup) + " (" + ReportNumber.Integer(members) + " shortlisted members)"
                        : "shortlisted, alone in its redundancy group";
                }
            }
            table.AddRow(ReportNumber.Integer(i + 1), feature, role, ScreenTables.DirectionOf(result, featureIndex));
        }
        return table;
    }

    /// <summary>When nothing passed: the first features of the screen order, labelled as not shortlisted.</summary>
    public static HtmlTable NotShortlisted(ScreenResult result, FeatureLabels labels)
    {
        var top = ScreenReportCharts.TopFeatures(result, FallbackFeatureCount);
        var table = new HtmlTable("NOT shortlisted: the first " + ReportNumber.Integer(top.Count) + " features of the screen order, for orientation only",
        [
            new("Order", ColumnAlignment.Numeric),
            new(labels.HasDisplayNames ? "Marker (feature id)" : "Feature"),
            new("Selection frequency", ColumnAlignment.Numeric),
            new("Median rank [IQR]", ColumnAlignment.Text),
            new("Corrected importance ± SD", ColumnAlignment.Text),
            new("Permutation importance ± SD", ColumnAlignment.Text),
            new("q-value", ColumnAlignment.Numeric),
            new("Univariate rank", ColumnAlignment.Numeric),
        ])
        { FirstColumnIsRowHeader = false };
        foreach (var feature in top)
            table.AddRow(
                ReportNumber.Integer(feature.Order),
                labels.Label(feature.FeatureIndex, feature.Feature),
                ReportNumber.Fixed(feature.SelectionFrequency, 2),
                MedianRank(feature),
                ReportNumber.MeanSd(feature.CorrectedMean, feature.CorrectedSd),
                ReportNumber.MeanSd(feature.PermutationMean, feature.PermutationSd),
                ReportNumber.Significant(feature.QValue, 2),
                ReportNumber.Integer(result.UnivariateRanks[feature.FeatureIndex]));
        return table;
    }

    /// <summary>One row per redundancy group, in order of its best member: members that stand in for one another.</summary>
    public static HtmlTable RedundancyGroups(ScreenResult result, FeatureLabels labels)
    {
        var table = new HtmlTable("Redundancy groups of the shortlist",
        [
            new("Group", ColumnAlignment.Numeric),
            new("Members (in shortlist order)"),
            new("Group permutation importance", ColumnAlignment.Numeric),
        ]);
        var groupOrder = new List<int>();
        var members = new Dictionary<int, List<string>>();
        var importance = new Dictionary<int, double>();
        foreach (var entry in result.Shortlist)
        {
            if (!members.TryGetValue(entry.RedundancyGroup, out var names))
            {
                names = [];
                members.Add(entry.RedundancyGroup, names);
                groupOrder.Add(entry.RedundancyGroup);
                importance.Add(entry.RedundancyGroup, entry.GroupPermutationImportance);
            }
            names.Add(labels.Label(entry.Forest.FeatureIndex, entry.Forest.Feature));
        }
        foreach (int group in groupOrder)
            table.AddRow(ReportNumber.Integer(group), string.Join("; ", members[group]), ReportNumber.Significant(importance[group], 3));
        return table;
    }

    /// <summary>
    /// A measured outcome's panel-size curve in numbers: per size the held-out R² (mean ± SD over
    /// outer folds) and RMSE, selection-aware and optimistic.
    /// </summary>
    public static HtmlTable PanelSizeNumbers(PanelSizeCurve curve)
    {
        var table = new HtmlTable("The panel-size curve in numbers (mean over outer folds)",
        [
            new("Markers", ColumnAlignment.Numeric),
            new("Selection-aware R² ± SD", ColumnAlignment.Numeric),
            new("Selection-aware RMSE", ColumnAlignment.Numeric),
            new("Optimistic R²", ColumnAlignment.Numeric),
            new("Optimistic RMSE", ColumnAlignment.Numeric),
        ]);
        foreach (var point in curve.Points)
            table.AddRow(ReportNumber.Integer(point.PanelSize) + (point.PanelSize == curve.RecommendedSize ? " (recommended)" : ""),
                ReportNumber.Fixed(point.SelectionAwareAuc, 3) + " ± " + ReportNumber.Fixed(point.SelectionAwareAucSd, 3),
                ReportNumber.Significant(point.SelectionAwareRootMeanSquaredError, 3),
                ReportNumber.Fixed(point.OptimisticAuc, 3),
                ReportNumber.Significant(point.OptimisticRootMeanSquaredError, 3));
        return table;
    }

    public static HtmlTable Files(string caption, IReadOnlyList<ReportedFile> files)
    {
        var table = new HtmlTable(caption, [new("File", ColumnAlignment.Unbroken), new("Role"), new("SHA-256", ColumnAlignment.Unbroken)]);
        foreach (var file in files) table.AddRow(file.Name, file.Role, file.Sha256);
        return table;
    }

    private static string MedianRank(FeatureSummary feature) =>
        ReportNumber.Fixed(feature.MedianRank, 1) + " [" + ReportNumber.Fixed(feature.RankLowerQuartile, 1) + "–"
            + ReportNumber.Fixed(feature.RankUpperQuartile, 1) + "]";
}
