using System.Text.Json.Serialization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Data;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// What `screen --json` prints on standard output: the headline results a pipeline reads next,
/// with the same names as the manifest and the tables. Everything else is in the results folder.
/// </summary>
public sealed record ScreenHeadline
{
    public required string ResultsFolder { get; init; }
    public required string Report { get; init; }
    /// <summary>Where the locked panel is; absent for measured and time-to-event outcomes, whose panels are not written in this version.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public required string? LockedPanelFile { get; init; }
    public required int Samples { get; init; }
    public required int Features { get; init; }
    public required int Repeats { get; init; }
    public required int TreesPerForest { get; init; }
    public required ulong Seed { get; init; }
    /// <summary>classes, measured or time_to_event.</summary>
    public required OutcomeKind OutcomeKind { get; init; }

    public required double OutOfBagError { get; init; }

    /// <summary>Out-of-bag R² of a measured outcome; absent for other kinds.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public double? OutOfBagRSquared { get; init; }

    /// <summary>Out-of-bag Harrell's C of follow-up; absent for other kinds.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public double? OutOfBagConcordance { get; init; }
    public required double? OutOfBagAuc { get; init; }
    public required double MinFrequency { get; init; }
    public required double MaxQ { get; init; }
    public required IReadOnlyList<ShortlistedMarker> Shortlist { get; init; }
    public required int? RecommendedPanelSize { get; init; }
    public required int LockedPanelSize { get; init; }
    public required IReadOnlyList<string> LockedPanel { get; init; }

    /// <summary>The locked markers' lab-facing names by id, as locked_panel.json records them; empty without display names.</summary>
    public required IReadOnlyDictionary<string, string> LockedPanelDisplayNames { get; init; }

    public required double LockedPanelEstimate { get; init; }

    /// <summary>What the panel adds over the covariates of --covariates (as in the manifest's results); absent without them.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public Reporting.Manifests.ManifestAddedValue? AddedValue { get; init; }

    /// <summary>One shortlisted marker, with the columns of shortlist.tsv a reader needs first; DisplayName is null when the inputs name none.</summary>
    public sealed record ShortlistedMarker(int Rank, string Feature, string? DisplayName, double SelectionFrequency, double MedianRank,
        double QValue, string Direction, double? Auc, int RedundancyGroup)
    {
        /// <summary>Spearman's rho with a measured outcome; absent for other kinds.</summary>
        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public double? SpearmanRho { get; init; }

        /// <summary>Harrell's C of the marker against follow-up; absent for other kinds.</summary>
        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public double? Concordance { get; init; }

        /// <summary>The shape of the forest's partial dependence on the marker, in words (shortlist.tsv's effect_shape).</summary>
        public string EffectShape { get; init; } = "";

        /// <summary>The marker's named forest partners, strongest first (shortlist.tsv's forest_partners).</summary>
        public IReadOnlyList<string> ForestPartners { get; init; } = [];
        /// <summary>The covariates the marker only tracks (covariate_association.tsv); absent without covariates.</summary>
        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public IReadOnlyList<string>? Tracks { get; init; }
    }

    public static ScreenHeadline Of(LoadedPanel loaded, ScreenResult result, string folder)
    {
        var options = result.Settings.Options;
        var labels = MarkerLabels.Of(loaded);
        var lockedPanel = result.Shortlist.Take(result.LockedPanelSize).Select(e => e.Forest.Feature).ToList();
        return new ScreenHeadline
        {
            ResultsFolder = folder,
            Report = Path.Combine(folder, ScreenRun.ReportFileName),
            // Class headlines always named the file; for the other kinds it is named when one was written.
            LockedPanelFile = result.Kind == OutcomeKind.Classes || result.LockedPanelSize > 0 ? Path.Combine(folder, Runs.Locking.LockedPanelFile.DefaultFileName) : null,
            Samples = loaded.Panel.SampleCount,
            Features = loaded.Panel.FeatureCount,
            Repeats = result.Settings.RepeatCount,
            TreesPerForest = options.TreesPerForest,
            Seed = options.Seed,
            OutcomeKind = result.Kind,
            OutOfBagError = result.ReferenceForest.OutOfBagError,
            OutOfBagRSquared = result.ReferenceForest.OutOfBagRSquared,
            OutOfBagConcordance = result.ReferenceForest.OutOfBagConcordance,
            OutOfBagAuc = result.ReferenceForest.OutOfBagAuc,
            MinFrequency = options.FrequencyThreshold,
            MaxQ = options.QValueThreshold,
            Shortlist = result.Shortlist.Select(e => new ShortlistedMarker(e.Rank, e.Forest.Feature, NameOrNull(labels, e.Forest.FeatureIndex),
                e.Forest.SelectionFrequency, e.Forest.MedianRank, e.Forest.QValue, ScreenTables.DirectionOf(e, result), e.Univariate?.Auc,
                e.RedundancyGroup)
            {
                SpearmanRho = e.Measured?.Rho,
                Concordance = e.FollowUp?.Concordance.Concordance,
                EffectShape = result.Effects.Of(e.Forest.FeatureIndex)?.Shape.Description ?? "",
                ForestPartners = EffectTables.PartnerNames(result, e.Forest.FeatureIndex).ToArray(),
                Tracks = result.CovariateTracking?.TracksOf(e.Forest.FeatureIndex),
            }).ToList(),
            RecommendedPanelSize = result.PanelSize?.RecommendedSize,
            LockedPanelSize = result.LockedPanelSize,
            LockedPanel = lockedPanel,
            LockedPanelDisplayNames = MarkerLabels.DisplayNames(loaded, lockedPanel) is { } names
                ? names.ToDictionary(p => p.Key, p => p.Value!.GetValue<string>(), StringComparer.Ordinal)
                : new Dictionary<string, string>(StringComparer.Ordinal),
            LockedPanelEstimate = result.LockedPanelEstimate,
            AddedValue = result.AddedValue is { } added ? Reporting.Manifests.ManifestAddedValue.Of(added) : null,
        };
    }

    private static string? NameOrNull(FeatureLabels labels, int featureIndex) =>
        labels.HasDisplayNames && labels.DisplayName(featureIndex) is { Length: > 0 } name ? name : null;
}
