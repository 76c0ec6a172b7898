using System.Diagnostics;
using System.Globalization;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Runs the general-purpose random forests (scikit-learn, ranger) on a benchmark panel through
/// reference/forest/reference_forests.py, when Debian's python3 and the libraries are installed,
/// and reads back their summary lines. Set OMICSSCREEN_BENCH_REFERENCE=0 to skip them.
/// </summary>
public static class ReferenceForests
{
    public const string Python = "/usr/bin/python3";

    public static string Script => Path.Combine(ReferenceData.Directory, "forest", "reference_forests.py");

    public static bool Enabled => Environment.GetEnvironmentVariable("OMICSSCREEN_BENCH_REFERENCE") != "0"
        && File.Exists(Python) && File.Exists(Script);

    /// <summary>Runs the script; returns its summary lines as key=value maps, one per library found.</summary>
    public static List<Dictionary<string, string>> Run(string panelPath, int seeds, int trees, TextWriter log)
    {
        var start = new ProcessStartInfo(Python) { RedirectStandardOutput = true, UseShellExecute = false };
        start.ArgumentList.Add(Script);
        start.ArgumentList.Add(panelPath);
        start.ArgumentList.Add("--seeds");
        start.ArgumentList.Add(seeds.ToString(CultureInfo.InvariantCulture));
        start.ArgumentList.Add("--trees");
        start.ArgumentList.Add(trees.ToString(CultureInfo.InvariantCulture));
        start.ArgumentList.Add("--threads");
        start.ArgumentList.Add(Environment.ProcessorCount.ToString(CultureInfo.InvariantCulture));
        using var process = Process.Start(start)!;
        var summaries = new List<Dictionary<string, string>>();
        string? line;
        while ((line = process.StandardOutput.ReadLine()) is not null)
        {
            log.WriteLine("#   " + line);
            if (!line.StartsWith("summary ", StringComparison.Ordinal)) continue;
            summaries.Add(line.Split(' ', StringSplitOptions.RemoveEmptyEntries).Skip(1)
                .Select(field => field.Split('=', 2)).ToDictionary(kv => kv[0], kv => kv[1]));
        }
        process.WaitForExit();
        if (process.ExitCode != 0) throw new InvalidOperationException($"{Script} failed on {panelPath}.");
        return summaries;
    }

    /// <summary>Writes the small and the benchmark shapes as NAME.bin into directory.</summary>
    public static int WritePanels(string directory, TextWriter output)
    {
        Directory.CreateDirectory(directory);
        foreach (var (name, samples, features) in ForestReferenceShapes.Small.Concat(ForestReferenceShapes.Benchmark))
        {
            string path = Path.Combine(directory, name + ".bin");
            ReferencePanelFile.Write(ForestReferenceShapes.Generate(samples, features), path);
            output.WriteLine(path);
        }
        return 0;
    }
}
