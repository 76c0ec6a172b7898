using OmicsScreen.Data;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Runs;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// The provenance of a screen: inputs with their SHA-256, the software version, every
/// parameter (defaults included) and seed, the command line to repeat it, and timings.
/// </summary>
internal static class ScreenManifest
{
    public static object Build(ScreenRunOptions options, LoadedPanel loaded, ScreenResult result, DateTimeOffset started,
        DateTimeOffset finished, double loadSeconds, IReadOnlyList<string> outputs, IReadOnlyList<string> warnings, int mergedParts = 0)
    {
        var panel = loaded.Panel;
        var settings = result.Settings;
        return new
        {
            tool = "omicsscreen",
            version = ToolVersion.Current,
            command_line = string.Join(' ', options.CommandLine.Select(ShellQuote)),
            // A merged run names its part count; its command line is the single run it equals.
            merged_from_parts = mergedParts > 0 ? mergedParts : (int?)null,
            started_utc = started.ToString("O"),
            finished_utc = finished.ToString("O"),
            cores = Environment.ProcessorCount,
            threads = settings.ThreadCount,
            seconds = new Dictionary<string, double>(result.StageSeconds.ToDictionary(kv => StageKey(kv.Key), kv => Math.Round(kv.Value, 3)))
            {
                ["loading"] = Math.Round(loadSeconds, 3),
            },
            inputs = loaded.Inputs.Select(i => new { path = i.Path, bytes = i.ByteCount, sha256 = i.Sha256 }).ToArray(),
            panel = new
            {
                samples = panel.SampleCount,
                features = panel.FeatureCount,
                outcome_column = panel.Outcome.ColumnName,
                classes = panel.Outcome.ClassNames.Select((name, c) => new { name, samples = panel.Outcome.ClassCounts[c] }).ToArray(),
                positive_class = panel.Outcome.ClassNames[panel.Outcome.PositiveClass],
                cohort_column = panel.Cohort?.ColumnName,
                subject_column = panel.Subject?.ColumnName,
                features_in_rows = options.Panel.Layout == PanelLayout.FeaturesInRows,
                long_table = options.Panel.Layout == PanelLayout.Long,
                feature_block = options.Panel.FeatureBlock?.ToString(),
                features_kept_from_list = options.Panel.KeepFeatures?.Count,
                dropped_samples = loaded.Inspection.DroppedSamples.Count,
            },
            // One key per option of `screen` (the option without its dashes), with automatic values resolved.
            parameters = ScreenParameters.All.ToDictionary(p => p.Key, p => p.Value(settings), StringComparer.Ordinal),
            resolved = new
            {
                class_balanced = settings.ClassBalanced,
                // parameters.features_per_split is the clean forests' value; the wider forests resolve on their own width.
                features_per_split_corrected_forest = settings.CorrectedForestFeaturesPerSplit,
                features_per_split_outcome_permutation_forest = settings.OutcomePermutationForestFeaturesPerSplit > 0
                    ? settings.OutcomePermutationForestFeaturesPerSplit : (int?)null,
                mean_selected_per_repeat = result.Stability.MeanSelectedPerRepeat,
                repeats = settings.RepeatCount,
            },
            results = new
            {
                shortlisted = result.Shortlist.Count,
                shortlist_rule = settings.Options.Rule == ShortlistRule.QValue ? "q-value" : "decoy-bound",
                recommended_panel_size = result.PanelSize?.RecommendedSize,
                locked_panel_size = result.LockedPanelSize,
                locked_panel_selection_aware_estimate = double.IsNaN(result.LockedPanelEstimate) ? (double?)null : result.LockedPanelEstimate,
                decoys_passing = result.Decoys.DecoysPassing,
                expected_false_markers = double.IsNaN(result.Decoys.ExpectedFalseMarkers) ? (double?)null : result.Decoys.ExpectedFalseMarkers,
                decoy_false_discovery_rate = double.IsNaN(result.Decoys.EstimatedFalseDiscoveryRate) ? (double?)null : result.Decoys.EstimatedFalseDiscoveryRate,
                decoy_false_discovery_bound = double.IsNaN(result.Decoys.FalseDiscoveryBound) ? (double?)null : result.Decoys.FalseDiscoveryBound,
                expected_false_selections_bound = result.Stability.ExpectedFalseSelectionsBound,
                selection_stability = result.Stability.Stability.Stability,
                shortlist_length_stability = double.IsNaN(result.Stability.ListStability.Stability) ? (double?)null : result.Stability.ListStability.Stability,
                reference_out_of_bag_error = result.ReferenceForest.OutOfBagError,
                reference_out_of_bag_auc = result.ReferenceForest.OutOfBagAuc,
            },
            outputs,
            // The loader's warnings and the settings that are legal but weak, as printed before the run.
            warnings,
            caution = "Research use only. A screen is not a diagnostic test; confirm markers in independent cohorts and follow local ethics, data-protection rules and licensed clinical practice.",
        };
    }

    private static string StageKey(ScreenStage stage) => stage switch
    {
        ScreenStage.Binning => "binning",
        ScreenStage.UnivariateStatistics => "univariate_statistics",
        ScreenStage.ReferenceForest => "reference_forest",
        ScreenStage.Repeats => "repeats",
        ScreenStage.OutcomePermutations => "outcome_permutations",
        ScreenStage.PanelSizeCurve => "panel_size_curve",
        ScreenStage.Cohorts => "cohorts",
        ScreenStage.WorkUnits => "work_units",
        _ => stage.ToString(),
    };

    /// <summary>POSIX single quotes where a word needs them, so the line can be pasted into a shell.</summary>
    internal static string ShellQuote(string word) =>
        word.Length > 0 && word.All(c => char.IsAsciiLetterOrDigit(c) || "-_./=:,+@".Contains(c))
            ? word
            : "'" + word.Replace("'", "'\\''") + "'";
}
