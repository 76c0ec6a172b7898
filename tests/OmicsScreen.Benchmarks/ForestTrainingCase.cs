using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Bins and grows a 500-tree forest (k = floor(sqrt(p)), leaves to purity, all cores) on a
/// simulated panel. Generation is not timed; binning and each of three trainings are timed
/// separately and the median training time is reported.
/// </summary>
public sealed class ForestTrainingCase(string name, int sampleCount, int featureCount) : IBenchmarkCase
{
    private const int TreeCount = 500;
    private const int Trainings = 3;

    public string Name => name;

    public void Prepare(string workDirectory)
    {
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var panel = PlantedMarkerPanel.Generate(sampleCount, featureCount);
        var watch = Stopwatch.StartNew();
        var binned = new BinMapper().Bin(panel.Matrix);
        double binSeconds = watch.Elapsed.TotalSeconds;

        var options = new ForestOptions { TreeCount = TreeCount, Seed = 7 };
        var seconds = new double[Trainings];
        var cpuSeconds = new double[Trainings];
        var process = Process.GetCurrentProcess();
        Forest forest = null!;
        double oobError = double.NaN;
        for (int run = 0; run < Trainings; run++)
        {
            process.Refresh();
            var cpuBefore = process.TotalProcessorTime;
            watch.Restart();
            forest = ForestTrainer.Train(binned, panel.Outcome, options);
            oobError = new OutOfBagVotes(forest, panel.Outcome).Error;
            seconds[run] = watch.Elapsed.TotalSeconds;
            process.Refresh();
            cpuSeconds[run] = (process.TotalProcessorTime - cpuBefore).TotalSeconds;
        }
        var sorted = (double[])seconds.Clone();
        Array.Sort(sorted);
        double median = sorted[Trainings / 2];
        Array.Sort(cpuSeconds);
        double cpuMedian = cpuSeconds[Trainings / 2];
        int tried = options.Tree.ResolveFeaturesPerSplit(featureCount);
        double visits = SearchVisits(forest, tried);
        return
        [
            F("bin_s", binSeconds, "F3"),
            F("train_median_s", median, "F3"),
            "train_s=" + string.Join(',', seconds.Select(s => s.ToString("F3", CultureInfo.InvariantCulture))),
            F("trees_per_s", TreeCount / median, "F0"),
            F("oob_error", oobError, "F4"),
            F("ns_per_visit", median * 1e9 * Environment.ProcessorCount / visits, "F2"),
            F("train_cpu_median_s", cpuMedian, "F3"),
            F("ns_cpu_per_visit", cpuMedian * 1e9 / visits, "F2"),
            F("mean_nodes", forest.Enumerate().Average(t => t.NodeCount), "F1"),
        ];
    }

    /// <summary>
    /// In-bag samples x features tried summed over every split node of every tree: the work of
    /// split search, one visit per (sample, feature tried, tree level). Approximate: features
    /// found constant and searches that found no split are not counted.
    /// </summary>
    private static double SearchVisits(Forest forest, int tried)
    {
        double visits = 0;
        foreach (var tree in forest.Enumerate())
            for (int node = 0; node < tree.NodeCount; node++)
                if (!tree.IsLeaf(node)) visits += (double)tree.NodeSampleCounts[node] * tried;
        return visits;
    }

    private static string F(string key, double value, string format) =>
        key + "=" + value.ToString(format, CultureInfo.InvariantCulture);
}
