using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;
using System.Text;
using System.Text.Json;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// Watches a sequence of cases from outside the process, so that a case that stalls can be
/// diagnosed: when one case has run longer than the limit, a shell loop has the runtime's
/// createdump write, while the stall is still on, every thread's managed and native stack (its
/// crash report, JSON) and optionally a dump with heap (for dotnet-dump or ClrMD) into a folder
/// under /tmp. <see cref="FindStall"/> then turns the report into readable stacks and names the files.
/// </summary>
/// <remarks>
/// Outside the process on purpose: the stall seen with dynamic PGO looked like a pause of the
/// whole process, and while the runtime holds every managed thread a watchdog thread inside it is
/// held too; by the time it could act the pause is over and its stacks show nothing. The loop is
/// started once (Linux only; elsewhere there is no watchdog and the harness runs as before), wakes
/// once a second, and costs a case two small file writes and a file check. It ends by itself when
/// the process does.
/// </remarks>
internal sealed class StallWatchdog : IDisposable
{
    private const string Idle = "idle";

    // $1 pid, $2 heartbeat file, $3 limit in seconds, $4 createdump, $5 dump path, $6 dump kind.
    // The heartbeat holds the running case's name (or "idle"); its modification time is when the case began.
    private const string Script = """
        exec >/dev/null 2>&1
        while kill -0 "$1"; do
          sleep 1
          state=$(cat "$2") || continue
          [ "$state" = idle ] && continue
          began=$(stat -c %Y "$2") || continue
          if [ $(( $(date +%s) - began )) -ge "$3" ]; then
            echo "$state" > "$5.case"
            "$4" "$6" --crashreport -f "$5" "$1" > "$5.log" 2>&1
            echo "$?" > "$5.done"
            exit 0
          fi
        done
        """;

    private readonly Process _loop;
    private readonly string _folder;
    private readonly string _heartbeat;
    private readonly string _dump;
    private (int Gen0, int Gen1, int Gen2) _collectionsAtBegin;
    private TimeSpan _pausesAtBegin;

    private StallWatchdog(Process loop, string folder, TimeSpan limit)
    {
        _loop = loop;
        _folder = folder;
        _heartbeat = Path.Combine(folder, "heartbeat");
        _dump = Path.Combine(folder, "stall.dmp");
        Limit = limit;
    }

    public TimeSpan Limit { get; }

    /// <summary>The folder of the heartbeat and of a stall's files.</summary>
    public string Folder => _folder;

    /// <summary>The runtime's dump writer, shipped beside the runtime on Linux and macOS.</summary>
    public static string CreateDumpPath => Path.Combine(RuntimeEnvironment.GetRuntimeDirectory(), "createdump");

