using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using OmicsScreen.Data.Output;

namespace OmicsScreen.Runs.Output;

/// <summary>
/// An exclusive lock on a results folder for the length of one run, so two runs never write
/// into one folder. The lock is the kernel's lock on an open file (.NET opens a file with
/// FileShare.None under an exclusive flock on Unix and a sharing lock on Windows), so it dies
/// with its process: a lock file left by a killed run is taken over. Who holds it (process id
/// and start time) is kept in a file beside it, since the locked file itself cannot be read by
/// another process.
/// </summary>
public sealed class ResultsFolderLock : IDisposable
{
    public const string LockFileName = ".omicsscreen.lock";
    public const string HolderFileName = ".omicsscreen.lock.json";

    private readonly FileStream _lock;
    private readonly string _holderPath;

    private ResultsFolderLock(FileStream held, string holderPath)
    {
        _lock = held;
        _holderPath = holderPath;
    }

    /// <summary>True for the lock's own files, which are not results and not the user's.</summary>
    public static bool IsLockFile(string fileName) => fileName is LockFileName or HolderFileName
        || (fileName.StartsWith("." + HolderFileName + ".", StringComparison.Ordinal) && fileName.EndsWith(".partial", StringComparison.Ordinal));

    /// <summary>
    /// Takes the lock or refuses at once with the holder's process id and start time. A note goes
    /// to <paramref name="notes"/> when the lock of a run that has stopped is taken over.
    /// </summary>
    public static ResultsFolderLock Acquire(string folder, string shownFolder, TextWriter notes)
    {
        string lockPath = Path.Combine(folder, LockFileName);
        string holderPath = Path.Combine(folder, HolderFileName);
        var held = Open(lockPath, holderPath, shownFolder);
        if (ReadHolder(holderPath) is { } stale)
            notes.WriteLine($"note: {shownFolder} was locked by {Describe(stale)}, which is no longer running; the lock was taken over.");
        var process = Process.GetCurrentProcess();
        var holder = new LockHolder(Environment.ProcessId, process.StartTime.ToUniversalTime().ToString("O", CultureInfo.InvariantCulture),
            Environment.MachineName);
        AtomicFile.WriteAllText(holderPath, JsonSerializer.Serialize(holder));
        return new ResultsFolderLock(held, holderPath);
    }

    private static FileStream Open(string lockPath, string holderPath, string shownFolder)
    {
        // A holder removes the lock file before it lets go; a lock won on a file that is no longer
        // at its path was won on the old holder's file, so open the path again.
        for (int attempt = 0; ; attempt++)
        {
            FileStream held;
            try
            {
                held = new FileStream(lockPath, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
            }
            catch (IOException)
            {
                throw new RunRefusedException(
                    $"{shownFolder} is in use by another OmicsScreen run ({Holder(holderPath)}); wait for it to finish, or choose another --out folder.",
                    RunRefusal.Output);
            }
            if (File.Exists(lockPath) || attempt == 3) return held;
            held.Dispose();
        }
    }

    public void Dispose()
    {
        string lockPath = _lock.Name;
        // The holder record goes first: a record without a lock reads as a stale lock, never as a live one.
        TryDelete(_holderPath);
        TryDelete(lockPath);
        _lock.Dispose();
    }

    private static string Holder(string holderPath) =>
        ReadHolder(holderPath) is { } holder ? Describe(holder) : "its process has not yet recorded itself";

    private static string Describe(LockHolder holder) =>
        $"process {holder.ProcessId.ToString(CultureInfo.InvariantCulture)} on {holder.Machine}, started {holder.StartedUtc}";

    private static LockHolder? ReadHolder(string holderPath)
    {
        try
        {
            if (!File.Exists(holderPath) || new FileInfo(holderPath).Length > 4096) return null;
            return JsonSerializer.Deserialize<LockHolder>(File.ReadAllText(holderPath));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or JsonException)
        {
            return null;
        }
    }

    private static void TryDelete(string path)
    {
        try { File.Delete(path); }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }
}
