using System.Diagnostics;
using System.Globalization;
using System.Text;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// The folder a misuse case sets up: its inputs, results folders of earlier runs, and the
/// things a careless or hostile user points an output at (FIFOs, devices, links, their own files).
/// </summary>
internal sealed class MisuseScene : IDisposable
{
    private readonly TempFolder _folder = new();
    private readonly List<string> _fifos = [];
    private readonly List<IDisposable> _held = [];

    /// <summary>A six-sample panel that can be checked and grown (not screened: too few samples for the curve).</summary>
    public const string SmallPanel = "sample_id,f1,f2,f3\ns1,1,2,7\ns2,3,4,1\ns3,5,6,3\ns4,7,8,2\ns5,9,10,8\ns6,11,13,5\n";

    public const string SmallSheet = "sample_id,status\ns1,case\ns2,case\ns3,case\ns4,control\ns5,control\ns6,control\n";

    public string Root => _folder.Path;

    public string PathOf(string relative) => Path.Combine(Root, relative);

    public string File(string relative, string contents)
    {
        string path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        System.IO.File.WriteAllText(path, contents);
        return path;
    }

    public string Folder(string relative) => Directory.CreateDirectory(PathOf(relative)).FullName;

    public string Panel() => File("m.csv", SmallPanel);

    public string Sheet() => File("s.csv", SmallSheet);

    /// <summary>The sheet of <see cref="ScreenFixtures.WdbcCohortSheet"/>: three cohorts over the WDBC samples.</summary>
    public string CohortSheet() => File("sheet.csv", "sample_id,group\n" + string.Join("\n",
        Enumerable.Range(1, 569).Select(i => $"S{i:D4},{(i % 3 == 0 ? "a" : i % 3 == 1 ? "b" : "c")}")) + "\n");

    /// <summary>
    /// A 24-sample panel, cases and controls alternating, whose sheet gives each sample one of
    /// <paramref name="subjectCount"/> subjects in turn (so every subject holds both classes).
    /// </summary>
    public (string Matrix, string Sheet) SubjectPanel(int subjectCount)
    {
        var matrix = new StringBuilder("sample_id,f1,f2,f3,f4\n");
        var sheet = new StringBuilder("sample_id,status,subject\n");
        for (int i = 0; i < 24; i++)
        {
            matrix.Append(CultureInfo.InvariantCulture, $"s{i},{(i * 7) % 13},{(i * 5) % 11 + (i % 2) * 3},{(i * 3) % 7},{i % 5}\n");
            sheet.Append(CultureInfo.InvariantCulture, $"s{i},{(i % 2 == 0 ? "case" : "control")},p{i % subjectCount}\n");
        }
        return (File("subjects.csv", matrix.ToString()), File("subject_sheet.csv", sheet.ToString()));
    }

    public string Fifo(string relative)
    {
        string path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        RunTool("mkfifo", path);
        _fifos.Add(path);
        return path;
    }

    /// <summary>A character device with the numbers of /dev/null, made here so a failure replaces only this copy (needs root).</summary>
    public string Device(string relative)
    {
        string path = PathOf(relative);
        RunTool("mknod", path, "c", "1", "3");
        return path;
    }

    public static bool CanMakeDevices => Environment.UserName == "root" && OperatingSystem.IsLinux();

    public string Link(string relative, string target)
    {
        string path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        System.IO.File.CreateSymbolicLink(path, target);
        return path;
    }

    /// <summary>
    /// A finished screen's results folder (a small screen of the open WDBC data), copied from one
    /// made once per test run, so each case starts from the same bytes.
    /// </summary>
    public string ScreenFolder(string relative)
    {
        string target = PathOf(relative);
        CopyFolder(ScreenedOnce.Value, target);
        return target;
    }

    /// <summary>The arguments of the small screen that made <see cref="ScreenFolder"/>, with another --out; an option in <paramref name="extra"/> replaces its default here.</summary>
    public static string[] SmallScreen(string outFolder, params string[] extra)
    {
        var arguments = new List<string> { "screen", ReferenceData.Wdbc("wdbc.csv"), "--outcome", "diagnosis", "--out", outFolder, "--quiet" };
        string[] defaults = ["--pairs", "2", "--trees", "20", "--curve-folds", "2", "--curve-inner-pairs", "1", "--max-panel-size", "3"];
        for (int i = 0; i < defaults.Length; i += 2)
            if (!extra.Contains(defaults[i])) arguments.AddRange([defaults[i], defaults[i + 1]]);
        arguments.AddRange(extra);
        return [.. arguments];
    }

    /// <summary>Opens every FIFO both ways at once (which never blocks on Linux), so a reader or writer stuck on one is let go.</summary>
    public void ReleaseFifos()
    {
        foreach (var fifo in _fifos)
        {
            try
            {
                using var stream = new FileStream(fifo, FileMode.Open, FileAccess.ReadWrite, FileShare.ReadWrite);
                stream.Write(Encoding.UTF8.GetBytes("\n"));
            }
            catch (IOException) { }
            catch (UnauthorizedAccessException) { }
        }
    }

    /// <summary>Keeps something open (a lock of another run) until the case is over.</summary>
    public void Hold(IDisposable held) => _held.Add(held);

    public void Dispose()
    {
        foreach (var held in _held) held.Dispose();
        _folder.Dispose();
    }

    private static readonly Lazy<string> ScreenedOnce = new(() =>
    {
        string folder = Path.Combine(Path.GetTempPath(), "omicsscreen-misuse-screen-" + Environment.ProcessId);
        if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
        var run = CliHarness.Run(SmallScreen(folder));
        if (run.ExitCode != ExitCode.Success) throw new InvalidOperationException("the fixture screen failed: " + run.Error);
        AppDomain.CurrentDomain.ProcessExit += (_, _) =>
        {
            try { Directory.Delete(folder, recursive: true); }
            catch (IOException) { }
        };
        return folder;
    });

    private static void CopyFolder(string source, string target)
    {
        Directory.CreateDirectory(target);
        foreach (var file in Directory.GetFiles(source)) System.IO.File.Copy(file, Path.Combine(target, Path.GetFileName(file)));
        foreach (var folder in Directory.GetDirectories(source)) CopyFolder(folder, Path.Combine(target, Path.GetFileName(folder)));
    }

    private static void RunTool(string tool, params string[] args)
    {
        var info = new ProcessStartInfo(tool) { UseShellExecute = false, RedirectStandardError = true };
        foreach (var arg in args) info.ArgumentList.Add(arg);
        using var process = Process.Start(info) ?? throw new InvalidOperationException($"{tool} did not start");
        if (!process.WaitForExit(10_000)) process.Kill();
        if (process.ExitCode != 0) throw new InvalidOperationException($"{tool} failed: {process.StandardError.ReadToEnd()}");
    }
}
