using System.Globalization;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// The short HTML page of `omicsscreen apply`: the rule, the performance when the outcome is
/// known, the scale checks and the cautions. Sample ids appear only when asked for.
/// </summary>
public static class ApplyReport
{
    public static string Build(LockedPanel model, LockedPanelScores scores, LockedPanelPerformance? performance, string matrixPath, bool showSampleIds,
        IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string>? displayNames = null)
    {
        var rule = model.Threshold is { } threshold
            ? $"{model.ClassNames[model.PositiveClass]} when the fraction of trees voting for it is at least {Number(threshold)} (Youden threshold on the discovery out-of-bag probabilities)"
            : "the class most trees vote for";
        var html = BeginPage(matrixPath, "Read before using these scores", [.. discoveryOverlap, .. Cautions(model, scores, performance)],
            outcome: null, model.MarkerNames, displayNames ?? new Dictionary<string, string>(), model.Trees.Count,
            [
                new("Call", rule),
                new("Discovery out-of-bag AUC", model.OutOfBagAuc is { } auc ? Number(auc) : "not applicable"),
            ],
            model.Provenance);

        html.BeginSection("Scores");
        var called = new int[scores.ClassCount];
        foreach (int c in scores.PredictedClasses) called[c]++;
        var calls = new HtmlTable("Samples called per class", [new("class"), new("samples", ColumnAlignment.Numeric)]);
        for (int c = 0; c < scores.ClassCount; c++) calls.AddRow(scores.ClassNames[c], called[c].ToString(CultureInfo.InvariantCulture));
        html.Table(calls);
        if (showSampleIds)
        {
            var columns = new List<HtmlTableColumn> { new("sample") };
            foreach (var name in scores.ClassNames) columns.Add(new HtmlTableColumn($"P({name})", ColumnAlignment.Numeric));
            columns.Add(new HtmlTableColumn("called"));
            var table = new HtmlTable("Every sample's class probabilities (fraction of trees) and call", columns);
            for (int s = 0; s < scores.SampleCount; s++)
            {
                var row = new List<string?> { scores.SampleIds[s] };
                for (int c = 0; c < scores.ClassCount; c++) row.Add(Number(scores.Probability(s, c)));
                row.Add(scores.ClassNames[scores.PredictedClasses[s]]);
                table.AddRow(row.ToArray());
            }
            html.Table(table);
        }
        else
        {
            html.Paragraph($"Per-sample scores are in {ApplyResultFiles.Scores}; this page shows no sample ids (pass --show-sample-ids to list them).");
        }
        html.EndSection();

        if (performance is not null) AddPerformance(html, model, performance);

        AddScaleCheck(html, scores.Warnings.Select(w => w.Message).ToList());
        return html.EndDocument();
    }

    /// <summary>
    /// The head of every apply page: its title, the cautions (the discovery overlap first) and the
    /// locked panel: the outcome when it is not classes, the markers and trees, what the kind adds,
    /// and the discovery samples and tool that locked it.
    /// </summary>
    internal static HtmlBuilder BeginPage(string matrixPath, string cautionHeading, IEnumerable<string> cautions, KeyValuePair<string, string>? outcome,
        IReadOnlyList<string> markerNames, IReadOnlyDictionary<string, string> displayNames, int treeCount,
        IEnumerable<KeyValuePair<string, string>> kindEntries, LockProvenance provenance)
    {
        var html = new HtmlBuilder().BeginDocument($"Locked panel applied to {Path.GetFileName(matrixPath)}");
        html.Caution(cautionHeading, cautions);
        html.BeginSection("The locked panel");
        var entries = new List<KeyValuePair<string, string>>();
        if (outcome is { } outcomeEntry) entries.Add(outcomeEntry);
        entries.Add(new("Markers", string.Join(", ", markerNames.Select(m => MarkerLabels.Label(m, displayNames)))));
        entries.Add(new("Trees", treeCount.ToString(CultureInfo.InvariantCulture)));
        entries.AddRange(kindEntries);
        entries.Add(new("Discovery samples", provenance.DiscoverySampleCount.ToString(CultureInfo.InvariantCulture)));
        entries.Add(new("Locked by", $"OmicsScreen {provenance.ToolVersion}, seed {provenance.Seed.ToString(CultureInfo.InvariantCulture)}"));
        html.DefinitionList(entries);
        html.EndSection();
        return html;
    }

