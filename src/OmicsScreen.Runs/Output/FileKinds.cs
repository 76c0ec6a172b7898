using System.Runtime.InteropServices;

namespace OmicsScreen.Runs.Output;

/// <summary>
/// Tells a regular file from a FIFO (or pipe), a device, a socket or a symbolic link. .NET's
/// public file APIs tell links (<see cref="FileSystemInfo.LinkTarget"/>) and folders apart but
/// call the rest "normal" (checked on Linux with mkfifo, /dev/null and a socket), and opening a
/// path to ask would block on a FIFO or act on a device. So on Linux the type comes from libc's
/// statx(2): unlike lstat, its result layout is fixed by the kernel for every architecture.
/// </summary>
public static partial class FileKinds
{
    // The file-type bits of st_mode (POSIX values, the same in every Linux architecture).
    private const int TypeMask = 0xF000;
    private const int FifoType = 0x1000;
    private const int CharacterDeviceType = 0x2000;
    private const int DirectoryType = 0x4000;
    private const int BlockDeviceType = 0x6000;
    private const int RegularType = 0x8000;
    private const int LinkType = 0xA000;
    private const int SocketType = 0xC000;

    // statx(2) arguments and struct statx layout (linux/stat.h): stx_mode is a 16-bit field at byte 28 of 256.
    private const int CurrentFolder = -100;
    private const int DoNotFollowLinks = 0x100;
    private const uint TypeField = 0x1;
    private const int StatxSize = 256;
    private const int ModeOffset = 28;

    /// <summary>What the path itself is; a symbolic link is reported as one, not followed.</summary>
    public static FileKind Of(string path) => Kind(path, followLinks: false);

    /// <summary>What the path leads to, links followed (as /dev/fd/63 of a process substitution leads to a pipe).</summary>
    public static FileKind OfTarget(string path) => Kind(path, followLinks: true);

    private static FileKind Kind(string path, bool followLinks)
    {
        string full = Path.GetFullPath(path);
        var info = new FileInfo(full);
        if (!followLinks && info.LinkTarget is not null) return FileKind.SymbolicLink;
        if (Directory.Exists(full)) return FileKind.Directory;
        if (!info.Exists) return FileKind.Absent;
        // Elsewhere no public call tells a FIFO or device from a file: they pass as files there.
        if (!OperatingSystem.IsLinux()) return FileKind.RegularFile;
        var status = new byte[StatxSize];
        int result;
        try
        {
            result = Statx(CurrentFolder, full, followLinks ? 0 : DoNotFollowLinks, TypeField, status);
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return FileKind.RegularFile;
        }
        if (result != 0) return File.Exists(full) ? FileKind.RegularFile : FileKind.Absent;
        int mode = BitConverter.ToUInt16(status, ModeOffset);
        return (mode & TypeMask) switch
        {
            RegularType => FileKind.RegularFile,
            DirectoryType => FileKind.Directory,
            LinkType => FileKind.SymbolicLink,
            FifoType => FileKind.Fifo,
            CharacterDeviceType or BlockDeviceType => FileKind.Device,
            SocketType => FileKind.Socket,
            _ => FileKind.Device,
        };
    }

    /// <summary>How a kind is named in messages.</summary>
    public static string Describe(FileKind kind) => kind switch
    {
        FileKind.RegularFile => "a file",
        FileKind.Directory => "a folder",
        FileKind.SymbolicLink => "a symbolic link",
        FileKind.Fifo => "a named pipe (FIFO)",
        FileKind.Device => "a device file",
        FileKind.Socket => "a socket",
        _ => "absent",
    };

    /// <summary>statx(2) of glibc 2.28 and later (and musl 1.2.5); the kernel fills at least the type bits asked for.</summary>
    [LibraryImport("libc", EntryPoint = "statx", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int Statx(int folder, string path, int flags, uint mask, [Out] byte[] status);
}
