using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Bins and grows 500-tree forests (k = floor(sqrt(p)), leaves to purity, bootstrap, all cores)
/// on a simulated panel, one per seed 1..5. Generation is not timed; binning and each training
/// are timed separately; the median training time and the out-of-bag error over the seeds are
/// reported. <see cref="Prepare"/> runs scikit-learn and ranger once on the same panel and seeds
/// (issue 15), so the suite's report sets their figures beside ours.
/// </summary>
/// <param name="estimatedLimitSeconds">
/// Issue 15's estimate of the physical limit for this shape on 2 cores (a byte-coded histogram
/// engine touching about n x k bytes per tree level): the work count of ns_per_visit divided into
/// it gives the limit in the same unit, printed beside ours.
/// </param>
public sealed class ForestTrainingCase(string name, int sampleCount, int featureCount, double estimatedLimitSeconds) : IBenchmarkCase
{
    public const int TreeCount = 500;
    public const int SeedCount = 5;

    public string Name => name;

    private string ReferencePath(string workDirectory) => Path.Combine(workDirectory, name + ".reference.txt");

    public void Prepare(string workDirectory)
    {
        string referencePath = ReferencePath(workDirectory);
        File.Delete(referencePath);
        if (!ReferenceForests.Enabled) return;
        string panelPath = Path.Combine(workDirectory, name + ".bin");
        ReferencePanelFile.Write(PlantedMarkerPanel.Generate(sampleCount, featureCount), panelPath);
        Console.WriteLine($"# {name}: general-purpose libraries on the same panel, seeds 1..{SeedCount}");
        var summaries = ReferenceForests.Run(panelPath, SeedCount, TreeCount, Console.Out);
        File.WriteAllLines(referencePath, summaries.Select(s => string.Join(' ', s.Select(kv => kv.Key + "=" + kv.Value))));
        File.Delete(panelPath);
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var panel = PlantedMarkerPanel.Generate(sampleCount, featureCount);
        var watch = Stopwatch.StartNew();
        var binned = new BinMapper().Bin(panel.Matrix);
        double binSeconds = watch.Elapsed.TotalSeconds;

        var seconds = new double[SeedCount];
        var cpuSeconds = new double[SeedCount];
        var errors = new double[SeedCount];
        var process = Process.GetCurrentProcess();
        Forest forest = null!;
        for (int run = 0; run < SeedCount; run++)
        {
            var options = new ForestOptions { TreeCount = TreeCount, Seed = (ulong)(run + 1) };
            process.Refresh();
            var cpuBefore = process.TotalProcessorTime;
            watch.Restart();
            forest = ForestTrainer.Train(binned, panel.Outcome, options);
            errors[run] = new OutOfBagVotes(forest, panel.Outcome).Error;
            seconds[run] = watch.Elapsed.TotalSeconds;
            process.Refresh();
            cpuSeconds[run] = (process.TotalProcessorTime - cpuBefore).TotalSeconds;
        }
        double median = Median(seconds);
        double cpuMedian = Median(cpuSeconds);
        int tried = ForestOptions.Default.Tree.ResolveFeaturesPerSplit(featureCount);
        double visits = SearchVisits(forest, tried);
        var figures = new List<string>
        {
            F("bin_s", binSeconds, "F3"),
            F("bin_ns_per_cell", binSeconds * 1e9 / ((double)sampleCount * featureCount), "F1"),
            F("train_median_s", median, "F3"),
            "train_s=" + string.Join(',', seconds.Select(s => s.ToString("F3", CultureInfo.InvariantCulture))),
            F("trees_per_s", TreeCount / median, "F0"),
            F("oob_mean", errors.Average(), "F4"),
            F("oob_min", errors.Min(), "F4"),
            F("oob_max", errors.Max(), "F4"),
            F("ns_per_visit", median * 1e9 * Environment.ProcessorCount / visits, "F2"),
            F("limit_s", estimatedLimitSeconds, "F2"),
            F("ns_per_visit_limit", estimatedLimitSeconds * 1e9 * 2 / visits, "F2"),
            F("train_cpu_median_s", cpuMedian, "F3"),
            F("ns_cpu_per_visit", cpuMedian * 1e9 / visits, "F2"),
            F("mean_nodes", forest.Enumerate().Average(t => t.NodeCount), "F1"),
        };
        // The general libraries' figures, measured once by Prepare in the parent process.
        string referencePath = ReferencePath(workDirectory);
        if (File.Exists(referencePath))
            foreach (var line in File.ReadAllLines(referencePath))
            {
                var fields = line.Split(' ').Select(f => f.Split('=', 2)).ToDictionary(kv => kv[0], kv => kv[1]);
                string library = fields["library"];
                figures.Add($"{library}_oob_mean={fields["oob_mean"]}");
                figures.Add($"{library}_oob_min={fields["oob_min"]}");
                figures.Add($"{library}_oob_max={fields["oob_max"]}");
                figures.Add($"{library}_train_median_s={fields["train_median_s"]}");
            }
        return figures;
    }

    private static double Median(double[] values)
    {
        var sorted = (double[])values.Clone();
        Array.Sort(sorted);
        return sorted[sorted.Length / 2];
    }

    /// <summary>
    /// In-bag samples x features tried summed over every split node of every tree: the work of
    /// split search, one visit per (sample, feature tried, tree level). Approximate: features
    /// found constant and searches that found no split are not counted.
    /// </summary>
    internal static double SearchVisits(Forest forest, int tried)
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
