using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The self-contained HTML report of a screen, written for a lab manager first and a statistician
/// second: the answer in one paragraph, the cautions, what went in, the shortlist, the figures, how
/// to repeat the run, and the methods in plain words with their citations.
/// </summary>
/// <remarks>
/// One XHTML-compatible page built with <see cref="HtmlBuilder"/>: no script, no external resource,
/// charts as inline SVG, every user-provided name encoded. The page is a pure function of its
/// <see cref="ScreenReportInput"/> (no clock, no machine name), so the same input gives the same bytes.
/// Sample identifiers appear only when <see cref="ScreenReportInput.ShowSampleIds"/> is set, and then
/// only inside the strip charts' accessible descriptions and the hover titles of their points.
/// </remarks>
public static class ScreenReport
{
    public const string Title = "Marker screen report";

    public static string Render(ScreenReportInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        var html = new HtmlBuilder().BeginDocument(Title);
        WriteAnswer(html, input);
        html.Caution("Cautions", ScreenReportText.Cautions(input.Result.Cohorts is not null, input.Panel.Kind));
        html.TableOfContents();
        WriteInputs(html, input);
        WriteShortlist(html, input.Result, input);
        WriteLockedPanel(html, input.Result, input);
        if (input.Result.AddedValue is { } added) AddedValueReportSection.Write(html, added);
        if (input.Result.CovariateTracking is { } tracking) CovariateTrackingReportSection.Write(html, tracking);
        WriteFigures(html, input);
        if (input.Result.Cohorts is { } cohorts) CohortReportSection.Write(html, input.Result, cohorts);
        WriteReproducibility(html, input);
        html.BeginSection("Methods in plain words");
        html.BulletList(ScreenReportText.MethodNotesFor(input.Panel.Kind));
        html.EndSection();
        return html.EndDocument();
    }

    private static void WriteAnswer(HtmlBuilder html, ScreenReportInput input)
    {
        var result = input.Result;
        var options = result.Settings.Options;
        html.Paragraph(ScreenReportText.Answer(input.Panel, result));
        if (result.PanelSize is { } curve) html.Paragraph(ScreenReportText.PanelSizeAnswer(curve, options));
        else html.Paragraph("The panel-size curve was not computed for this run (curve folds set to 0), so no panel size is recommended.");
        if (result.AddedValue is { } added) html.Paragraph(AddedValueReportSection.Headline(added));
        if (result.CovariateTracking is { } tracking && tracking.Markers.Any(m => m.Tracks.Count > 0))
            html.Paragraph(CovariateTrackingReportSection.Summary(tracking).Split(". ")[0] + ".");
        html.Paragraph(ScreenReportText.Confidence(result));
    }

    private static void WriteInputs(HtmlBuilder html, ScreenReportInput input)
    {
        var panel = input.Panel;
        var settings = input.Result.Settings;
        var options = settings.Options;
        var (missingShare, belowDetectionShare) = UnmeasuredShares(panel.Matrix);
        html.BeginSection("Input and settings");
        var facts = new List<KeyValuePair<string, string>>();
        foreach (var file in input.Inputs) facts.Add(new(Capitalised(file.Role), file.Name));
        facts.Add(new("Layout", input.PanelLayout));
        facts.Add(new("Samples", ReportNumber.Integer(panel.SampleCount)));
        facts.Add(new("Features", ReportNumber.Integer(panel.FeatureCount)));
        facts.AddRange(OutcomeKindReport.OutcomeFacts(panel));
        if (panel.Covariates.Count > 0)
            facts.Add(new("Covariates", string.Join("; ", panel.Covariates.Select(c => c.IsCategorical
                ? c.Name + " (categorical: " + string.Join(", ", c.Levels) + ")"
                : c.Name + " (numeric)"))));
        facts.Add(new("Cohorts (samples)", panel.Cohort is { } cohort ? cohort.ColumnName + ": " + LevelCounts(cohort) : "none given"));
        if (panel.Subject is { } subject)
            facts.Add(new("Subjects", subject.ColumnName + ": " + ReportNumber.Integer(subject.LevelCount) + " (replicates of a subject are never split)"));
        facts.Add(new("Missing cells", ReportNumber.Percent(missingShare, 2)));
        facts.Add(new("Below-detection cells", ReportNumber.Percent(belowDetectionShare, 2)));
        html.DefinitionList(facts);
        if (input.Warnings is { Count: > 0 } warnings)
        {
            html.Paragraph("Warnings of this run (also in manifest.json):");
            html.BulletList(warnings);
        }
        html.Paragraph("Settings (every one, defaults included; each with the option that sets it):");
        html.DefinitionList(ScreenReportText.Parameters(settings));
        html.EndSection();
    }

