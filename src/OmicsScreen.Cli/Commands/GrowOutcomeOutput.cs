using System.Globalization;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// What `grow` prints for a measured or time-to-event outcome: the same layout as for classes
/// (a summary table, the curve at a tenth, half and all of the trees, the top features), in the
/// kind's measures, with the kind stated in one line; or the same as JSON.
/// </summary>
internal static class GrowOutcomeOutput
{
    private const int PrintedFeatures = 15;

    /// <summary>One line naming the outcome kind and the forest grown for it.</summary>
    public static string KindLine(Panel panel) => panel.Kind == OutcomeKind.Measured
        ? $"Outcome: '{TextTable.Printable(panel.OutcomeColumn)}', a measured quantity: a regression forest (variance-decrease splits, leaf means; Breiman et al. 1984)."
        : FormattableString.Invariant($"Outcome: follow-up '{TextTable.Printable(panel.FollowUp!.TimeColumn)}' with event '{TextTable.Printable(panel.FollowUp.EventColumn)}' ({panel.FollowUp.EventCount} events in {panel.SampleCount} samples): a random survival forest (log-rank splits, ensemble mortality; Ishwaran et al. 2008).");

    public static void WriteText(TextWriter output, LoadedPanel loaded, ForestOptions options, GrowOutcomeForest forest, int[] ranked, TimeSpan loadTime)
    {
        var panel = loaded.Panel;
        bool measured = panel.Kind == OutcomeKind.Measured;
        output.WriteLine($"Forest of {options.TreeCount} trees on {Path.GetFileName(loaded.Inspection.MatrixPath)}: "
            + $"{panel.SampleCount} samples, {panel.FeatureCount} features, {forest.FeaturesPerSplit} tried per split, smallest leaf {options.Tree.MinLeafSize}, seed {options.Seed}");
        output.WriteLine(KindLine(panel));
        output.WriteLine();
        var summary = new TextTable("measure", "value").AlignRight(1);
        if (measured)
        {
            summary.Add("out-of-bag mean squared error", Number(forest.OutOfBagError));
            summary.Add("out-of-bag R²", Fixed(forest.OutOfBagScore));
            foreach (var (label, trees) in GrowRun.Checkpoints(forest.Curve.Length))
                summary.Add($"mean squared error after {trees} trees{label}", Number(forest.Curve[trees - 1]));
        }
        else
        {
            summary.Add("out-of-bag concordance (Harrell's C)", Fixed(forest.OutOfBagScore));
            summary.Add("  95% interval", $"{Fixed(forest.ScoreInterval.Lower)} to {Fixed(forest.ScoreInterval.Upper)}");
            foreach (var (label, trees) in GrowRun.Checkpoints(forest.Curve.Length))
                summary.Add($"concordance after {trees} trees{label}", Fixed(forest.Curve[trees - 1]));
        }
        summary.Add("load time", GrowRun.Seconds(loadTime));
        summary.Add("binning time", GrowRun.Seconds(forest.BinningTime));
        summary.Add("training time", GrowRun.Seconds(forest.TrainingTime));
        summary.Add("permutation importance time", GrowRun.Seconds(forest.ImportanceTime));
        summary.WriteTo(output);
        output.WriteLine();
        int shown = Math.Min(PrintedFeatures, ranked.Length);
        output.WriteLine(measured
            ? $"Top {shown} features by mean decrease in variance (squared error) per tree"
            : $"Top {shown} features by mean log-rank statistic of their splits per tree");
        var top = new TextTable("rank", "feature", measured ? "variance decrease" : "log-rank statistic", "share",
            measured ? "permutation MSE rise" : "permutation C drop").AlignRight(0, 2, 3, 4);
        for (int i = 0; i < shown; i++)
        {
            int f = ranked[i];
            top.Add((i + 1).ToString(CultureInfo.InvariantCulture), TextTable.Printable(panel.Matrix.FeatureNames[f]),
                forest.Impurity[f].ToString("0.00000", CultureInfo.InvariantCulture),
                forest.ImpurityShare[f].ToString("0.0%", CultureInfo.InvariantCulture),
                forest.Permutation[f].ToString("0.00000", CultureInfo.InvariantCulture));
        }
        top.WriteTo(output);
        output.WriteLine();
        output.WriteLine("The ranking of one forest depends on its seed and favours features with many distinct values; treat it as a first look.");
        if (!measured)
            output.WriteLine("Concordance says how well the forest ranks samples by risk; it does not show that a predicted risk is right at a given time.");
    }

    public static void WriteJson(TextWriter output, LoadedPanel loaded, ForestOptions options, GrowOutcomeForest forest, int[] ranked,
        TimeSpan loadTime, IReadOnlyList<string> warnings)
    {
        var panel = loaded.Panel;
        bool measured = panel.Kind == OutcomeKind.Measured;
        var names = panel.Matrix.FeatureNames;
        object outOfBag = measured
            ? new
            {
                mean_squared_error = forest.OutOfBagError,
                r_squared = forest.OutOfBagScore,
                mean_squared_error_curve = forest.Curve,
            }
            : new
            {
                concordance = forest.OutOfBagScore,
                concordance_low95 = forest.ScoreInterval.Lower,
                concordance_high95 = forest.ScoreInterval.Upper,
                error = forest.OutOfBagError,
                concordance_curve = forest.Curve,
            };
        object importance = measured
            ? ranked.Select(f => (object)new
            {
                feature = names[f],
                mean_variance_decrease = forest.Impurity[f],
                share = forest.ImpurityShare[f],
                permutation_mse_rise = forest.Permutation[f],
                permutation_se = forest.PermutationStandardError[f],
            }).ToArray()
            : ranked.Select(f => (object)new
            {
                feature = names[f],
                mean_log_rank_statistic = forest.Impurity[f],
                share = forest.ImpurityShare[f],
                permutation_concordance_drop = forest.Permutation[f],
                permutation_se = forest.PermutationStandardError[f],
            }).ToArray();
        var document = new
        {
            panel = new
            {
                matrix = loaded.Inspection.MatrixPath,
                samples = panel.SampleCount,
                features = panel.FeatureCount,
                outcome_kind = measured ? "measured" : "time_to_event",
                outcome_column = panel.OutcomeColumn,
                event_column = panel.FollowUp?.EventColumn,
                events = panel.FollowUp?.EventCount,
            },
            forest = new
            {
                kind = measured ? "regression" : "survival",
                trees = options.TreeCount,
                features_per_split = forest.FeaturesPerSplit,
                min_leaf = options.Tree.MinLeafSize,
                max_depth = options.Tree.MaxDepth == int.MaxValue ? (int?)null : options.Tree.MaxDepth,
                drawing = options.Sampling.Drawing.ToString().ToLowerInvariant(),
                sample_fraction = options.Sampling.Drawing == Engine.Sampling.SampleDrawing.Subsample ? options.Sampling.SubsampleFraction : (double?)null,
                seed = options.Seed,
            },
            out_of_bag = outOfBag,
            seconds = new
            {
                load = loadTime.TotalSeconds,
                binning = forest.BinningTime.TotalSeconds,
                training = forest.TrainingTime.TotalSeconds,
                permutation_importance = forest.ImportanceTime.TotalSeconds,
            },
            warnings,
            importance,
        };
        ManifestJson.Write(output, document);
    }

    private static string Number(double value) => value.ToString("0.####", CultureInfo.InvariantCulture);

    private static string Fixed(double value) => value.ToString("0.0000", CultureInfo.InvariantCulture);
}
