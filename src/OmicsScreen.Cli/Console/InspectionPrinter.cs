using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;
using OmicsScreen.Data;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Cli.Console;

/// <summary>Prints what `check` found, as a readable summary or as JSON for pipelines.</summary>
internal static class InspectionPrinter
{
    private const int ListedNames = 5;

    public static void WriteTable(LoadedPanel loaded, TextWriter output)
    {
        var i = loaded.Inspection;
        var facts = new TextTable("item", "found");
        string compression = i.Compression is null ? "" : $", {i.Compression}-compressed";
        facts.Add("matrix", $"{i.MatrixPath} ({FormatName(i.FileFormat, i.Delimiter)}{compression}, {LayoutName(i.Layout)})");
        if (i.CommentLineCount > 0) facts.Add("comment lines", $"{Count(i.CommentLineCount)} above the header ('#' or '!'), skipped");
        if (i.LongTable is { } longTable) facts.Add("long table", LongTableText(longTable));
        if (i.FeatureColumns is { } describing) facts.Add("feature columns", FeatureColumnsText(describing));
        if (i.SampleSheetPath is not null) facts.Add("sample sheet", i.SampleSheetPath + SheetReading(i.SampleSheetCompression, i.SampleSheetCommentLineCount));
        if (i.FeatureSheet is { } featureSheet)
        {
            facts.Add("feature sheet", FeatureSheetText(featureSheet));
            if (featureSheet.DetectionLimitColumn is { } limitColumn)
                facts.Add("detection limits", $"'{limitColumn}': {Count(featureSheet.FeaturesWithLimit)} features with a limit; "
                    + $"{Count(featureSheet.CensoredCellTotal)} measured cells below their feature's limit, now below detection"
                    + (featureSheet.CensoredCells.Count == 0 ? "" : " (" + string.Join(", ", featureSheet.CensoredCells.Take(ListedNames).Select(c => $"{c.Feature} {Count(c.Cells)}"))
                        + (featureSheet.CensoredCells.Count > ListedNames ? $", and {featureSheet.CensoredCells.Count - ListedNames} more features" : "") + ")"));
        }
        facts.Add("samples", Count(i.SampleCount));
        facts.Add("features", Count(i.FeatureCount));
        AddOutcomeFacts(facts, i, OutcomeSummary.Of(loaded.Panel));
        if (i.CohortColumn is not null)
            facts.Add("cohorts", $"{i.CohortColumn}: " + string.Join(", ", i.Cohorts.Select(c => $"{c.Name} {c.SampleCount}")));
        foreach (var covariate in i.Covariates)
            facts.Add("covariate", covariate.Kind == "numeric"
                ? $"{covariate.Name}: numeric, min {Number(covariate.Minimum)}, median {Number(covariate.Median)}, max {Number(covariate.Maximum)}"
                : $"{covariate.Name}: categorical, " + string.Join(", ", covariate.Levels.Select(l => $"{l.Name} {Count(l.SampleCount)}")));
        if (i.SubjectColumn is not null) facts.Add("subjects", $"{i.SubjectColumn}: {Count(i.SubjectCount)}");
        facts.Add("missing cells", Percent(i.MissingFraction));
        if (i.MostMissingFeatures.Count > 0)
            facts.Add("most missing", string.Join(", ", i.MostMissingFeatures.Take(ListedNames).Select(f => $"{f.Feature} {Percent(f.Fraction)}")));
        facts.Add("below detection", $"{Count(i.BelowDetectionCellCount)} cells in {Count(i.BelowDetectionFeatureCount)} features");
        facts.Add("constant features", Names(i.ConstantFeatures));
        facts.Add("all-missing features", Names(i.AllMissingFeatures));
        if (i.DroppedSamples.Count > 0) facts.Add("dropped samples", Names(i.DroppedSamples));
        output.WriteLine("Panel check");
        facts.WriteTo(output);

        if (i.CohortColumn is not null && i.ClassesByCohort.Count > 0)
        {
            output.WriteLine();
            output.WriteLine("Samples by class and cohort");
            var classes = i.Classes.Select(c => c.Name).ToArray();
            var table = new TextTable(["cohort", .. classes]).AlignRight(Enumerable.Range(1, classes.Length).ToArray());
            foreach (var cohort in i.Cohorts)
                table.Add([cohort.Name, .. classes.Select(c => Count(i.ClassesByCohort.FirstOrDefault(x => x.Cohort == cohort.Name && x.ClassName == c)?.SampleCount ?? 0))]);
            table.WriteTo(output);
        }

        output.WriteLine();
        if (i.Findings.Count == 0)
        {
            output.WriteLine("No problems found.");
        }
        else
        {
            output.WriteLine("Findings");
            var findings = new TextTable("severity", "code", "message");
            foreach (var f in i.Findings.OrderByDescending(f => f.Severity))
                findings.Add(SeverityName(f.Severity), f.Code, f.Message);
            findings.WriteTo(output);
        }
        output.WriteLine();
        output.WriteLine(!i.CanScreen ? "Verdict: the panel cannot be screened until the errors are fixed."
            : "Verdict: the panel can be screened.");
    }

