using System.Security.Cryptography;
using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Univariate;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Results;

/// <summary>
/// Writes every table, the locked panel, the report and (last) the manifest of a finished
/// screen: the same for a single run and for merged parts. Prints nothing; the front end
/// summarises the result from what it returns.
/// </summary>
public static class ScreenResultsWriter
{
    /// <param name="mergedParts">How many parts the result was merged from; 0 for a single run.</param>
    public static ScreenResultsWritten Write(ScreenResultsRequest request, LoadedPanel loaded, ScreenResult result,
        ResultsFolder folder, DateTimeOffset started, double loadSeconds, int mergedParts)
    {
        var labels = MarkerLabels.Of(loaded);
        folder.WriteText("shortlist.tsv", w => ScreenTables.WriteShortlist(w, result, labels));
        folder.WriteText("features.tsv", w => ScreenTables.WriteFeatures(w, result, labels));
        if (result.PanelSize is { } curve) folder.WriteText("panel_size_curve.tsv", w => ScreenTables.WritePanelSizeCurve(w, curve));
        folder.WriteText(EffectTables.FileName, w => EffectTables.WriteEffectShapes(w, result));
        switch (result.Kind)
        {
            case OutcomeKind.Measured:
                folder.WriteText("marker_statistics.tsv", w => OutcomeMarkerTableWriter.WriteMeasured(w, result.MeasuredMarkers));
                break;
            case OutcomeKind.TimeToEvent:
                folder.WriteText("marker_statistics.tsv", w => OutcomeMarkerTableWriter.WriteFollowUp(w, result.FollowUpMarkers));
                break;
            default:
                folder.WriteText("marker_statistics.tsv", w => UnivariateTableWriter.WriteAllSamples(w, result.Univariate));
                break;
        }
        if (result.Univariate.PerCohort.Count > 0)
            folder.WriteText("marker_statistics_by_cohort.tsv", w => UnivariateTableWriter.WritePerCohort(w, result.Univariate));
        if (result.Cohorts is { } cohorts) CohortTableFiles.Write(folder, cohorts);
        if (result.AddedValue is { } added) folder.WriteText(AddedValueTables.FileName, w => AddedValueTables.Write(w, added));
        if (result.CovariateTracking is { } tracking) folder.WriteText(CovariateTrackingTables.FileName, w => CovariateTrackingTables.Write(w, tracking));
        // The shortlist (or its prefix the curve recommends), locked for scoring new cohorts with
        // `apply`, for every outcome kind; an empty shortlist locks nothing.
        LockedPanelWritten? locked = null;
        if (result.LockedPanelSize > 0)
        {
            locked = PanelLocking.Lock(folder.Path, loaded, result);
            folder.WrittenFiles.Add(locked.FileName);
        }
        var finished = DateTimeOffset.UtcNow;
        var report = ReportInput(request, loaded, result, folder, started, finished, loadSeconds)
            with { MergedParts = mergedParts, LockedRiskGroups = locked?.DiscoveryRiskGroups };
        folder.WriteText(ScreenResultFiles.Report, w => w.Write(ScreenReport.Render(report)));
        var manifest = ScreenManifestBuilder.Build(request.CommandLine, request.Panel, loaded, result, started, finished, loadSeconds,
            folder.WrittenFiles, ScreenWarnings.Of(request.Screen, loaded), mergedParts);
        folder.WriteText(ResultsFolder.ManifestFileName, w => ManifestJson.Write(w, manifest));
        return new ScreenResultsWritten(folder.Path, Path.Combine(folder.Path, ScreenResultFiles.Report),
            locked is null ? null : Path.Combine(folder.Path, locked.FileName));
    }

    /// <summary>What the report shows: the run's provenance, with the SHA-256 of every table already written beside it.</summary>
    private static ScreenReportInput ReportInput(ScreenResultsRequest request, LoadedPanel loaded, ScreenResult result, ResultsFolder folder,
        DateTimeOffset started, DateTimeOffset finished, double loadSeconds)
    {
        var inputs = new List<ReportedFile>(loaded.Inputs.Count);
        for (int i = 0; i < loaded.Inputs.Count; i++)
            inputs.Add(new ReportedFile(i == 0 ? "matrix" : loaded.Inputs[i].Path == request.Panel.FeatureSheetPath ? "feature sheet" : "sample sheet",
                loaded.Inputs[i].Path, loaded.Inputs[i].Sha256));
        var tables = new List<ReportedFile>(folder.WrittenFiles.Count);
        foreach (var name in folder.WrittenFiles)
        {
            using var stream = File.OpenRead(Path.Combine(folder.Path, name));
            tables.Add(new ReportedFile("result table", name, Convert.ToHexStringLower(SHA256.HashData(stream))));
        }
        int threads = result.Settings.ThreadCount;
        return new ScreenReportInput(loaded.Panel, result, inputs, LayoutText(request.Panel), tables,
            ShellWords.Join(request.CommandLine), ToolVersion.Current, started, finished, loadSeconds,
            Environment.ProcessorCount, threads, request.ShowSampleIds,
            Warnings: ScreenWarnings.Of(request.Screen, loaded, withSampleIds: request.ShowSampleIds),
            Labels: MarkerLabels.Of(loaded));
    }

    /// <summary>The layout, and any feature block or list the panel was narrowed to, with what that means for the error control.</summary>
    private static string LayoutText(PanelLoadOptions panel)
    {
        string text = panel.Layout switch
        {
            PanelLayout.SamplesInRows => "samples in rows",
            PanelLayout.FeaturesInRows => "features in rows (--features-in-rows)",
            _ => "long table, one row per sample and feature (--long)",
        };
        if (panel.FeatureBlock is { } block) text += $"; feature block {block} only";
        if (panel.KeepFeatures is { } keep)
            text += $"; only {keep.Count} features from a list (when the list was chosen on these samples, "
                + "the q-values and the selection-aware curve do not account for that choice)";
        return text;
    }
}
