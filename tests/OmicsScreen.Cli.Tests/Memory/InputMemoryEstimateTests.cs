using System.Globalization;
using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;
using OmicsScreen.Cli.Memory;
using OmicsScreen.Cli.Tests.Work;
using Xunit.Abstractions;

namespace OmicsScreen.Cli.Tests.Memory;

/// <summary>
/// The memory estimate `screen` prints before reading a gzip or a long file is sized from the
/// file (decompressed, or its distinct ids counted, once) and covers the peak resident memory the
/// same screen then reaches, within the band measured for plain CSV. Each screen runs in a child
/// process, whose high-water mark (VmHWM in /proc/PID/status, Linux proc(5)) is read while it runs;
/// the test needs Linux, as CI is.
/// </summary>
public sealed partial class InputMemoryEstimateTests : IDisposable
{
    private const int SampleCount = 300;
    private const int FeatureCount = 4000;

    private static readonly TimeSpan Bound = TimeSpan.FromMinutes(4);

    private readonly TempFolder _folder = new();
    private readonly ITestOutputHelper _output;

    public InputMemoryEstimateTests(ITestOutputHelper output) => _output = output;

    public void Dispose() => _folder.Dispose();

    /// <summary>
    /// The same panel as a samples-in-rows CSV and as a long CSV (sample, feature, value, status):
    /// values are a fixed arithmetic pattern of 7 significant digits, classes alternate.
    /// </summary>
    private (string Wide, string Long) WritePanel()
    {
        var wide = new StringBuilder("sample_id,status");
        for (int f = 0; f < FeatureCount; f++) wide.Append(CultureInfo.InvariantCulture, $",F{f:D5}");
        wide.Append('\n');
        var longTable = new StringBuilder("sample,feature,value,status\n");
        for (int s = 0; s < SampleCount; s++)
        {
            string status = s % 2 == 0 ? "case" : "control";
            wide.Append(CultureInfo.InvariantCulture, $"S{s:D4},{status}");
            for (int f = 0; f < FeatureCount; f++)
            {
                string value = ((s * 7919L + f * 104_729L) % 1_000_003 / 1000.0).ToString("G7", CultureInfo.InvariantCulture);
                wide.Append(',').Append(value);
                longTable.Append(CultureInfo.InvariantCulture, $"S{s:D4},F{f:D5},{value},{status}\n");
            }
            wide.Append('\n');
        }
        return (_folder.File("panel.csv", wide.ToString()), _folder.File("panel-long.csv", longTable.ToString()));
    }

    /// <summary>Runs a small screen in a child process: the estimate it printed and its peak resident memory, in bytes.</summary>
    private (long Estimate, long Peak) Screen(string matrix, string name, params string[] extra)
    {
        string results = Path.Combine(_folder.Path, name);
        using var captured = ChildProcess.StartCapturing(
            ["screen", matrix, "--outcome", "status", "--out", results, "--pairs", "2", "--trees", "40", "--curve-folds", "0",
             "--threads", "2", "--memory-limit", "64G", .. extra]);
        var child = captured.Process;
        long peak = 0;
        var clock = System.Diagnostics.Stopwatch.StartNew();
        // VmHWM only grows, so the last value read before the process ends is its peak up to then;
        // the last milliseconds of a screen write its tables and do not set the peak.
        while (!child.WaitForExit(20) && clock.Elapsed < Bound) peak = Math.Max(peak, HighWaterMark(child.Id));
        if (!child.HasExited)
        {
            child.Kill(entireProcessTree: true);
            Assert.Fail($"{name}: the screen did not end within {Bound}.");
        }
        child.WaitForExit();
        Assert.True(child.ExitCode == ExitCode.Success, captured.Error);
        var printed = EstimateLine().Match(captured.Error);
        Assert.True(printed.Success, captured.Error);
        double megabytes = double.Parse(printed.Groups[1].Value, CultureInfo.InvariantCulture) * (printed.Groups[2].Value == "GB" ? 1024 : 1);
        return ((long)(megabytes * 1024 * 1024), peak);
    }

    /// <summary>VmHWM of a running process in bytes; 0 once it has gone.</summary>
    private static long HighWaterMark(int processId)
    {
        try
        {
            foreach (var line in File.ReadLines($"/proc/{processId.ToString(CultureInfo.InvariantCulture)}/status"))
                if (line.StartsWith("VmHWM:", StringComparison.Ordinal))
                    return long.Parse(line[6..].Trim().Split(' ')[0], CultureInfo.InvariantCulture) * 1024;
        }
        catch (IOException)
        {
        }
        catch (UnauthorizedAccessException)
        {
        }
        return 0;
    }

    [Fact]
    public void The_estimate_for_a_gzip_and_a_long_file_covers_the_measured_peak_like_plain_csv()
    {
        var (wide, longFile) = WritePanel();
        string zipped = Path.Combine(_folder.Path, "panel.csv.gz");
        using (var gzip = new GZipStream(File.Create(zipped), CompressionLevel.Fastest))
        using (var plain = File.OpenRead(wide))
            plain.CopyTo(gzip);

        var plainRun = Screen(wide, "plain");
        var gzipRun = Screen(zipped, "gzip");
        var longRun = Screen(longFile, "long", "--long");

        // The gzip file holds the same text: sized by decompressing it once, it gets the plain file's estimate.
        Assert.Equal(plainRun.Estimate, gzipRun.Estimate);
        // The long reader holds its columns at 512 rows for 300 samples (doubling from 16) beside the panel: never a smaller
        // estimate (here the screen's own terms, not loading, set the peak, so the two are equal).
        Assert.True(longRun.Estimate >= plainRun.Estimate, $"long {longRun.Estimate} < plain {plainRun.Estimate}");
        foreach (var (name, run) in new[] { ("plain", plainRun), ("gzip", gzipRun), ("long", longRun) })
        {
            _output.WriteLine(FormattableString.Invariant($"{name}: estimate {run.Estimate / 1048576.0:F0} MiB, peak {run.Peak / 1048576.0:F0} MiB, ratio {(double)run.Estimate / run.Peak:F2}"));
            // The band: `screen` plans on MemoryCheck.AvailableShare (90%) of the free memory and leaves the rest as the
            // estimate's margin, so the peak may pass the estimate by that margin and no more; an estimate above twice the
            // peak would refuse runs that fit. Measured here (2 cores, shared): plain 1.08, gzip 1.04, long 1.07 times the peak.
            Assert.True(run.Peak > 0, $"{name}: no peak read");
            Assert.True(run.Peak * MemoryCheck.AvailableShare <= run.Estimate, $"{name}: peak {run.Peak} above the estimate {run.Estimate} and its margin");
            Assert.True(run.Estimate <= 2 * run.Peak, $"{name}: estimate {run.Estimate} more than twice the peak {run.Peak}");
        }
    }

    [GeneratedRegex(@"memory: about ([0-9.]+) (MB|GB) estimated")]
    private static partial Regex EstimateLine();
}
