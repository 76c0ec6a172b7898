using System.Globalization;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Checks the screen cost model against a real default screen, stage by stage, then projects
/// time and memory of a default screen to the README's panel shapes on one node and split into
/// parts over several nodes.
/// </summary>
/// <remarks>
/// A node is assumed to turn core-seconds into wall seconds at its core count (trees are handed
/// to threads one at a time, 500 per forest, so 32 threads stay busy), plus the one-thread
/// seconds of building permuted-copy columns; binning and univariate statistics run on every node,
/// since every part needs the whole binned matrix.
/// The univariate stage is not in the forest model: its core-seconds are taken from the check
/// screen and scaled by n x p (one rank test per feature; the n log n of sorting is ignored).
/// </remarks>
public static class ScreenCostReport
{
    private const int NodeCores = 32;
    private const int NodeCount = 16;

    public static void Write(ForestCostModel cost, ScreenMemoryModel memory, BenchmarkMeasurement screen, TextWriter output)
    {
        var check = ScalingPlan.ScreenCheck;
        var options = new ScreenOptions();
        var units = ScreenCostModel.Units(check.SampleCount, check.FeatureCount, options, cost);
        double reference = Sum(units, "reference", u => u.ProcessorSeconds);
        double repeats = Sum(units, "repeat", u => u.ProcessorSeconds);
        double curve = Sum(units, "curve fold", u => u.ProcessorSeconds);
        double binning = cost.Binning.At(check.SampleCount, check.FeatureCount);
        double univariate = screen.MedianFigure("UnivariateStatistics_cpu_s");
        double modelled = binning + univariate + reference + repeats + curve;
        double measured = screen.MedianFigure("screen_cpu_s");
        double ratio = measured / modelled;

        output.WriteLine();
        output.WriteLine(Invariant($"# screen check: default screen on {check.SampleCount} x {check.FeatureCount} (causal-block panel), {Count(units)} forests; core-seconds"));
        output.WriteLine("| stage | modelled | measured | measured / modelled |");
        output.WriteLine("|---|---:|---:|---:|");
        CheckRow(output, "binning", binning, screen.MedianFigure("Binning_cpu_s"));
        CheckRow(output, "univariate (measured, not modelled)", univariate, univariate);
        CheckRow(output, "reference forest", reference, screen.MedianFigure("ReferenceForest_cpu_s"));
        CheckRow(output, "repeats (+ aggregation)", repeats, screen.MedianFigure("Repeats_cpu_s"));
        CheckRow(output, "panel-size curve", curve, screen.MedianFigure("PanelSizeCurve_cpu_s"));
        CheckRow(output, "whole screen", modelled, measured);
        output.WriteLine(Invariant(
            $"# wall: measured {screen.MedianFigure("screen_s"):F1} s; modelled core-s / {Environment.ProcessorCount} cores = {modelled / Environment.ProcessorCount:F1} s (an idle machine)"));

        foreach (var (samples, features) in ScalingPlan.Projections)
            WriteProjection(cost, memory, options, samples, features, univariate / ((double)check.SampleCount * check.FeatureCount), ratio, output);
    }

    private static void WriteProjection(ForestCostModel cost, ScreenMemoryModel memory, ScreenOptions options, int samples,
        int features, double univariatePerCell, double checkRatio, TextWriter output)
    {
        var units = ScreenCostModel.Units(samples, features, options, cost);
        double shared = cost.Binning.At(samples, features) + univariatePerCell * samples * features;
        double parallel = 0, serial = 0;
        foreach (var unit in units)
        {
            parallel += unit.CoreSeconds;
            serial += unit.SerialSeconds;
        }
        double oneNode = (shared + parallel) / NodeCores + serial;
        double largestPart = ScreenCostModel.LargestNodeLoad(units, NodeCount, NodeCores);
        double split = shared / NodeCores + largestPart;
        int decoys = ScreenCostModel.Decoys(features, options);

        output.WriteLine();
        output.WriteLine(Invariant($"# projection: default screen on {samples} x {features} ({decoys} decoys, {Count(units)} forests of {options.TreesPerForest} trees)"));
        output.WriteLine(Invariant(
            $"#   parallel core-s: reference {Sum(units, "reference", u => u.CoreSeconds):E2}, repeats {Sum(units, "repeat", u => u.CoreSeconds):E2} (of which permutation importance {PermutationShare(cost, options, samples, features):P0}), curve {Sum(units, "curve fold", u => u.CoreSeconds):E2}, binning + univariate {shared:E2}"));
        output.WriteLine(Invariant(
            $"#   one-thread s (permuted-copy columns): repeats {Sum(units, "repeat", u => u.SerialSeconds):E2}, curve {Sum(units, "curve fold", u => u.SerialSeconds):E2}"));
        output.WriteLine(Invariant(
            $"#   one {NodeCores}-core node: ({shared:E2} + {parallel:E2}) / {NodeCores} + {serial:E2} = {Hours(oneNode)}; x {checkRatio:F2} (check ratio) = {Hours(oneNode * checkRatio)}"));
        output.WriteLine(Invariant(
            $"#   {NodeCount} nodes, whole repeats and folds dealt longest first: largest node {largestPart:E2} + {shared:E2} / {NodeCores} = {Hours(split)}; x {checkRatio:F2} = {Hours(split * checkRatio)} (speed-up {oneNode / split:F1})"));
        var items = memory.ScreenPeak(samples, features, decoys, options.TreesPerForest, NodeCores);
        double total = 0;
        var parts = new List<string>();
        foreach (var item in items)
        {
            total += item.Bytes;
            parts.Add(Invariant($"{item.Part} {item.Bytes / 1e9:F2}"));
        }
        output.WriteLine(Invariant($"#   memory per node (GB = 1e9 bytes; every part holds the whole matrix): {string.Join(" + ", parts)} = {total / 1e9:F1} GB"));
    }

    /// <summary>The share of a half-sample repeat's parallel work spent on out-of-bag permutation importance.</summary>
    private static double PermutationShare(ForestCostModel cost, ScreenOptions options, int samples, int features)
    {
        int trees = options.TreesPerForest;
        double half = samples / 2.0;
        int decoys = ScreenCostModel.Decoys(features, options);
        double permutation = cost.Permutation(trees, half, features);
        return permutation / (permutation + cost.Train(trees, half, features) + cost.Train(trees, half, 2.0 * features + decoys));
    }

    private static void CheckRow(TextWriter output, string stage, double modelled, double measured) =>
        output.WriteLine(Invariant($"| {stage} | {modelled:F1} | {measured:F1} | {measured / modelled:F2} |"));

    private static double Sum(IReadOnlyList<ScreenWorkUnit> units, string stage, Func<ScreenWorkUnit, double> seconds)
    {
        double sum = 0;
        foreach (var unit in units) if (unit.Stage == stage) sum += seconds(unit);
        return sum;
    }

    private static int Count(IReadOnlyList<ScreenWorkUnit> units)
    {
        int count = 0;
        foreach (var unit in units) count += unit.ForestCount;
        return count;
    }

    private static string Hours(double seconds) => Invariant($"{seconds / 3600:F2} h ({seconds / 60:F0} min)");

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
