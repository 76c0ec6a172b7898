using System.Runtime.InteropServices;

namespace OmicsScreen.Cli.Output;

/// <summary>
/// Tells a regular file from a FIFO (or pipe), a device, a socket or a symbolic link. .NET's file
/// attributes call all of these "normal", so the type comes from lstat through the runtime's
/// own native shim, whose status layout is the same on every Unix (Flags, then Mode).
/// </summary>
internal static partial class FileKinds
{
    // The file-type bits of the shim's Mode field (pal_io.h of the .NET runtime; the POSIX values).
    private const int TypeMask = 0xF000;
    private const int FifoType = 0x1000;
    private const int CharacterDeviceType = 0x2000;
    private const int DirectoryType = 0x4000;
    private const int BlockDeviceType = 0x6000;
    private const int RegularType = 0x8000;
    private const int LinkType = 0xA000;
    private const int SocketType = 0xC000;

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
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS() && !OperatingSystem.IsFreeBSD()) return FileKind.RegularFile;
        // The status struct is 120 bytes in the runtimes of 2024-2026; a larger buffer leaves room.
        var status = new byte[256];
        int result;
        try
        {
            result = followLinks ? Stat(full, status) : LStat(full, status);
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return FileKind.RegularFile;
        }
        if (result != 0) return File.Exists(full) ? FileKind.RegularFile : FileKind.Absent;
        int mode = BitConverter.ToInt32(status, 4);
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

    [LibraryImport("libSystem.Native", EntryPoint = "SystemNative_Stat", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int Stat(string path, [Out] byte[] status);

    [LibraryImport("libSystem.Native", EntryPoint = "SystemNative_LStat", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int LStat(string path, [Out] byte[] status);
}
