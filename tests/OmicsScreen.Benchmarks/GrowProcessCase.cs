using System.Diagnostics;
using System.Globalization;
using System.Text;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Issue 15's whole-process comparison: `omicsscreen grow` on a panel CSV against the
/// general-purpose library's whole process on the same file (ranger through Rscript,
/// reference/forest/grow_ranger.R), each a fresh process timed from start to exit, start-up,
/// reading, binning, training and printing included. Seed 1, 500 trees, all cores.
/// </summary>
/// <remarks>
/// The CLI is the Release build in src/OmicsScreen.Cli/bin/Release/net10.0 (build it first), or
/// the executable named by OMICSSCREEN_CLI, which is how start-up settings (ReadyToRun, tiered
/// compilation) are compared: publish each variant and point the variable at it.
/// </remarks>
public sealed class GrowProcessCase(string name, int sampleCount, int featureCount) : IBenchmarkCase
{
    private const string Rscript = "/usr/bin/Rscript";

    public string Name => name;

    private string PanelPath(string workDirectory) => Path.Combine(workDirectory, name + ".csv");

    public void Prepare(string workDirectory)
    {
        string path = PanelPath(workDirectory);
        if (File.Exists(path)) return;
        var panel = PlantedMarkerPanel.Generate(sampleCount, featureCount);
        var text = new StringBuilder();
        text.Append("sample_id,class");
        for (int f = 0; f < panel.FeatureCount; f++) text.Append(",f").Append(f + 1);
        text.Append('\n');
        for (int s = 0; s < panel.SampleCount; s++)
        {
            text.Append('s').Append(s + 1).Append(',').Append(panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]]);
            for (int f = 0; f < panel.FeatureCount; f++)
                text.Append(',').Append(panel.Matrix.Value(f, s).ToString("R", CultureInfo.InvariantCulture));
            text.Append('\n');
        }
        File.WriteAllText(path + ".tmp", text.ToString());
        File.Move(path + ".tmp", path, overwrite: true);
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        string panel = PanelPath(workDirectory);
        string threads = Environment.ProcessorCount.ToString(CultureInfo.InvariantCulture);
        var figures = new List<string>();
        string cli = CliPath();
        double ours = double.NaN;
        if (File.Exists(cli))
        {
            ours = TimeProcess(cli, ["grow", panel, "--outcome", "class", "--trees", "500", "--seed", "1", "--threads", threads], out string output);
            figures.Add(F("omicsscreen_s", ours));
            string? oob = output.Split('\n').FirstOrDefault(l => l.Contains("out-of-bag", StringComparison.OrdinalIgnoreCase));
            if (oob is not null) Console.Error.WriteLine("# omicsscreen: " + oob.Trim());
        }
        else Console.Error.WriteLine($"# {cli} not built: dotnet build src/OmicsScreen.Cli -c Release");
        string script = Path.Combine(ReferenceData.Directory, "forest", "grow_ranger.R");
        if (ReferenceForests.Enabled && File.Exists(Rscript))
        {
            double ranger = TimeProcess(Rscript, [script, panel, "1", threads], out string output);
            figures.Add(F("ranger_s", ranger));
            figures.Add("ranger_" + output.Trim());
            if (!double.IsNaN(ours)) figures.Add(F("ratio_to_ranger", ours / ranger));
        }
        return figures;
    }

    private static double TimeProcess(string program, string[] arguments, out string output)
    {
        var start = new ProcessStartInfo(program) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var argument in arguments) start.ArgumentList.Add(argument);
        var watch = Stopwatch.StartNew();
        using var process = Process.Start(start)!;
        var error = process.StandardError.ReadToEndAsync();
        output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        double seconds = watch.Elapsed.TotalSeconds;
        if (process.ExitCode != 0)
            throw new InvalidOperationException($"{program} exited with {process.ExitCode}: {error.Result}");
        return seconds;
    }

    /// <summary>OMICSSCREEN_CLI, else the Release build beside the repository's sources.</summary>
    private static string CliPath()
    {
        string? named = Environment.GetEnvironmentVariable("OMICSSCREEN_CLI");
        if (!string.IsNullOrEmpty(named)) return named;
        var directory = new DirectoryInfo(AppContext.BaseDirectory);
        while (directory is not null && !File.Exists(Path.Combine(directory.FullName, "OmicsScreen.sln"))) directory = directory.Parent;
        return directory is null ? "omicsscreen"
            : Path.Combine(directory.FullName, "src", "OmicsScreen.Cli", "bin", "Release", "net10.0", "omicsscreen");
    }

    private static string F(string key, double value) => key + "=" + value.ToString("F3", CultureInfo.InvariantCulture);
}
