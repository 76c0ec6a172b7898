using System.Globalization;
using MathNet.Numerics;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// The scaling suite's summary: the table of points, the fitted exponent of time and memory along
/// each series, the per-forest cost model, a check of the memory model on every point, and (from
/// <see cref="ScreenCostReport"/>) the screen cost model checked on a real screen and projected.
/// </summary>
/// <remarks>
/// Times are fitted per tree, so points that grew fewer trees than the screen's 500 sit on the same
/// line; the trees series tests that time is linear in trees. Processor seconds are the primary
/// figure because the machine is shared: wall time swings with the other processes, processor
/// time much less.
/// </remarks>
public sealed class ScalingReport : ISuiteReport
{
    private const double Mebibyte = 1048576.0;

    /// <summary>Read when the program starts (the registry builds the reports first), so the summary shows the load before and after.</summary>
    private readonly string _loadAtStart = LoadAverage();

    public string Suite => "scaling";

    public void Write(IReadOnlyList<BenchmarkMeasurement> measurements, TextWriter output)
    {
        var points = new List<ScalingPoint>();
        BenchmarkMeasurement? screen = null;
        foreach (var measurement in measurements)
        {
            if (ScalingPlan.Find(measurement.Name) is { } point) points.Add(ScalingPoint.From(point, measurement));
            else if (measurement.Name == ScalingPlan.ScreenCheck.Name) screen = measurement;
        }
        var samples = Series(points, ScalingSeries.Samples);
        var features = Series(points, ScalingSeries.Features);
        var trees = Series(points, ScalingSeries.Trees);
        output.WriteLine();
        output.WriteLine(Invariant($"# scaling: load average (1, 5, 15 min) at the start: {_loadAtStart}; at the end: {LoadAverage()}; {Environment.ProcessorCount} cores"));
        double bytesPerNode = BytesPerTreeNode(trees);
        WriteTable(points, bytesPerNode / Mebibyte, output);
        WriteFits(samples, features, trees, OneOffCost.Fit(trees), bytesPerNode / Mebibyte, output);
        if (samples.Count < 2 || features.Count < 2)
        {
            output.WriteLine("# the cost models need both the samples and the features series");
            return;
        }
        var oneOff = OneOffCost.Fit(trees);
        var cost = ForestCostModel.Fit(samples, features, oneOff);
        WriteCostModel(cost, oneOff, trees, output);
        var memory = CalibrateMemory(points, features, bytesPerNode);
        WriteMemoryCheck(memory, points, output);
        if (screen is not null) ScreenCostReport.Write(cost, memory, screen, output);
    }

    private static List<ScalingPoint> Series(List<ScalingPoint> points, ScalingSeries series)
    {
        var chosen = new List<ScalingPoint>();
        foreach (var point in points) if (point.Case.Series == series) chosen.Add(point);
        return chosen;
    }

    private static void WriteTable(List<ScalingPoint> points, double megabytesPerNode, TextWriter output)
    {
        output.WriteLine("# per point, medians of the runs; @500 = scaled to 500 trees (time linearly; memory by the stored trees' measured size)");
        output.WriteLine("| series | samples | features | trees | train s | train cpu s | train s @500 | train cpu s @500 | perm cpu s @500 | permuted-copy cpu s | bin cpu s | peak MiB | peak MiB @500 | data MiB | nodes/tree |");
        output.WriteLine("|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|");
        foreach (var p in points)
            output.WriteLine(Invariant(
                $"| {p.Case.Series.ToString().ToLowerInvariant()} | {p.SampleCount} | {p.FeatureCount} | {p.TreeCount} | {p.TrainSeconds:F2} | {p.TrainCpuSeconds:F2} | {p.AtScreenTrees(p.TrainSeconds):F2} | {p.AtScreenTrees(p.TrainCpuSeconds):F2} | {p.AtScreenTrees(p.PermutationCpuSeconds):F2} | {p.CopyCpuSeconds:F3} | {p.BinCpuSeconds:F2} | {p.PeakMegabytes:F0} | {p.PeakAtScreenTrees(megabytesPerNode):F0} | {p.DataMegabytes:F0} | {p.MeanNodes:F0} |"));
    }