    /// <summary>
    /// Starts the watchdog, or returns null off Linux (no createdump or no shell tools to drive it).
    /// </summary>
    /// <param name="withHeap">
    /// Also write a dump with heap beside the stacks, for dotnet-dump or ClrMD. Off by default: the
    /// Data test host's took 4.4 GB and held the process 49-80 s while it was written (measured),
    /// where the stacks alone take about a second.
    /// </param>
    public static StallWatchdog? TryStart(TimeSpan limit, bool withHeap = false)
    {
        if (!OperatingSystem.IsLinux() || !File.Exists(CreateDumpPath) || !File.Exists("/bin/sh")) return null;
        string folder = Path.Combine(Path.GetTempPath(), FormattableString.Invariant(
            $"omicsscreen-stall-{Environment.ProcessId}-{DateTime.UtcNow:yyyyMMddTHHmmss}-{Guid.NewGuid().ToString("N")[..6]}"));
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "heartbeat"), Idle);
        var start = new ProcessStartInfo("/bin/sh") { UseShellExecute = false };
        foreach (string argument in new[]
                 {
                     "-c", Script, "stall-watchdog", Environment.ProcessId.ToString(CultureInfo.InvariantCulture),
                     Path.Combine(folder, "heartbeat"), Math.Max(1, (int)Math.Ceiling(limit.TotalSeconds)).ToString(CultureInfo.InvariantCulture),
                     CreateDumpPath, Path.Combine(folder, "stall.dmp"), withHeap ? "--withheap" : "--crashreportonly",
                 })
            start.ArgumentList.Add(argument);
        var loop = Process.Start(start) ?? throw new InvalidOperationException("/bin/sh did not start");
        return new StallWatchdog(loop, folder, limit);
    }

    /// <summary>A case begins: the clock of the limit starts now.</summary>
    public void Begin(string caseName)
    {
        _collectionsAtBegin = (GC.CollectionCount(0), GC.CollectionCount(1), GC.CollectionCount(2));
        _pausesAtBegin = GC.GetTotalPauseDuration();
        File.WriteAllText(_heartbeat, caseName.ReplaceLineEndings(" "));
    }

    /// <summary>The case ended: nothing is running that could stall.</summary>
    public void End() => File.WriteAllText(_heartbeat, Idle);

    /// <summary>
    /// Null while no case has stalled; otherwise the stall's description: the case, the files
    /// written and every managed thread's stack. Waits for a dump under way to finish.
    /// </summary>
    public string? FindStall()
    {
        string caseFile = _dump + ".case", doneFile = _dump + ".done";
        if (!File.Exists(caseFile)) return null;
        var waited = Stopwatch.StartNew();
        while (!File.Exists(doneFile) && waited.Elapsed < TimeSpan.FromMinutes(2)) Thread.Sleep(200);
        string stalledCase = File.ReadAllText(caseFile).Trim();
        string report = _dump + ".crashreport.json";
        string stacksFile = _dump + ".stacks.txt";
        var text = new StringBuilder();
        text.Append(CultureInfo.InvariantCulture, $"{stalledCase} ran longer than {Limit.TotalSeconds:0} s; ");
        text.Append(GarbageCollectionSince()).Append("; ");
        if (File.Exists(report))
        {
            string stacks = ReadableStacks(report);
            File.WriteAllText(stacksFile, stacks);
            text.Append(CultureInfo.InvariantCulture, $"every thread's stack, taken during the stall: {stacksFile} (crash report {report}");
            if (File.Exists(_dump)) text.Append(CultureInfo.InvariantCulture, $", dump with heap {_dump}");
            text.Append(')').AppendLine().Append(stacks);
        }
        else
        {
            string log = File.Exists(_dump + ".log") ? File.ReadAllText(_dump + ".log") : "(no log)";
            text.Append(CultureInfo.InvariantCulture, $"createdump wrote no stacks (exit {File.ReadAllText(doneFile).Trim()}): {log}");
        }
        return text.ToString();
    }

    /// <summary>
    /// What the collector did since the last case began (collections, time paused) and its last
    /// collection: a thread that waits inside an allocation waits for a collection.
    /// </summary>
    private string GarbageCollectionSince()
    {
        var last = GC.GetGCMemoryInfo(GCKind.Any);
        var background = GC.GetGCMemoryInfo(GCKind.Background);
        return string.Create(CultureInfo.InvariantCulture,
            $"garbage collections since the case began: {GC.CollectionCount(0) - _collectionsAtBegin.Gen0} of generation 0, "
            + $"{GC.CollectionCount(1) - _collectionsAtBegin.Gen1} of 1, {GC.CollectionCount(2) - _collectionsAtBegin.Gen2} of 2, "
            + $"paused {(GC.GetTotalPauseDuration() - _pausesAtBegin).TotalMilliseconds:0} ms; last collection #{last.Index} of generation {last.Generation} "
            + $"({(last.Concurrent ? "background" : "blocking")}, pause {(last.PauseDurations.Length > 0 ? last.PauseDurations[0].TotalMilliseconds : 0):0} ms), "
            + $"last background collection #{background.Index}; heap {last.HeapSizeBytes / 1048576.0:0} MB, committed {last.TotalCommittedBytes / 1048576.0:0} MB, "
            + $"{(System.Runtime.GCSettings.IsServerGC ? "server" : "workstation")} collector");
    }

    /// <summary>
    /// The managed frames of every thread that has any, one thread a block, innermost first (native
    /// frames are named by their module only: the threads of interest run managed code).
    /// </summary>
    public static string ReadableStacks(string crashReportPath)
    {
        using var document = JsonDocument.Parse(File.ReadAllBytes(crashReportPath));
        var text = new StringBuilder();
        foreach (var thread in document.RootElement.GetProperty("payload").GetProperty("threads").EnumerateArray())
        {
            if (!thread.TryGetProperty("stack_frames", out var frames)) continue;
            var lines = new List<string>();
            bool managed = false;
            foreach (var frame in frames.EnumerateArray())
            {
                if (frame.TryGetProperty("method_name", out var method))
                {
                    managed = true;
                    lines.Add("    " + method.GetString());
                }
                else if (frame.TryGetProperty("unmanaged_name", out var function))
                    lines.Add($"    [native] {function.GetString()}");
                else if (frame.TryGetProperty("native_module", out var module))
                    lines.Add($"    [native] {module.GetString()}");
            }
            if (!managed) continue;
            string id = thread.TryGetProperty("native_thread_id", out var tid) ? tid.GetString() ?? "?" : "?";
            text.Append("thread ").Append(id).AppendLine(":");
            foreach (string line in lines) text.AppendLine(line);
        }
        return text.ToString();
    }

    /// <summary>Stops the loop; the folder is removed unless it holds a stall's files.</summary>
    public void Dispose()
    {
        try
        {
            if (!_loop.HasExited) _loop.Kill();
            _loop.WaitForExit(5000);
        }
        catch (InvalidOperationException)
        {
            // It had already ended on its own after a dump.
        }
        _loop.Dispose();
        if (!File.Exists(_dump + ".case"))
        {
            try { Directory.Delete(_folder, recursive: true); }
            catch (IOException) { }
        }
    }
}
