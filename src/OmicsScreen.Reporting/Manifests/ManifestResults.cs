using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>The headline results of a screen; a value that does not exist (NaN) is null.</summary>
public sealed record ManifestResults
{
    public required int Shortlisted { get; init; }
    public required string ShortlistRule { get; init; }
    public int? RecommendedPanelSize { get; init; }
    public required int LockedPanelSize { get; init; }
    public double? LockedPanelSelectionAwareEstimate { get; init; }
    public required int DecoysPassing { get; init; }
    public double? ExpectedFalseMarkers { get; init; }
    public double? DecoyFalseDiscoveryRate { get; init; }
    public double? DecoyFalseDiscoveryBound { get; init; }
    public required double ExpectedFalseSelectionsBound { get; init; }
    public required double SelectionStability { get; init; }
    public double? ShortlistLengthStability { get; init; }
    public required double ReferenceOutOfBagError { get; init; }
    public double? ReferenceOutOfBagAuc { get; init; }

    /// <summary>Out-of-bag R² of a measured outcome's reference forest; absent for other kinds.</summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public double? ReferenceOutOfBagRSquared { get; init; }

    /// <summary>Out-of-bag Harrell's C of a time-to-event outcome's reference forest; absent for other kinds.</summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public double? ReferenceOutOfBagConcordance { get; init; }

    /// <summary>
    /// Selection-aware held-out RMSE (outcome units, mean over outer folds) at the recommended
    /// panel size of a measured outcome's curve; absent for other kinds and without a curve.
    /// </summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public double? RecommendedPanelSizeSelectionAwareRmse { get; init; }

    /// <summary>Each shortlisted marker's effect shape and forest partners (issue 19).</summary>
    public ManifestEffects? Effects { get; init; }

    /// <summary>What the panel adds over the covariates of --covariates; absent without them.</summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public ManifestAddedValue? AddedValue { get; init; }

    /// <summary>Shortlisted markers that only track a covariate, each with the covariates it tracks; absent without covariates.</summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public IReadOnlyDictionary<string, IReadOnlyList<string>>? TrackingMarkers { get; init; }

    public static ManifestResults Of(ScreenResult result) => new()
    {
        Effects = ManifestEffects.Of(result),
        AddedValue = result.AddedValue is { } added ? ManifestAddedValue.Of(added) : null,
        TrackingMarkers = result.CovariateTracking is { } tracking
            ? tracking.Markers.Where(m => m.Tracks.Count > 0).ToDictionary(m => m.Marker, m => m.Tracks, StringComparer.Ordinal)
            : null,
        Shortlisted = result.Shortlist.Count,
        ShortlistRule = result.Settings.Options.Rule == Screening.Screen.ShortlistRule.QValue ? "q-value" : "decoy-bound",
        RecommendedPanelSize = result.PanelSize?.RecommendedSize,
        LockedPanelSize = result.LockedPanelSize,
        LockedPanelSelectionAwareEstimate = NullWhenNaN(result.LockedPanelEstimate),
        DecoysPassing = result.Decoys.DecoysPassing,
        ExpectedFalseMarkers = NullWhenNaN(result.Decoys.ExpectedFalseMarkers),
        DecoyFalseDiscoveryRate = NullWhenNaN(result.Decoys.EstimatedFalseDiscoveryRate),
        DecoyFalseDiscoveryBound = NullWhenNaN(result.Decoys.FalseDiscoveryBound),
        ExpectedFalseSelectionsBound = result.Stability.ExpectedFalseSelectionsBound,
        SelectionStability = result.Stability.Stability.Stability,
        ShortlistLengthStability = NullWhenNaN(result.Stability.ListStability.Stability),
        ReferenceOutOfBagError = result.ReferenceForest.OutOfBagError,
        ReferenceOutOfBagAuc = result.ReferenceForest.OutOfBagAuc,
        ReferenceOutOfBagRSquared = result.ReferenceForest.OutOfBagRSquared,
        ReferenceOutOfBagConcordance = result.ReferenceForest.OutOfBagConcordance,
        RecommendedPanelSizeSelectionAwareRmse = result.PanelSize is { Metric: "r_squared" } curve
            ? NullWhenNaN(curve.Points.FirstOrDefault(p => p.PanelSize == curve.RecommendedSize)?.SelectionAwareRootMeanSquaredError ?? double.NaN)
            : null,
    };

    private static double? NullWhenNaN(double value) => double.IsNaN(value) ? null : value;
}