    private static void WriteShortlist(HtmlBuilder html, ScreenResult result, ScreenReportInput input)
    {
        html.BeginSection("Shortlist");
        if (result.Shortlist.Count == 0)
        {
            html.Paragraph("No marker was shortlisted: no feature was selected often enough with a small enough q-value. "
                + "The table below shows the first features of the screen order for orientation only; they are NOT shortlisted "
                + "and should not be carried into a validation study on this evidence.");
            html.Table(ScreenReportTables.NotShortlisted(result, input.FeatureLabels));
        }
        else
        {
            html.Paragraph("One row per shortlisted marker, best first, in two tables: the forest evidence, then each marker on its own.");
            html.Table(ScreenReportTables.Shortlist(result, input.FeatureLabels));
            html.Legend("Group: markers sharing a redundancy group are strongly correlated and can stand in for one another. "
                + "Selection frequency: share of repeats that selected the marker. Median rank [IQR]: its rank over repeats, with quartiles.");
            html.Table(ScreenReportTables.ShortlistStatistics(result, input.FeatureLabels));
            html.Legend(OutcomeKindReport.ShortlistLegend(result.Kind) + " " + EffectTables.ShortlistLegend);
        }
        html.EndSection();
    }

    private static void WriteLockedPanel(HtmlBuilder html, ScreenResult result, ScreenReportInput input)
    {
        html.BeginSection("The locked panel");
        if (Math.Min(result.LockedPanelSize, result.Shortlist.Count) > 0)
        {
            html.Paragraph(string.Create(CultureInfo.InvariantCulture,
                $"The panel locked for `omicsscreen apply` ({LockedPanelFileName}) holds these {result.LockedPanelSize} markers, the first of the shortlist."));
            if (result.Kind != OutcomeKind.Classes)
                html.Paragraph(result.Kind == OutcomeKind.Measured
                    ? "Its forest (a regression forest on these markers alone, grown on every discovery sample) predicts the outcome; `apply` reports R², RMSE and the calibration line on a new cohort."
                    : "Its forest (a random survival forest on these markers alone, grown on every discovery sample) gives each sample a risk score, its ensemble mortality, which ranks samples but is not a calibrated survival probability; "
                        + "`apply` splits a new cohort at the discovery median risk score and reports the concordance, a time-dependent AUC at a horizon you name, and the Kaplan-Meier curves of the two risk groups.");
            html.Table(ScreenReportTables.LockedPanel(result, input.FeatureLabels));
            if (result.Kind == OutcomeKind.TimeToEvent && input.LockedRiskGroups is { } groups)
                html.Figure(OutcomeKindReport.DiscoveryRiskGroups(input.Panel, groups), OutcomeKindReport.DiscoveryRiskGroupsCaption(groups));
            if (result.Kind == OutcomeKind.Classes && result.PanelSize is { LockedOutOfFoldScores.Count: > 0 } curve)
                html.Figure(ScreenReportCharts.LockedPanelRoc(curve),
                    "Cross-validated ROC curve of the locking procedure: in every outer fold the screen, its shortlist and the size choice were repeated on the training part only, "
                    + "and the held-out samples were scored by a forest on that fold's panel (every sample of a fold that locked nothing scored alike). "
                    + "The diagonal is chance. It describes the procedure on these samples; the locked panel itself still needs an independent cohort.");
        }
        else
        {
            html.Paragraph("No panel was locked in this run.");
        }
        html.EndSection();
    }

    private const string LockedPanelFileName = "locked_panel.json";