    public static void WriteJson(LoadedPanel loaded, TextWriter output)
    {
        var options = new JsonSerializerOptions
        {
            WriteIndented = true,
            PropertyNamingPolicy = new CountsAsPluralsNamingPolicy(),
            Converters = { new JsonStringEnumConverter(JsonNamingPolicy.SnakeCaseLower) },
            NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        };
        var document = new
        {
            can_screen = CheckRun.CanScreen(loaded),
            inspection = loaded.Inspection,
            outcome = OutcomeSummary.Of(loaded.Panel),
            inputs = loaded.Inputs,
        };
        output.WriteLine(JsonSerializer.Serialize(document, options));
    }

    /// <summary>The outcome rows: classes with counts, or the kind in words and its summary.</summary>
    private static void AddOutcomeFacts(TextTable facts, PanelInspection i, OutcomeSummary summary)
    {
        if (summary.Measured is { } m)
        {
            facts.Add("outcome", $"{i.OutcomeColumn}: a measured quantity (--outcome-kind classes reads its values as classes instead)");
            facts.Add("outcome values", $"{Count(m.Samples)} samples, {Count(m.Missing)} missing; min {Number(m.Min)}, quartiles {Number(m.LowerQuartile)} / "
                + $"{Number(m.Median)} / {Number(m.UpperQuartile)}, max {Number(m.Max)}");
            return;
        }
        if (summary.FollowUp is { } f)
        {
            facts.Add("outcome", $"time to event: follow-up '{i.OutcomeColumn}', event '{i.EventColumn}'");
            facts.Add("events", $"{Count(f.Events)} events, {Count(f.Censored)} censored, of {Count(f.Samples)} samples; "
                + $"{Count(f.TiedEventTimes)} event times shared by several events");
            facts.Add("median survival", (f.MedianSurvival is { } median ? Number(median) : "not reached") + " (Kaplan-Meier)");
            facts.Add("median follow-up", (f.MedianFollowUp is { } followUp ? Number(followUp) : "not reached") + " (reverse Kaplan-Meier)");
            return;
        }
        facts.Add("outcome", $"{i.OutcomeColumn}: " + string.Join(", ", i.Classes.Select(c => $"{c.Name} {c.SampleCount}")) + $" (positive class: {i.PositiveClass})");
    }

    private static string Number(double value) => value.ToString("G6", CultureInfo.InvariantCulture);

    private static string FormatName(MatrixFileFormat format, string? delimiter) => format switch
    {
        MatrixFileFormat.DelimitedText => $"text, {delimiter ?? "?"}-separated",
        MatrixFileFormat.Parquet => "Parquet",
        MatrixFileFormat.ArrowFile => "Arrow IPC file",
        MatrixFileFormat.ArrowStream => "Arrow IPC stream",
        _ => format.ToString(),
    };

