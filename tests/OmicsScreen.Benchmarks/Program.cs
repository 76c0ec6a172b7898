using System.Diagnostics;
using System.Globalization;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Runs each benchmark case several times, each time in a fresh child process so that the peak
/// resident memory reported belongs to that case alone, and prints the median time.
/// Usage: omicsscreen-bench [SUITE|CASE ...] [--runs N] [--work DIR]
/// or: omicsscreen-bench calibration [--seeds N] [--quick] [--threads T] [--kind classes|measured|follow-up] [--only NAME]
/// (the calibration suite measures error control, not time, so it runs in this process)
/// or: omicsscreen-bench write-panels DIR (the panels of reference/forest, for its scripts).
/// </summary>
public static class Program
{
    public static int Main(string[] args)
    {
        CultureInfo.DefaultThreadCurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
        if (args.Length >= 3 && args[0] == "--child") return RunChild(args[1], args[2]);
        if (args.Length >= 1 && args[0] == "calibration") return Calibration.CalibrationSuite.Run(args[1..], Console.Out);
        if (args.Length == 2 && args[0] == "write-panels") return ReferenceForests.WritePanels(args[1], Console.Out);

        int runs = 3;
        string work = Path.Combine(Path.GetTempPath(), "omicsscreen-bench");
        var selectors = new List<string>();
        for (int i = 0; i < args.Length; i++)
        {
            if (args[i] == "--runs" && i + 1 < args.Length) runs = int.Parse(args[++i], CultureInfo.InvariantCulture);
            else if (args[i] == "--work" && i + 1 < args.Length) work = args[++i];
            else selectors.Add(args[i]);
        }
        var chosen = BenchmarkRegistry.All
            .Where(c => selectors.Count == 0 || selectors.Contains(c.Suite) || selectors.Contains(c.Case.Name))
            .ToList();
        if (chosen.Count == 0)
        {
            Console.Error.WriteLine("No benchmark matches. Known suites and cases:");
            foreach (var (suite, c) in BenchmarkRegistry.All) Console.Error.WriteLine($"  {suite,-10} {c.Name}");
            return 2;
        }
        Directory.CreateDirectory(work);
        Console.WriteLine($"# machine: {Environment.ProcessorCount} cores, {Environment.OSVersion}, .NET {Environment.Version}");
        Console.WriteLine($"# median of {runs} runs, each in a fresh process; peak = peak resident set of that process");
        var measurements = new List<BenchmarkMeasurement>();
        foreach (var (suite, c) in chosen)
        {
            c.Prepare(work);
            var seconds = new List<double>();
            long peak = 0;
            IReadOnlyList<string> extras = [];
            var caseRuns = new List<BenchmarkRun>();
            for (int r = 0; r < runs; r++)
            {
                var (s, p, e) = RunInChild(c.Name, work);
                seconds.Add(s);
                peak = Math.Max(peak, p);
                extras = e;
                caseRuns.Add(new BenchmarkRun(s, p, e));
            }
            measurements.Add(new BenchmarkMeasurement(suite, c.Name, caseRuns));
            seconds.Sort();
            double median = seconds[seconds.Count / 2];
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{suite,-8} {c.Name,-28} median_s={median:F3} min_s={seconds[0]:F3} peak_mb={peak / 1048576.0:F0} {string.Join(' ', extras)}"));
        }
        foreach (var report in BenchmarkRegistry.Reports)
        {
            var ofSuite = measurements.Where(m => m.Suite == report.Suite).ToList();
            if (ofSuite.Count > 0) report.Write(ofSuite, Console.Out);
        }
        return 0;
    }

    private static (double Seconds, long PeakBytes, IReadOnlyList<string> Extras) RunInChild(string name, string work)
    {
        var self = Environment.ProcessPath!;
        var start = new ProcessStartInfo(self) { RedirectStandardOutput = true, UseShellExecute = false };
        // Under `dotnet Benchmarks.dll`, ProcessPath is the host; pass the assembly again.
        if (Path.GetFileNameWithoutExtension(self) == "dotnet") start.ArgumentList.Add(typeof(Program).Assembly.Location);
        start.ArgumentList.Add("--child");
        start.ArgumentList.Add(name);
        start.ArgumentList.Add(work);
        using var child = Process.Start(start)!;
        string output = child.StandardOutput.ReadToEnd();
        child.WaitForExit();
        if (child.ExitCode != 0) throw new InvalidOperationException($"Benchmark {name} failed:\n{output}");
        var fields = output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Last().Split(' ');
        double seconds = double.Parse(fields[0], CultureInfo.InvariantCulture);
        long peak = long.Parse(fields[1], CultureInfo.InvariantCulture);
        return (seconds, peak, fields.Skip(2).ToArray());
    }

    private static int RunChild(string name, string work)
    {
        var c = BenchmarkRegistry.All.Single(x => x.Case.Name == name).Case;
        var watch = Stopwatch.StartNew();
        var extras = c.Run(work);
        watch.Stop();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{watch.Elapsed.TotalSeconds:R} {PeakResidentBytes()} {string.Join(' ', extras)}"));
        return 0;
    }

    /// <summary>VmHWM from /proc (the true high-water mark); falls back to the runtime's figure elsewhere.</summary>
    internal static long PeakResidentBytes()
    {
        const string status = "/proc/self/status";
        if (File.Exists(status))
            foreach (var line in File.ReadLines(status))
                if (line.StartsWith("VmHWM:", StringComparison.Ordinal))
                    return long.Parse(line[6..].Trim().Split(' ')[0], CultureInfo.InvariantCulture) * 1024;
        return Process.GetCurrentProcess().PeakWorkingSet64;
    }
}