    private static void WriteFigures(HtmlBuilder html, ScreenReportInput input)
    {
        var result = input.Result;
        html.BeginSection("Figures");

        html.BeginSection("Importance of the top features");
        html.Figure(ScreenReportCharts.CorrectedImportance(result),
            "Corrected impurity importance (Nembrini et al. 2018) of the first features in screen order: dot at the mean over repeats, bar ± 1 SD. "
            + "Values near or below 0 are what a feature unrelated to the outcome gets.");
        html.Figure(ScreenReportCharts.PermutationImportance(result),
            "Out-of-bag permutation importance (Breiman 2001) of the same features: " + OutcomeKindReport.PermutationMeaning(result.Kind) + " when the feature's values are shuffled.");
        html.EndSection();

        html.BeginSection("Selection frequency");
        html.Figure(ScreenReportCharts.SelectionFrequency(result),
            "Share of repeats that selected each feature, by position in the screen order. Features above the dashed line (and with a small enough q-value) are shortlisted.");
        html.EndSection();

        if (result.ReferenceForest.ErrorCurve.Count > 0)
        {
            html.BeginSection("Enough trees?");
            html.Figure(ScreenReportCharts.OutOfBagError(result.ReferenceForest, result.Kind), OutcomeKindReport.ErrorCurveCaption(result.Kind));
            html.EndSection();
        }

        if (result.Kind == OutcomeKind.Measured && result.ReferenceForest.OutOfBagPredictions.Count > 0)
        {
            html.BeginSection("Observed against out-of-bag predicted");
            html.Figure(OutcomeKindReport.ObservedAgainstOutOfBag(input.Panel, result.ReferenceForest),
                OutcomeKindReport.ObservedAgainstOutOfBagCaption(input.Panel, result.ReferenceForest));
            html.EndSection();
        }

        if (result.PanelSize is { } curve)
        {
            html.BeginSection("How many markers to measure");
            html.Figure(ScreenReportCharts.PanelSize(curve, input.Panel, result.LockedPanelSize),
                "Solid line: selection-aware estimate, markers chosen afresh inside each outer training part (Ambroise & McLachlan 2002). "
                + "Dashed line: optimistic estimate, markers chosen once on all samples. Shading: ± 1 SD over outer folds. "
                + "The diamond marks the recommended size: the smallest within one standard error of the best (Breiman et al. 1984). "
                + "The size axis is log-spaced, as the sizes tried grow roughly geometrically; the horizontal reference line is chance and the vertical one the locked panel's size.");
            if (curve.Metric == "r_squared")
            {
                html.Table(ScreenReportTables.PanelSizeNumbers(curve));
                html.Legend("RMSE: the held-out root mean squared error in the outcome's units, computed in each outer fold and averaged over folds, beside R² (1 - residual / total sum of squares about the fold's mean). "
                    + "Both are in panel_size_curve.tsv (selection_aware_rmse, optimistic_rmse).");
            }
            html.EndSection();
        }

        var markers = result.Shortlist.Count > 0
            ? ShortlistFeatures(result, ScreenReportCharts.StripMarkerLimit)
            : [];
        if (markers.Count > 0 && result.Kind == OutcomeKind.Measured)
        {
            html.BeginSection("The top markers against the outcome");
            html.Paragraph("Each dot is one sample. Samples with the marker below its detection limit are drawn apart, at the limit (or at the smallest measured value when the file gave no limit). Missing values are left out.");
            foreach (var feature in markers)
                html.Figure(OutcomeKindReport.MarkerAgainstMeasured(input.Panel, feature, input.FeatureLabels.Label(feature.FeatureIndex, feature.Feature)),
                    "Values of " + input.FeatureLabels.Label(feature.FeatureIndex, feature.Feature) + " against " + input.Panel.OutcomeColumn + ".");
            html.EndSection();
        }
        else if (markers.Count > 0 && result.Kind == OutcomeKind.TimeToEvent)
        {
            html.BeginSection("Survival by the top markers");
            html.Paragraph("Kaplan-Meier curves of the samples at or above each marker's median and of those below it (below-detection samples count as below; missing values are left out), "
                + "with the log-rank test of the two halves. A split at the median is for reading only: the screen used the marker's whole range.");
            foreach (var feature in markers)
                html.Figure(OutcomeKindReport.MarkerSurvival(input.Panel, feature, input.FeatureLabels.Label(feature.FeatureIndex, feature.Feature)),
                    "Survival by the high and low halves of " + input.FeatureLabels.Label(feature.FeatureIndex, feature.Feature) + ".");
            html.EndSection();
        }
        else if (markers.Count > 0)
        {
            html.BeginSection("Values of the top markers by class");
            html.Paragraph("Each dot is one sample; boxes show quartiles and the median. Hollow markers are samples below the detection limit: "
                + "on the dashed row at the limit when the file gives it (<0.05), on a row of their own under the axis when it does not (<LOD). Missing values are left out. A log axis is used when every measured value is positive.");
            foreach (var feature in markers)
                html.Figure(ScreenReportCharts.MarkerByClass(input.Panel, feature, input.ShowSampleIds),
                    "Values of " + input.FeatureLabels.Label(feature.FeatureIndex, feature.Feature) + " by class.");
            html.EndSection();
        }

        EffectReportSection.Write(html, input);

        WriteStatisticianFigures(html, input);

        if (result.Shortlist.Count > 0)
        {
            html.BeginSection("Redundancy");
            int count = result.Shortlist.Count;
            if (count >= ScreenReportCharts.HeatMapMinimum && count <= ScreenReportCharts.HeatMapMaximum)
                html.Figure(ScreenReportCharts.Correlations(result),
                    "Spearman correlation between shortlisted markers over all samples; vermillion is positive, blue negative.");
            else
                html.Paragraph(count < ScreenReportCharts.HeatMapMinimum
                    ? "A correlation map needs at least two shortlisted markers."
                    : string.Create(CultureInfo.InvariantCulture, $"The correlation map is left out above {ScreenReportCharts.HeatMapMaximum} markers; the groups below summarise it."));
            html.Paragraph(string.Create(CultureInfo.InvariantCulture,
                $"Markers are grouped when their Spearman |rho| is at least {result.Settings.Options.RedundancyCorrelation:0.##}. Group permutation importance is the out-of-bag accuracy drop when all members of a group are shuffled together."));
            html.Table(ScreenReportTables.RedundancyGroups(result, input.FeatureLabels));
            html.EndSection();
        }
        html.EndSection();
    }

