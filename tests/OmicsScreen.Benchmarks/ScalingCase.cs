using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Screening.Importance;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// One point of a scaling series: bins a simulated panel with 10 planted markers, then grows one
/// forest as the screen does (floor(sqrt(p)) features per split, leaves to purity, all cores)
/// and measures its out-of-bag permutation importance and the building of one permuted-copy column per
/// feature. Generation, binning and a warm-up forest are not part of the training figures; the
/// resident high-water mark is reset after them, so the peak covers the data held (raw and
/// binned) plus what training adds.
/// </summary>
public sealed class ScalingCase(ScalingSeries series, int sampleCount, int featureCount, int treeCount) : IBenchmarkCase
{
    private const int WarmUpRows = 200;
    private const int WarmUpTrees = 40;

    public ScalingSeries Series => series;
    public int SampleCount => sampleCount;
    public int FeatureCount => featureCount;
    public int TreeCount => treeCount;

    public string Name => string.Create(CultureInfo.InvariantCulture,
        $"scaling-{series.ToString().ToLowerInvariant()}-{sampleCount}x{featureCount}-t{treeCount}");

    public void Prepare(string workDirectory)
    {
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        long startBytes = ProcessMemory.CurrentBytes();
        var panel = PlantedMarkerPanel.Generate(sampleCount, featureCount);
        var binClock = ProcessorClock.Start();
        var watch = Stopwatch.StartNew();
        var binned = new BinMapper().Bin(panel.Matrix);
        double binSeconds = watch.Elapsed.TotalSeconds;
        double binCpuSeconds = binClock.Lap();
        WarmUp(binned, panel.Outcome);
        // Give the runtime's background compiler time to finish the optimised code of the warm-up.
        Thread.Sleep(TimeSpan.FromSeconds(1));
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        long dataBytes = ProcessMemory.CurrentBytes();
        bool peakReset = ProcessMemory.TryResetPeak();

        // On a shared machine wall time swings with other processes; processor time (core-seconds)
        // does not, and it is what carries over to a machine with more cores.
        var options = new ForestOptions { TreeCount = treeCount, Seed = 7 };
        var processor = ProcessorClock.Start();
        watch.Restart();
        var forest = ForestTrainer.Train(binned, panel.Outcome, options);
        double trainSeconds = watch.Elapsed.TotalSeconds;
        double trainCpuSeconds = processor.Lap();
        long trainPeakBytes = ProcessMemory.PeakBytes();

        watch.Restart();
        var permutation = OutOfBagPermutationImportance.Measure(forest, binned, panel.Outcome);
        double permutationSeconds = watch.Elapsed.TotalSeconds;
        double permutationCpuSeconds = processor.Lap();
        GC.KeepAlive(permutation);

        // The corrected-importance forest of every repeat first copies and shuffles one permuted copy
        // column per feature, on one thread.
        watch.Restart();
        var augmented = CorrectedImpurityImportance.Augment(binned, [], options.Seed, 0);
        double copySeconds = watch.Elapsed.TotalSeconds;
        double copyCpuSeconds = processor.Lap();
        GC.KeepAlive(augmented);
        GC.KeepAlive(panel);

        double nodes = 0;
        foreach (var tree in forest.Enumerate()) nodes += tree.NodeCount;
        const double Megabyte = 1048576.0;
        return
        [
            F("train_s", trainSeconds, "F3"),
            F("train_cpu_s", trainCpuSeconds, "F3"),
            F("perm_s", permutationSeconds, "F3"),
            F("perm_cpu_s", permutationCpuSeconds, "F3"),
            F("copy_s", copySeconds, "F3"),
            F("copy_cpu_s", copyCpuSeconds, "F3"),
            F("bin_s", binSeconds, "F3"),
            F("bin_cpu_s", binCpuSeconds, "F3"),
            F("train_peak_mb", trainPeakBytes / Megabyte, "F1"),
            F("start_mb", startBytes / Megabyte, "F1"),
            F("data_mb", dataBytes / Megabyte, "F1"),
            F("mean_nodes", nodes / treeCount, "F1"),
            "peak_reset=" + (peakReset ? "yes" : "no"),
        ];
    }

    /// <summary>
    /// Grows and scores a small forest on a few rows first, so that compiling the engine's code
    /// (a fixed cost of each process, large beside a small point's training) is not timed.
    /// </summary>
    private static void WarmUp(BinnedMatrix binned, Engine.Panels.ClassOutcome outcome)
    {
        var rows = new int[Math.Min(binned.SampleCount, WarmUpRows)];
        for (int i = 0; i < rows.Length; i++) rows[i] = i * (binned.SampleCount / rows.Length);
        var forest = ForestTrainer.Train(binned, outcome, new ForestOptions { TreeCount = WarmUpTrees, Seed = 3 }, rows);
        OutOfBagPermutationImportance.Measure(forest, binned, outcome);
    }

    private static string F(string key, double value, string format) =>
        key + "=" + value.ToString(format, CultureInfo.InvariantCulture);
}
