using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Output;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Tables;
using OmicsScreen.Runs.Output;
using OmicsScreen.Runs.Results;

namespace OmicsScreen.Cli.Commands;

/// <summary>Loads a panel, grows one forest and reports it.</summary>
internal static class GrowRun
{
    private const int PrintedFeatures = 15;

    public static int Execute(CliConsole console, GrowRunOptions options)
    {
        options.Validate();
        InputPathGuard.Check(options.Panel.MatrixPath, "matrix");
        InputPathGuard.Check(options.Panel.SampleSheetPath, "sample sheet");
        InputPathGuard.Check(options.Panel.FeatureSheetPath, "feature sheet");
        if (options.ImportanceFile is { } importancePath)
            OutputPathGuard.CheckFile(importancePath, "--importance-out", [options.Panel.MatrixPath, options.Panel.SampleSheetPath, options.Panel.FeatureSheetPath],
                EarlierImportanceHeader(importancePath));
        var watch = Stopwatch.StartNew();
        var loaded = PanelLoader.Load(options.Panel).EnsureScreenable();
        var loadTime = watch.Elapsed;
        var panel = loaded.Panel;
        GrowFeasibility.Check(options, panel);
        var warnings = new List<string>();
        foreach (var finding in loaded.Inspection.Findings)
            if (finding.Severity == FindingSeverity.Warning) warnings.Add(finding.Message);
        warnings.AddRange(GrowFeasibility.Warnings(options, panel));
        if (panel.Kind != OutcomeKind.Classes && options.Balance == BalanceMode.On)
            warnings.Add("--balance on draws class-balanced trees, and this outcome has no classes: every tree draws a plain bootstrap.");
        foreach (var warning in warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
        var forestOptions = options.ToForestOptions(panel);
        try
        {
            forestOptions.Validate(panel.SampleCount);
        }
        catch (ArgumentException e)
        {
            throw new CommandInputException(e.Message);
        }
        if (panel.Kind != OutcomeKind.Classes)
        {
            var outcomeForest = GrowOutcomeForest.Grow(panel, forestOptions);
            var byImpurity = RankDescending(outcomeForest.Impurity);
            if (options.ImportanceFile is { } file)
                AtomicFile.WriteText(file, writer => OutcomeImportanceWriter.Write(writer, panel.Kind, panel.Matrix.FeatureNames, byImpurity,
                    outcomeForest.Impurity, outcomeForest.ImpurityShare, outcomeForest.Permutation, outcomeForest.PermutationStandardError));
            if (options.Json) GrowOutcomeOutput.WriteJson(console.Out, loaded, forestOptions, outcomeForest, byImpurity, loadTime, warnings);
            else GrowOutcomeOutput.WriteText(console.Out, loaded, forestOptions, outcomeForest, byImpurity, loadTime);
            return ExitCode.Success;
        }
        var grown = ForestGrower.Grow(panel, forestOptions);
        var result = grown.Result;
        var ranked = RankByImpurity(result);

        if (options.ImportanceFile is { } path)
            AtomicFile.WriteText(path, writer => ImportanceWriter.Write(writer, panel.Matrix.FeatureNames, ranked, result));

        if (options.Json) WriteJson(console.Out, options, loaded, result, ranked, loadTime, warnings);
        else WriteText(console.Out, loaded, result, ranked, loadTime);
        return ExitCode.Success;
    }

    /// <summary>
    /// The header an earlier importance file of this tool starts with, whichever outcome kind wrote
    /// it (so a rerun may replace it); the class header when there is none, for the guard's message.
    /// </summary>
    private static string EarlierImportanceHeader(string path)
    {
        if (FileKinds.Of(Path.GetFullPath(path)) == FileKind.RegularFile)
            foreach (var header in new[] { OutcomeImportanceWriter.MeasuredHeaderLine, OutcomeImportanceWriter.FollowUpHeaderLine })
                if (OutputPathGuard.StartsWith(Path.GetFullPath(path), header)) return header;
        return ImportanceWriter.HeaderLine;
    }

    /// <summary>Feature indices by decreasing value; ties by feature order, so the list is stable.</summary>
    internal static int[] RankDescending(double[] values)
    {
        var order = Enumerable.Range(0, values.Length).ToArray();
        Array.Sort(order, (a, b) =>
        {
            int byValue = values[b].CompareTo(values[a]);
            return byValue != 0 ? byValue : a.CompareTo(b);
        });
        return order;
    }

    /// <summary>Feature indices by decreasing impurity decrease; ties by feature order, so the list is stable.</summary>
    private static int[] RankByImpurity(ForestResult result)
    {
        var order = Enumerable.Range(0, result.MeanDecreaseImpurity.Count).ToArray();
        Array.Sort(order, (a, b) =>
        {
            int byValue = result.MeanDecreaseImpurity[b].CompareTo(result.MeanDecreaseImpurity[a]);
            return byValue != 0 ? byValue : a.CompareTo(b);
        });
        return order;
    }

    internal static IEnumerable<(string Label, int Trees)> Checkpoints(int treeCount) => CurveCheckpoints(treeCount);

    private static void WriteText(TextWriter output, LoadedPanel loaded, ForestResult result, int[] ranked, TimeSpan loadTime)
    {
        var panel = loaded.Panel;
        var outcome = panel.Outcome;
        output.WriteLine($"Forest of {result.Options.TreeCount} trees on {Path.GetFileName(loaded.Inspection.MatrixPath)}: "
            + $"{panel.SampleCount} samples, {panel.FeatureCount} features, {result.FeaturesPerSplit} tried per split, seed {result.Options.Seed}");
        output.WriteLine();
        var summary = new TextTable("measure", "value").AlignRight(1);
        summary.Add("out-of-bag error", Fraction(result.OutOfBagError));
        for (int c = 0; c < outcome.ClassCount; c++)
            summary.Add($"  error in {outcome.ClassNames[c]} ({outcome.ClassCounts[c]})", Fraction(result.PerClassError[c]));
        if (result.OutOfBagAuc is { } auc) summary.Add($"out-of-bag AUC ({outcome.ClassNames[outcome.PositiveClass]} positive)", auc.ToString("0.000", CultureInfo.InvariantCulture));
        foreach (var (label, trees) in CurveCheckpoints(result.ErrorCurve.Count))
            summary.Add($"error after {trees} trees{label}", Fraction(result.ErrorCurve[trees - 1]));
        summary.Add("load time", Seconds(loadTime));
        summary.Add("binning time", Seconds(result.BinningTime));
        summary.Add("training time", Seconds(result.TrainingTime));
        summary.WriteTo(output);
        output.WriteLine();
        output.WriteLine($"Top {Math.Min(PrintedFeatures, ranked.Length)} features by mean decrease in Gini impurity");
        var top = new TextTable("rank", "feature", "mean decrease", "share").AlignRight(0, 2, 3);
        for (int i = 0; i < Math.Min(PrintedFeatures, ranked.Length); i++)
        {
            int f = ranked[i];
            top.Add((i + 1).ToString(CultureInfo.InvariantCulture), panel.Matrix.FeatureNames[f],
                result.MeanDecreaseImpurity[f].ToString("0.00000", CultureInfo.InvariantCulture),
                result.NormalisedDecreaseImpurity[f].ToString("0.0%", CultureInfo.InvariantCulture));
        }
        top.WriteTo(output);
        output.WriteLine();
        output.WriteLine("The ranking of one forest depends on its seed and favours features with many distinct values; treat it as a first look.");
    }

    /// <summary>Points of the error curve worth printing: a tenth, half and all of the trees.</summary>
    private static IEnumerable<(string Label, int Trees)> CurveCheckpoints(int treeCount)
    {
        var seen = new HashSet<int>();
        foreach (var (label, trees) in new[] { ("", Math.Max(1, treeCount / 10)), ("", Math.Max(1, treeCount / 2)), (" (all)", treeCount) })
            if (seen.Add(trees)) yield return (label, trees);
    }

    private static void WriteJson(TextWriter output, GrowRunOptions options, LoadedPanel loaded, ForestResult result, int[] ranked, TimeSpan loadTime,
        IReadOnlyList<string> warnings)
    {
        var panel = loaded.Panel;
        var document = new
        {
            panel = new
            {
                matrix = loaded.Inspection.MatrixPath,
                samples = panel.SampleCount,
                features = panel.FeatureCount,
                classes = panel.Outcome.ClassNames,
                class_counts = panel.Outcome.ClassCounts.ToArray(),
                positive_class = panel.Outcome.ClassNames[panel.Outcome.PositiveClass],
            },
            forest = new
            {
                trees = result.Options.TreeCount,
                features_per_split = result.FeaturesPerSplit,
                min_leaf = result.Options.Tree.MinLeafSize,
                max_depth = result.Options.Tree.MaxDepth == int.MaxValue ? (int?)null : result.Options.Tree.MaxDepth,
                drawing = result.Options.Sampling.Drawing.ToString().ToLowerInvariant(),
                sample_fraction = result.Options.Sampling.Drawing == Engine.Sampling.SampleDrawing.Subsample ? result.Options.Sampling.SubsampleFraction : (double?)null,
                balance = options.Balance.ToString().ToLowerInvariant(),
                class_balanced = result.Options.Sampling.ClassBalanced,
                seed = result.Options.Seed,
            },
            out_of_bag = new
            {
                error = result.OutOfBagError,
                per_class_error = panel.Outcome.ClassNames.Select((name, c) => new { @class = name, error = result.PerClassError[c] }).ToArray(),
                auc = result.OutOfBagAuc,
                error_curve = result.ErrorCurve,
            },
            seconds = new
            {
                load = loadTime.TotalSeconds,
                binning = result.BinningTime.TotalSeconds,
                training = result.TrainingTime.TotalSeconds,
            },
            warnings,
            impurity_decrease = ranked.Select(f => new
            {
                feature = panel.Matrix.FeatureNames[f],
                mean_gini_decrease = result.MeanDecreaseImpurity[f],
                share = result.NormalisedDecreaseImpurity[f],
            }).ToArray(),
        };
        ManifestJson.Write(output, document);
    }

    internal static string Fraction(double value) => value.ToString("0.0000", CultureInfo.InvariantCulture);

    internal static string Seconds(TimeSpan time) => time.TotalSeconds.ToString("0.000", CultureInfo.InvariantCulture) + " s";
}