    /// <summary>The figures a statistician checks first: a map of the samples, forest against single-marker evidence, and the decoys.</summary>
    private static void WriteStatisticianFigures(HtmlBuilder html, ScreenReportInput input)
    {
        var result = input.Result;
        var panel = input.Panel;
        if (SamplePrincipalComponents.Of(panel.Matrix) is { } components)
        {
            html.BeginSection("Samples on their first two principal components");
            string features = components.FeaturesUsed < panel.FeatureCount
                ? string.Create(CultureInfo.InvariantCulture, $"the {components.FeaturesUsed} features of largest variance")
                : "all features";
            var (title, names, levels, colouring) = OutcomeKindReport.SampleColouring(panel);
            html.Figure(ScreenReportCharts.SampleMap(components, title, names, levels),
                "Each dot is one sample, placed by the first two principal components of " + features + " (each standardised; a missing cell at the feature's mean, "
                + "a below-detection cell at its smallest measured value), " + colouring);
            if (panel.Cohort is { } cohort)
                html.Figure(ScreenReportCharts.SampleMap(components, "Samples by cohort", cohort.LevelNames, cohort.SampleLevels),
                    "The same map coloured by cohort: cohorts apart here differ in many features at once (a batch or centre effect), whatever the class.");
            html.EndSection();
        }

        if (result.Kind == OutcomeKind.Classes)
        {
            html.BeginSection("Forest order against single-marker AUC");
            html.Figure(ScreenReportCharts.RankAgainstAuc(result),
                "Every feature (up to " + ReportNumber.Integer(ScreenReportCharts.RankAucFeatureLimit) + ") by its position in the screen order (log axis) and its single-marker AUC. "
                + "Features far from 0.5 near the top agree with a one-marker test; features near 0.5 high in the order carry signal only together with others.");
            html.EndSection();
        }
        else
        {
            bool measured = result.Kind == OutcomeKind.Measured;
            html.BeginSection(measured ? "Forest order against single-marker rho" : "Forest order against single-marker concordance");
            html.Figure(OutcomeKindReport.RankAgainstEffect(result),
                "Every feature (up to " + ReportNumber.Integer(ScreenReportCharts.RankAucFeatureLimit) + ") by its position in the screen order (log axis) and its single-marker "
                + (measured ? "Spearman rho with the outcome. Features far from 0" : "Harrell's C. Features far from 0.5")
                + " near the top agree with a one-marker test; features near no effect high in the order carry signal only in shapes or together with others.");
            html.EndSection();
        }

        if (ScreenReportCharts.ImportanceAgainstDecoys(result) is { } decoys)
        {
            html.BeginSection("Observed importances against the decoys");
            html.Figure(decoys,
                "Corrected impurity importance, mean over repeats, of the decoys (permuted copies of real features, so unrelated to the outcome by construction), "
                + "of the features not shortlisted and of the shortlisted markers. Groups above " + ReportNumber.Integer(ScreenReportCharts.DistributionPointLimit)
                + " values are drawn as that many evenly spaced quantiles.");
            html.EndSection();
        }
    }

