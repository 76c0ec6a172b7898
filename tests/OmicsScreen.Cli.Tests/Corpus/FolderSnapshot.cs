using System.Security.Cryptography;
using OmicsScreen.Runs.Output;

namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// Every entry under a folder, links not followed: its kind, and for a file its SHA-256 and for
/// a link its target, so a test can prove a refused run changed nothing.
/// </summary>
internal sealed class FolderSnapshot
{
    private readonly Dictionary<string, string> _entries;

    private FolderSnapshot(Dictionary<string, string> entries) => _entries = entries;

    public IReadOnlyCollection<string> Paths => _entries.Keys;

    public static FolderSnapshot Take(string root)
    {
        var entries = new Dictionary<string, string>(StringComparer.Ordinal);
        Walk(root, root, entries);
        return new FolderSnapshot(entries);
    }

    /// <summary>Each entry of this snapshot is in <paramref name="after"/> unchanged; returns the first difference, or null.</summary>
    public string? FirstChangeIn(FolderSnapshot after, bool newEntriesAllowed, IReadOnlySet<string>? mayChange = null)
    {
        foreach (var (path, state) in _entries)
        {
            if (mayChange?.Contains(path) == true) continue;
            if (!after._entries.TryGetValue(path, out var now)) return $"{path} was removed";
            if (now != state) return $"{path} changed ({state} then, {now} now)";
        }
        if (!newEntriesAllowed)
            foreach (var path in after._entries.Keys)
                if (!_entries.ContainsKey(path)) return $"{path} was created";
        return null;
    }

    private static string FileState(string file)
    {
        try
        {
            using var stream = File.OpenRead(file);
            return "file " + Convert.ToHexStringLower(SHA256.HashData(stream));
        }
        catch (IOException)
        {
            // A lock file held by a run cannot be opened by anyone else; its length still shows a change.
            return "locked file of " + new FileInfo(file).Length + " bytes";
        }
    }

    private static void Walk(string root, string folder, Dictionary<string, string> entries)
    {
        foreach (var entry in Directory.EnumerateFileSystemEntries(folder))
        {
            string relative = Path.GetRelativePath(root, entry);
            var kind = FileKinds.Of(entry);
            switch (kind)
            {
                case FileKind.RegularFile:
                    entries[relative] = FileState(entry);
                    break;
                case FileKind.SymbolicLink:
                    entries[relative] = "link to " + new FileInfo(entry).LinkTarget;
                    break;
                case FileKind.Directory:
                    entries[relative] = "folder";
                    Walk(root, entry, entries);
                    break;
                default:
                    entries[relative] = kind.ToString();
                    break;
            }
        }
    }
}