    /// <summary>
    /// The cautions every apply page draws from the scale check: markers measured in no sample,
    /// and markers that look measured on another scale. <paramref name="scores"/> names what rests
    /// on the other markers, <paramref name="meaningless"/> what may mean nothing until the units match.
    /// </summary>
    internal static IEnumerable<string> ScaleCautions(IReadOnlyList<ScaleWarning> warnings, string scores, string meaningless)
    {
        int unmeasured = warnings.Count(w => w.Unmeasured);
        if (unmeasured > 0)
            yield return FormattableString.Invariant($"{unmeasured} marker(s) were measured in no sample of this cohort (see the scale check); {scores} rest on the other markers only.");
        if (warnings.Count > unmeasured)
            yield return FormattableString.Invariant($"{warnings.Count - unmeasured} marker(s) look measured on another scale than in discovery (see the scale check); {meaningless} may be meaningless until the units match.");
    }

    /// <summary>The scale check of every apply report: the markers that look measured on another scale, or a line saying none does.</summary>
    internal static void AddScaleCheck(HtmlBuilder html, IReadOnlyList<string> warnings)
    {
        html.BeginSection("Scale check");
        if (warnings.Count == 0)
            html.Paragraph("Every marker's median and spread are within the discovery range (median inside discovery Q1 - 3 IQR to Q3 + 3 IQR, IQR within a factor of 4).");
        else
            html.BulletList(warnings);
        html.EndSection();
    }

    private static void AddPerformance(HtmlBuilder html, LockedPanel model, LockedPanelPerformance performance)
    {
        html.BeginSection("Performance on this cohort");
        var entries = new List<KeyValuePair<string, string>>
        {
            new("Samples", performance.SampleCount.ToString(CultureInfo.InvariantCulture)),
        };
        if (performance.Auc is { } auc && performance.AucInterval is { } interval)
            entries.Add(new($"AUC ({model.ClassNames[model.PositiveClass]} positive)",
                $"{Number(auc)} (95% CI {Number(interval.Lower)} to {Number(interval.Upper)}, DeLong)"));
        entries.Add(new("Error at the locked call", Number(performance.Error)));
        html.DefinitionList(entries);

        var columns = new List<HtmlTableColumn> { new("known class") };
        foreach (var name in performance.ClassNames) columns.Add(new HtmlTableColumn($"called {name}", ColumnAlignment.Numeric));
        var confusion = new HtmlTable("Known class (rows) against called class (columns)", columns);
        for (int c = 0; c < performance.ClassNames.Count; c++)
        {
            var row = new List<string?> { performance.ClassNames[c] };
            foreach (int count in performance.Confusion[c]) row.Add(count.ToString(CultureInfo.InvariantCulture));
            confusion.AddRow(row.ToArray());
        }
        html.Table(confusion);

        var calibration = new HtmlTable($"Calibration: groups of samples by predicted probability of {model.ClassNames[model.PositiveClass]}",
            [new("predicted range"), new("mean predicted", ColumnAlignment.Numeric), new("observed rate", ColumnAlignment.Numeric), new("samples", ColumnAlignment.Numeric)]);
        foreach (var bin in performance.Calibration)
            calibration.AddRow($"{Number(bin.LowestPredicted)} to {Number(bin.HighestPredicted)}", Number(bin.MeanPredicted),
                Number(bin.ObservedPositiveRate), bin.SampleCount.ToString(CultureInfo.InvariantCulture));
        html.Table(calibration);
        html.EndSection();
    }

    private static List<string> Cautions(LockedPanel model, LockedPanelScores scores, LockedPanelPerformance? performance)
    {
        var cautions = new List<string>
        {
            "Research use only: a locked panel is a candidate for validation, not a diagnostic test.",
            "Scores are fractions of trees, not calibrated risks; read the calibration table before treating them as probabilities.",
        };
        if (model.Threshold is not null)
            cautions.Add("The threshold was chosen on the discovery cohort; in a cohort with another case mix or assay it may not balance sensitivity and specificity.");
        cautions.AddRange(ScaleCautions(scores.Warnings, "the scores", "their scores"));
        if (performance is null)
            cautions.Add("No outcome was given, so nothing here says how well the panel works on this cohort.");
        else if (performance.SampleCount < 50)
            cautions.Add("Fewer than 50 samples: the AUC interval is wide and the calibration groups are coarse.");
        return cautions;
    }

    private static string Number(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
