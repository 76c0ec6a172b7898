using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Importance;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Regression or survival forests (issues 17 and 18) on a simulated panel: the case's trees, floor(sqrt(p))
/// features per split, leaves down to one sample, bootstrap, all cores, seeds 1..3. Prints the
/// median training time and the out-of-bag error (MSE, or 1 - Harrell's C) beside ranger's on the
/// same panel and seeds when Rscript and ranger are installed (reference/outcomes/outcome_forests_ranger.R).
/// </summary>
/// <remarks>
/// Panel: independent N(0, 1) features (float32). Measured: y = x1 + x2 + x3 + x4 + x5 + N(0, 1).
/// Time to event: hazard 0.1 exp(0.5 (x1 + x2 + x3)), censoring uniform on (0, 20).
/// The generator is seeded (42), so every run and ranger see the same values.
/// </remarks>
public sealed class OutcomeForestCase(string name, bool timeToEvent, int sampleCount, int featureCount, int treeCount) : IBenchmarkCase
{
    public const int SeedCount = 3;

    public string Name => name;

    private string ReferencePath(string work) => Path.Combine(work, name + ".reference.txt");

    public void Prepare(string workDirectory)
    {
        string referencePath = ReferencePath(workDirectory);
        File.Delete(referencePath);
        string script = Path.Combine(ReferenceData.Directory, "outcomes", "outcome_forests_ranger.R");
        if (Environment.GetEnvironmentVariable("OMICSSCREEN_BENCH_REFERENCE") == "0" || !File.Exists("/usr/bin/Rscript")) return;
        var (matrix, outcome, events) = Generate();
        string panelPath = Path.Combine(workDirectory, name + ".bin");
        using (var writer = new BinaryWriter(File.Create(panelPath)))
        {
            writer.Write(sampleCount);
            writer.Write(featureCount);
            foreach (double v in outcome) writer.Write(v);
            foreach (bool e in events) writer.Write(e ? 1 : 0);
            for (int f = 0; f < featureCount; f++)
                foreach (float v in matrix.Column(f)) writer.Write(v);
        }
        var start = new ProcessStartInfo("/usr/bin/Rscript") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var arg in new[] { script, panelPath, timeToEvent ? "survival" : "measured", SeedCount.ToString(CultureInfo.InvariantCulture),
                     treeCount.ToString(CultureInfo.InvariantCulture), Environment.ProcessorCount.ToString(CultureInfo.InvariantCulture) })
            start.ArgumentList.Add(arg);
        using var process = Process.Start(start)!;
        var output = process.StandardOutput.ReadToEnd();
        process.StandardError.ReadToEnd();
        process.WaitForExit();
        File.Delete(panelPath);
        if (process.ExitCode != 0)
        {
            Console.WriteLine($"# {name}: ranger not run (Rscript exit {process.ExitCode}; Debian: r-cran-ranger r-cran-survival)");
            return;
        }
        foreach (var line in output.Split('\n', StringSplitOptions.RemoveEmptyEntries)) Console.WriteLine($"# {name} ranger: {line.Trim()}");
        var runs = output.Split('\n').Where(l => l.StartsWith("run ", StringComparison.Ordinal)).Select(l => l.Split(' ', StringSplitOptions.RemoveEmptyEntries)).ToList();
        var errors = runs.Select(r => double.Parse(r[2], CultureInfo.InvariantCulture)).ToArray();
        var times = runs.Select(r => double.Parse(r[3], CultureInfo.InvariantCulture)).ToArray();
        File.WriteAllText(referencePath, string.Create(CultureInfo.InvariantCulture,
            $"ranger_error_mean={errors.Average():F4} ranger_train_median_s={Median(times):F3}"));
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var (matrix, outcome, events) = Generate();
        var watch = Stopwatch.StartNew();
        var binned = new BinMapper().Bin(matrix);
        double binSeconds = watch.Elapsed.TotalSeconds;
        var followUp = timeToEvent ? new FollowUpTimes(outcome, events) : null;
        var seconds = new double[SeedCount];
        var errors = new double[SeedCount];
        for (int run = 0; run < SeedCount; run++)
        {
            var options = new ForestOptions { TreeCount = treeCount, Seed = (ulong)(run + 1) };
            watch.Restart();
            if (followUp is null)
            {
                var forest = RegressionForestTrainer.Train(binned, outcome, options);
                seconds[run] = watch.Elapsed.TotalSeconds;
                errors[run] = new RegressionOutOfBag(forest, outcome).MeanSquaredError;
            }
            else
            {
                var forest = SurvivalForestTrainer.Train(binned, followUp, options);
                seconds[run] = watch.Elapsed.TotalSeconds;
                errors[run] = 1 - SurvivalImportance.OutOfBagConcordance(forest).Concordance;
            }
        }
        var figures = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture, $"trees={treeCount}"),
            string.Create(CultureInfo.InvariantCulture, $"bin_s={binSeconds:F3}"),
            string.Create(CultureInfo.InvariantCulture, $"train_median_s={Median(seconds):F3}"),
            string.Create(CultureInfo.InvariantCulture, $"error_mean={errors.Average():F4}"),
            "error=" + (timeToEvent ? "1-C" : "oob_mse"),
        };
        string reference = ReferencePath(workDirectory);
        if (File.Exists(reference)) figures.Add(File.ReadAllText(reference));
        return figures;
    }

    private (FeatureMatrix Matrix, double[] Outcome, bool[] Events) Generate()
    {
        var random = new Random(42);
        double Normal() => Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
        var builder = new FeatureMatrixBuilder(Enumerable.Range(1, featureCount).Select(f => "f" + f).ToArray(),
            Enumerable.Range(1, sampleCount).Select(s => "S" + s).ToArray());
        for (int f = 0; f < featureCount; f++)
        {
            var column = builder.Column(f);
            for (int s = 0; s < sampleCount; s++) column[s] = (float)Normal();
        }
        var matrix = builder.Build();
        var outcome = new double[sampleCount];
        var events = new bool[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            double signal = 0;
            for (int f = 0; f < (timeToEvent ? 3 : 5); f++) signal += matrix.Column(f)[s];
            if (!timeToEvent)
            {
                outcome[s] = signal + Normal();
                continue;
            }
            double eventTime = -Math.Log(1 - random.NextDouble()) / (0.1 * Math.Exp(0.5 * signal));
            double censorTime = 20 * random.NextDouble();
            outcome[s] = Math.Min(eventTime, censorTime);
            events[s] = eventTime <= censorTime;
        }
        return (matrix, outcome, events);
    }

    private static double Median(double[] values)
    {
        var sorted = values.Order().ToArray();
        int mid = sorted.Length / 2;
        return sorted.Length % 2 == 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
    }
}