    /// <summary>How a sheet was read, in brackets, when it was compressed or had comment lines; "" otherwise.</summary>
    private static string SheetReading(string? compression, int commentLines)
    {
        var parts = new List<string>();
        if (compression is not null) parts.Add($"{compression}-compressed");
        if (commentLines > 0) parts.Add($"{Count(commentLines)} comment line{(commentLines == 1 ? "" : "s")} above the header, skipped");
        return parts.Count == 0 ? "" : " (" + string.Join("; ", parts) + ")";
    }

    private static string FeatureSheetText(FeatureSheetFound sheet)
    {
        string text = $"{sheet.Path}{SheetReading(sheet.Compression, sheet.CommentLineCount)}: ids in '{sheet.IdColumn}'";
        if (sheet.DisplayNameColumn is { } display) text += $", display names in '{display}'";
        if (sheet.AnnotationColumns.Count > 0) text += ", annotations " + string.Join(", ", sheet.AnnotationColumns.Select(c => $"'{c}'"));
        if (sheet.MatrixOnlyFeatures.Count > 0) text += $"; {Count(sheet.MatrixOnlyFeatures.Count)} matrix features not in the sheet dropped";
        if (sheet.SheetOnlyFeatures.Count > 0) text += $"; {Count(sheet.SheetOnlyFeatures.Count)} sheet rows not in the matrix ignored";
        return text;
    }

    /// <summary>One line: which column names features, which travel with them, and how they were found.</summary>
    private static string FeatureColumnsText(FeatureColumnsFound found)
    {
        string text = $"'{found.IdColumn}' names each feature";
        if (found.AnnotationColumns.Count > 0)
            text += "; " + string.Join(", ", found.AnnotationColumns.Select(c => $"'{c}'")) + " travel with it as annotations";
        return text + (found.Detected
            ? " (leading text columns before the first column of numbers; name them with --feature-columns)"
            : " (named with --feature-columns)");
    }

    private static string LayoutName(PanelLayout layout) => layout switch
    {
        PanelLayout.SamplesInRows => "samples in rows",
        PanelLayout.FeaturesInRows => "features in rows",
        _ => "long table",
    };

    private static string LongTableText(LongTableFound found)
    {
        string text = $"{Count(found.Rows)} rows; sample '{found.SampleColumn}', feature '{found.FeatureColumn}', value '{found.ValueColumn}'";
        if (found.DetectionLimitColumn is { } limit) text += $"; per-row limit '{limit}': {Count(found.CellsBelowRowLimit)} values below it, now below detection";
        if (found.BelowDetectionFlagColumn is { } below) text += $"; flag '{below}': {Count(found.CellsFlaggedBelow)} cells below detection";
        if (found.QualityFlagColumn is { } quality) text += $"; quality flag '{quality}': {Count(found.CellsFailingQuality)} cells made missing";
        if (found.CellsWithoutRow > 0) text += $"; {Count(found.CellsWithoutRow)} sample-feature pairs without a row, missing";
        return text;
    }

    private static string SeverityName(FindingSeverity severity) => severity switch
    {
        FindingSeverity.Error => "ERROR",
        FindingSeverity.Warning => "warning",
        _ => "note",
    };

    private static string Count(long value) => value.ToString("N0", CultureInfo.InvariantCulture);

    private static string Percent(double fraction) => fraction.ToString("0.0#%", CultureInfo.InvariantCulture);

    private static string Names(IReadOnlyList<string> names) =>
        names.Count == 0 ? "none"
        : names.Count <= ListedNames ? $"{names.Count}: {string.Join(", ", names)}"
        : $"{names.Count}: {string.Join(", ", names.Take(ListedNames))}, and {names.Count - ListedNames} more";
}