    private static void WriteFits(List<ScalingPoint> samples, List<ScalingPoint> features, List<ScalingPoint> trees,
        OneOffCost oneOff, double megabytesPerNode, TextWriter output)
    {
        output.WriteLine();
        output.WriteLine("# fitted exponent b of y = a x^b: least squares on (log x, log y) by MathNet.Numerics Fit.Line; R^2 on the log scale");
        output.WriteLine("| series (x) | y | b | R^2 | points |");
        output.WriteLine("|---|---|---:|---:|---:|");
        foreach (var (label, series, variable) in new[]
        {
            ("samples (n, p = 1000)", samples, (Func<ScalingPoint, double>)(p => p.SampleCount)),
            ("features (p, n = 200)", features, p => p.FeatureCount),
        })
        {
            if (series.Count < 2) continue;
            Row(output, label, "train wall s per tree", ShapeCost.FitSeries(series, variable, p => p.TrainSeconds / p.TreeCount));
            Row(output, label, "train cpu s per tree", ShapeCost.FitSeries(series, variable, p => p.TrainCpuSeconds / p.TreeCount));
            Row(output, label, "train cpu s per tree, one-off part out", ShapeCost.FitSeries(series, variable, oneOff.TrainPerTree));
            Row(output, label, "permutation cpu s per tree", ShapeCost.FitSeries(series, variable, p => p.PermutationCpuSeconds / p.TreeCount));
            // At 200 samples the permutation work is about the size of the one-off part, so only
            // the samples series is fitted with it taken out.
            if (ReferenceEquals(series, samples))
                Row(output, label, "permutation cpu s per tree, one-off part out", ShapeCost.FitSeries(series, variable, oneOff.PermutationPerTree));
            Row(output, label, "binning cpu s", ShapeCost.FitSeries(series, variable, p => p.BinCpuSeconds));
            Row(output, label, "permuted-copy columns cpu s", ShapeCost.FitSeries(series, variable, p => p.CopyCpuSeconds));
            Row(output, label, "peak MiB (as grown)", ShapeCost.FitSeries(series, variable, p => p.PeakMegabytes));
            if (!double.IsNaN(megabytesPerNode))
            {
                Row(output, label, "peak MiB @500 trees", ShapeCost.FitSeries(series, variable, p => p.PeakAtScreenTrees(megabytesPerNode)));
                Row(output, label, "peak above runtime MiB @500", ShapeCost.FitSeries(series, variable,
                    p => p.PeakAtScreenTrees(megabytesPerNode) - p.StartMegabytes));
            }
            Row(output, label, "nodes per tree", ShapeCost.FitSeries(series, variable, p => p.MeanNodes));
        }
        if (trees.Count >= 2)
        {
            const string label = "trees (t, 500 x 2000)";
            Row(output, label, "train wall s", ShapeCost.FitSeries(trees, p => p.TreeCount, p => p.TrainSeconds));
            Row(output, label, "train cpu s", ShapeCost.FitSeries(trees, p => p.TreeCount, p => p.TrainCpuSeconds));
            Row(output, label, "permutation cpu s", ShapeCost.FitSeries(trees, p => p.TreeCount, p => p.PermutationCpuSeconds));
            Row(output, label, "peak MiB", ShapeCost.FitSeries(trees, p => p.TreeCount, p => p.PeakMegabytes));
            Row(output, label, "peak above runtime MiB", ShapeCost.FitSeries(trees, p => p.TreeCount, p => p.PeakMegabytes - p.StartMegabytes));
        }
    }

    private static void Row(TextWriter output, string series, string quantity, PowerLawFit fit) =>
        output.WriteLine(Invariant($"| {series} | {quantity} | {fit.Exponent:F3} | {fit.RSquared:F4} | {fit.PointCount} |"));

    private static void WriteCostModel(ForestCostModel cost, OneOffCost oneOff, List<ScalingPoint> trees, TextWriter output)
    {
        output.WriteLine();
        output.WriteLine(Invariant(
            $"# one-off part per process (intercept of core-s over trees, straight line): train {oneOff.TrainCpuSeconds:F3} s, permutation {oneOff.PermutationCpuSeconds:F3} s; taken out before the fits below"));
        output.WriteLine("# per-forest cost model, core-seconds = c * trees * n^bn * p^bp (c: geometric mean over the samples and features points)");
        WriteShape(output, "train", cost.TrainPerTree, "trees *");
        WriteShape(output, "out-of-bag permutation importance (flat over p, so p^0)", cost.PermutationPerTree, "trees *");
        WriteShape(output, "binning", cost.Binning, "");
        WriteShape(output, "permuted-copy columns (one thread)", cost.PermutedCopies, "");
        foreach (var p in trees)
        {
            double predicted = oneOff.TrainCpuSeconds + cost.Train(p.TreeCount, p.SampleCount, p.FeatureCount);
            output.WriteLine(Invariant(
                $"#   check off the fitted lines, {p.SampleCount} x {p.FeatureCount}, {p.TreeCount} trees: train predicted (one-off included) {predicted:F2} core-s, measured {p.TrainCpuSeconds:F2} (ratio {p.TrainCpuSeconds / predicted:F2})"));
        }
    }

