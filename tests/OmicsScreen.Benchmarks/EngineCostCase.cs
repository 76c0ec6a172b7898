using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// The engine's two costs on one thread in processor seconds, the least noisy figure on a shared
/// machine: binning the forest suite's panel (the smallest of several passes, after a warm-up
/// pass) beside the engine's first binning (<see cref="ReferenceBinning"/>, issue 15's yardstick), and growing <paramref name="treeCount"/> trees at the forest suite's settings (the
/// smallest of three seeds' forests after a warm-up forest). Used to measure engine changes
/// before and after; the smallest of repeated passes is the figure least disturbed by other work.
/// </summary>
public sealed class EngineCostCase(string name, int sampleCount, int featureCount, int treeCount) : IBenchmarkCase
{
    private const int BinPasses = 15;
    private const int TrainPasses = 3;

    public string Name => name;

    public void Prepare(string workDirectory) { }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var panel = PlantedMarkerPanel.Generate(sampleCount, featureCount);
        var mapper = new BinMapper();
        var binned = mapper.Bin(panel.Matrix, threadCount: 1);
        double binBest = double.PositiveInfinity;
        for (int pass = 0; pass < BinPasses; pass++)
        {
            var before = ProcessorSeconds();
            binned = mapper.Bin(panel.Matrix, threadCount: 1);
            binBest = Math.Min(binBest, ProcessorSeconds() - before);
        }

        ReferenceBinning.Bin(panel.Matrix);
        double originalBest = double.PositiveInfinity;
        for (int pass = 0; pass < BinPasses; pass++)
        {
            var before = ProcessorSeconds();
            ReferenceBinning.Bin(panel.Matrix);
            originalBest = Math.Min(originalBest, ProcessorSeconds() - before);
        }

        var warmUp = new ForestOptions { TreeCount = Math.Max(1, treeCount / 10), Seed = 99, ThreadCount = 1 };
        ForestTrainer.Train(binned, panel.Outcome, warmUp);
        double trainBest = double.PositiveInfinity;
        double error = 0;
        double visits = 0;
        int tried = ForestOptions.Default.Tree.ResolveFeaturesPerSplit(featureCount);
        for (int pass = 0; pass < TrainPasses; pass++)
        {
            var options = new ForestOptions { TreeCount = treeCount, Seed = (ulong)(pass + 1), ThreadCount = 1 };
            var before = ProcessorSeconds();
            var forest = ForestTrainer.Train(binned, panel.Outcome, options);
            trainBest = Math.Min(trainBest, ProcessorSeconds() - before);
            error += new OutOfBagVotes(forest, panel.Outcome).Error / TrainPasses;
            visits = ForestTrainingCase.SearchVisits(forest, tried);
        }
        double cells = (double)sampleCount * featureCount;
        return
        [
            F("bin_cpu_s", binBest, "F4"),
            F("bin_cpu_ns_per_cell", binBest * 1e9 / cells, "F1"),
            F("bin_original_cpu_s", originalBest, "F4"),
            F("bin_speedup", originalBest / binBest, "F1"),
            F("train_cpu_s", trainBest, "F4"),
            F("trees", treeCount, "F0"),
            F("train_cpu_ns_per_visit", trainBest * 1e9 / visits, "F2"),
            F("oob_mean", error, "F4"),
            "load=" + LoadAverage(),
        ];
    }

    /// <summary>getrusage's figure (microseconds), finer than /proc's clock ticks that Process reads.</summary>
    private static double ProcessorSeconds() => Environment.CpuUsage.TotalTime.TotalSeconds;

    private static string LoadAverage()
    {
        const string path = "/proc/loadavg";
        return File.Exists(path) ? File.ReadAllText(path).Split(' ')[0] : "unknown";
    }

    private static string F(string key, double value, string format) =>
        key + "=" + value.ToString(format, CultureInfo.InvariantCulture);
}