    private static void WriteReproducibility(HtmlBuilder html, ScreenReportInput input)
    {
        var result = input.Result;
        var settings = result.Settings;
        html.BeginSection("Reproducibility");
        html.Paragraph("Running this command with the same input files and the same software version gives the same tables, on any number of threads:");
        if (input.MergedParts > 0)
            html.Paragraph($"This run was split into {ReportNumber.Integer(input.MergedParts)} parts, each run as a separate process, and merged with `omicsscreen merge`; "
                + "the tables are the same, byte for byte, as those of the single run below. Timings are those of the merge.");
        html.DefinitionList(
        [
            new("Command", input.CommandLine),
            new("Software version", input.SoftwareVersion),
            new("Run seed", settings.Options.Seed.ToString(CultureInfo.InvariantCulture)),
            new("Repeats", ReportNumber.Integer(settings.RepeatCount) + " (every repeat's seeds are derived from the run seed)"),
            new("Started (UTC)", input.Started.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture)),
            new("Finished (UTC)", input.Finished.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture)),
            new("Cores", ReportNumber.Integer(input.Cores)),
            new("Threads", ReportNumber.Integer(input.Threads)),
        ]);
        html.Paragraph("The manifest records every setting listed under Input and settings, under its option's name without the dashes ("
            + string.Join(", ", ScreenParameters.All.Take(3).Select(p => p.Key)) + ", ...).");
        html.Table(ScreenReportTables.Files("Input files", input.Inputs));
        html.Table(ScreenReportTables.Files("Result tables beside this report", input.Tables));
        var timings = new List<KeyValuePair<string, string>> { new("Reading and checking the inputs", ReportNumber.Seconds(input.LoadSeconds)) };
        foreach (var stage in Enum.GetValues<ScreenStage>())
            if (result.StageSeconds.TryGetValue(stage, out double seconds)) timings.Add(new(ScreenReportText.StageName(stage), ReportNumber.Seconds(seconds)));
        html.Paragraph("Time spent in each stage:");
        html.DefinitionList(timings);
        html.Paragraph($"The run's manifest ({ScreenReportInput.ManifestFileName}) sits beside this report: it records the same provenance in machine-readable form and lists this report among the outputs.");
        html.EndSection();
    }

    private static List<FeatureSummary> ShortlistFeatures(ScreenResult result, int limit)
    {
        int count = Math.Min(limit, result.Shortlist.Count);
        var features = new List<FeatureSummary>(count);
        for (int i = 0; i < count; i++) features.Add(result.Shortlist[i].Forest);
        return features;
    }

    /// <summary>Shares of all cells that are missing and below detection.</summary>
    internal static (double Missing, double BelowDetection) UnmeasuredShares(FeatureMatrix matrix)
    {
        long missing = 0, belowDetection = 0;
        for (int feature = 0; feature < matrix.FeatureCount; feature++)
        {
            if (!matrix.HasUnmeasuredCells(feature)) continue;
            foreach (var state in matrix.States(feature))
            {
                if (state == CellState.Missing) missing++;
                else if (state == CellState.BelowDetection) belowDetection++;
            }
        }
        double cells = (double)matrix.FeatureCount * matrix.SampleCount;
        return cells > 0 ? (missing / cells, belowDetection / cells) : (0, 0);
    }


    private static string LevelCounts(SampleGrouping grouping)
    {
        var counts = new int[grouping.LevelCount];
        foreach (int level in grouping.SampleLevels) counts[level]++;
        var parts = new string[counts.Length];
        for (int l = 0; l < parts.Length; l++) parts[l] = grouping.LevelNames[l] + " (" + ReportNumber.Integer(counts[l]) + ")";
        return string.Join(", ", parts);
    }

    private static string Capitalised(string text) =>
        text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];
}