    private static void WriteShape(TextWriter output, string label, ShapeCost shape, string trees) =>
        output.WriteLine(Invariant(
            $"#   {label}: core-s = {shape.Scale:E3} * {trees} n^{shape.SampleExponent:F3} * p^{shape.FeatureExponent:F3}   (R^2 {shape.SampleFit.RSquared:F3} over n, {shape.FeatureFit.RSquared:F3} over p)"));

    /// <summary>The resident size of one stored tree node (out-of-bag lists included): the slope of peak memory over trees, per node.</summary>
    private static double BytesPerTreeNode(List<ScalingPoint> trees)
    {
        if (trees.Count < 2) return double.NaN;
        var treeCounts = new double[trees.Count];
        var peaks = new double[trees.Count];
        var nodes = new double[trees.Count];
        for (int i = 0; i < trees.Count; i++)
        {
            treeCounts[i] = trees[i].TreeCount;
            peaks[i] = trees[i].PeakMegabytes * Mebibyte;
            nodes[i] = trees[i].MeanNodes;
        }
        var (_, bytesPerTree) = Fit.Line(treeCounts, peaks);
        Array.Sort(nodes);
        return bytesPerTree / nodes[nodes.Length / 2];
    }

    /// <summary>
    /// The fixed cost per feature is what the widest point holds beyond the raw matrix, codes and
    /// bin bounds, per feature; the runtime is then the median over points of what the other
    /// items leave unexplained (runtime, compiled code, the garbage collector's slack).
    /// </summary>
    private static ScreenMemoryModel CalibrateMemory(List<ScalingPoint> points, List<ScalingPoint> features, double bytesPerNode)
    {
        var widest = features[0];
        foreach (var point in features) if (point.FeatureCount > widest.FeatureCount) widest = point;
        double n = widest.SampleCount;
        double perFeature = (widest.DataMegabytes - widest.StartMegabytes) * Mebibyte / widest.FeatureCount
            - 5 * n - 4 * Math.Min(n, 254);
        var withoutRuntime = new ScreenMemoryModel(0, perFeature, bytesPerNode);
        var residuals = new double[points.Count];
        for (int i = 0; i < residuals.Length; i++)
            residuals[i] = points[i].PeakMegabytes * Mebibyte - PointBytes(withoutRuntime, points[i]);
        Array.Sort(residuals);
        return withoutRuntime with { RuntimeBytes = residuals[residuals.Length / 2] };
    }

    /// <summary>What the memory model says one scaling point holds at its peak: one forest, no permuted copies.</summary>
    private static double PointBytes(ScreenMemoryModel memory, ScalingPoint point) =>
        memory.RuntimeBytes + memory.DataBytes(point.SampleCount, point.FeatureCount)
        + point.TreeCount * point.MeanNodes * memory.BytesPerTreeNode
        + Environment.ProcessorCount * (4.0 * point.FeatureCount + 36.0 * point.SampleCount);

    private static void WriteMemoryCheck(ScreenMemoryModel memory, List<ScalingPoint> points, TextWriter output)
    {
        output.WriteLine();
        output.WriteLine(Invariant(
            $"# memory model: runtime while training {memory.RuntimeBytes / Mebibyte:F0} MiB (median residual); per feature 5n + 4 min(n, 254) + {memory.BytesPerFeature:F0} bytes; {memory.BytesPerTreeNode:F0} bytes per stored tree node"));
        output.WriteLine("# check: runtime + panel + trees x nodes x bytes per node + threads x (4p + 36n) against the measured peak");
        output.WriteLine("| samples | features | trees | modelled MiB | measured MiB | ratio |");
        output.WriteLine("|---:|---:|---:|---:|---:|---:|");
        foreach (var p in points)
        {
            double modelled = PointBytes(memory, p) / Mebibyte;
            output.WriteLine(Invariant(
                $"| {p.SampleCount} | {p.FeatureCount} | {p.TreeCount} | {modelled:F0} | {p.PeakMegabytes:F0} | {p.PeakMegabytes / modelled:F2} |"));
        }
    }

    private static string LoadAverage()
    {
        const string path = "/proc/loadavg";
        if (!File.Exists(path)) return "unknown";
        var fields = File.ReadAllText(path).Split(' ');
        return fields.Length >= 3 ? $"{fields[0]}, {fields[1]}, {fields[2]}" : "unknown";
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
