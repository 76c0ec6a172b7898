using System.Globalization;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// The grow-process suite's summary: the whole `omicsscreen grow` process beside ranger's whole
/// process on the same file, each the median over the runs, and their ratio (issue 15's goal:
/// at most 0.2).
/// </summary>
public sealed class GrowProcessReport : ISuiteReport
{
    public string Suite => "grow-process";

    public void Write(IReadOnlyList<BenchmarkMeasurement> measurements, TextWriter output)
    {
        output.WriteLine();
        string load = File.Exists("/proc/loadavg") ? string.Join(", ", File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "unknown";
        output.WriteLine($"# grow-process: whole processes, median of the runs; {Environment.ProcessorCount} cores, load average {load}");
        output.WriteLine("| panel | omicsscreen grow | ranger (Rscript) | ratio |");
        output.WriteLine("| --- | --- | --- | --- |");
        foreach (var m in measurements)
        {
            double ours = m.MedianFigure("omicsscreen_s");
            double ranger = m.MedianFigure("ranger_s");
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"| {m.Name.Replace("grow-process-", "", StringComparison.Ordinal)} | {Seconds(ours)} | {Seconds(ranger)} | {(double.IsNaN(ours) || double.IsNaN(ranger) ? "" : (ours / ranger).ToString("F2", CultureInfo.InvariantCulture))} |"));
        }
    }

    private static string Seconds(double value) =>
        double.IsNaN(value) ? "not run" : value.ToString("F2", CultureInfo.InvariantCulture) + " s";
}
