using System.Globalization;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// The forest suite's summary, a markdown table ready for the README: per shape, our median
/// training and binning time and out-of-bag error over seeds 1..5, beside scikit-learn's and
/// ranger's on the same panel and seeds ("not run" when not installed or skipped), and the speed ratio to the faster of them.
/// </summary>
public sealed class ForestReport : ISuiteReport
{
    private static readonly string[] Libraries = ["ranger", "scikit-learn"];

    public string Suite => "forest";

    public void Write(IReadOnlyList<BenchmarkMeasurement> measurements, TextWriter output)
    {
        output.WriteLine();
        output.WriteLine(Invariant($"# forest: {ForestTrainingCase.TreeCount} trees, floor(sqrt(p)) features per split, leaves to purity, bootstrap; OOB error mean (min-max) over seeds 1..{ForestTrainingCase.SeedCount}; {Environment.ProcessorCount} cores, load average {LoadAverage()}"));
        output.WriteLine("| shape | OmicsScreen training (median) | ns per (sample x feature tried x level), ours / estimated limit | binning | OOB error ours | ranger training | OOB error ranger | scikit-learn training | OOB error scikit-learn | speed ratio to the faster library |");
        output.WriteLine("| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |");
        foreach (var m in measurements)
        {
            double train = m.MedianFigure("train_median_s");
            var cells = new List<string>
            {
                m.Name.Replace("forest-", "", StringComparison.Ordinal),
                Invariant($"{train:F3} s"),
                Invariant($"{m.MedianFigure("ns_per_visit"):F2} / {m.MedianFigure("ns_per_visit_limit"):F2}"),
                Invariant($"{m.MedianFigure("bin_s"):F3} s ({m.MedianFigure("bin_ns_per_cell"):F0} ns/cell)"),
                Error(m, ""),
            };
            double fastest = double.PositiveInfinity;
            foreach (var library in Libraries)
            {
                double seconds = m.MedianFigure(library + "_train_median_s");
                cells.Add(double.IsNaN(seconds) ? "not run" : Invariant($"{seconds:F2} s"));
                cells.Add(double.IsNaN(seconds) ? "" : Error(m, library + "_"));
                if (!double.IsNaN(seconds)) fastest = Math.Min(fastest, seconds);
            }
            cells.Add(double.IsPositiveInfinity(fastest) ? "" : Invariant($"{fastest / train:F1}x"));
            output.WriteLine("| " + string.Join(" | ", cells) + " |");
        }
    }

    private static string Error(BenchmarkMeasurement m, string prefix) =>
        Invariant($"{m.MedianFigure(prefix + "oob_mean"):F4} ({m.MedianFigure(prefix + "oob_min"):F3}-{m.MedianFigure(prefix + "oob_max"):F3})");

    private static string LoadAverage()
    {
        const string path = "/proc/loadavg";
        if (!File.Exists(path)) return "unknown";
        var fields = File.ReadAllText(path).Split(' ');
        return fields.Length >= 3 ? $"{fields[0]}, {fields[1]}, {fields[2]}" : "unknown";
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
