using OmicsScreen.Engine.Panels;
using OmicsScreen.Data;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Results;

/// <summary>Fills a screen's <see cref="ScreenManifest"/> from the run: how the panel was loaded, the result and the timings.</summary>
public static class ScreenManifestBuilder
{
    public static ScreenManifest Build(IReadOnlyList<string> commandLine, PanelLoadOptions panelOptions, LoadedPanel loaded, ScreenResult result,
        DateTimeOffset started, DateTimeOffset finished, double loadSeconds, IReadOnlyList<string> outputs, IReadOnlyList<string> warnings,
        int mergedParts = 0)
    {
        var panel = loaded.Panel;
        bool classes = panel.Kind == OutcomeKind.Classes;
        var seconds = result.StageSeconds.ToDictionary(kv => StageKey(kv.Key), kv => Math.Round(kv.Value, 3));
        seconds["loading"] = Math.Round(loadSeconds, 3);
        return new ScreenManifest
        {
            Version = ToolVersion.Current,
            CommandLine = ShellWords.Join(commandLine),
            MergedFromParts = mergedParts > 0 ? mergedParts : null,
            StartedUtc = started.ToString("O"),
            FinishedUtc = finished.ToString("O"),
            Cores = Environment.ProcessorCount,
            Threads = result.Settings.ThreadCount,
            Seconds = seconds,
            Inputs = loaded.Inputs.Select(i => new ManifestInput(i.Path, i.ByteCount, i.Sha256)).ToArray(),
            Panel = new ManifestPanel
            {
                Samples = panel.SampleCount,
                Features = panel.FeatureCount,
                OutcomeKind = panel.Kind switch
                {
                    OutcomeKind.Measured => "measured",
                    OutcomeKind.TimeToEvent => "time_to_event",
                    _ => "classes",
                },
                OutcomeColumn = panel.OutcomeColumn,
                EventColumn = panel.FollowUp?.EventColumn,
                Events = panel.FollowUp?.EventCount,
                Censored = panel.FollowUp is { } followUp ? followUp.SampleCount - followUp.EventCount : null,
                Classes = classes ? panel.Outcome.ClassNames.Select((name, c) => new ManifestClass(name, panel.Outcome.ClassCounts[c])).ToArray() : null,
                PositiveClass = classes ? panel.Outcome.ClassNames[panel.Outcome.PositiveClass] : null,
                CohortColumn = panel.Cohort?.ColumnName,
                SubjectColumn = panel.Subject?.ColumnName,
                Covariates = panel.Covariates.Count > 0 ? panel.Covariates.Select(c => c.Name).ToArray() : null,
                FeaturesInRows = panelOptions.Layout == PanelLayout.FeaturesInRows,
                LongTable = panelOptions.Layout == PanelLayout.Long,
                FeatureBlock = panelOptions.FeatureBlock?.ToString(),
                FeaturesKeptFromList = panelOptions.KeepFeatures?.Count,
                DroppedSamples = loaded.Inspection.DroppedSamples.Count,
            },
            Parameters = ScreenParameters.All.ToDictionary(p => p.Key, p => p.Value(result.Settings), StringComparer.Ordinal),
            Resolved = ManifestResolved.Of(result),
            Results = ManifestResults.Of(result),
            Outputs = outputs,
            Warnings = warnings,
        };
    }

    private static string StageKey(ScreenStage stage) => stage switch
    {
        ScreenStage.Binning => "binning",
        ScreenStage.UnivariateStatistics => "univariate_statistics",
        ScreenStage.ReferenceForest => "reference_forest",
        ScreenStage.Repeats => "repeats",
        ScreenStage.OutcomePermutations => "outcome_permutations",
        ScreenStage.Effects => "effects",
        ScreenStage.PanelSizeCurve => "panel_size_curve",
        ScreenStage.Cohorts => "cohorts",
        ScreenStage.WorkUnits => "work_units",
        _ => stage.ToString(),
    };
}
