using System.Diagnostics;
using System.Net.Sockets;
using OmicsScreen.Runs.Output;

namespace OmicsScreen.Runs.Tests.Output;

/// <summary>
/// What a path is, told without opening it: the kinds POSIX stat(2) distinguishes (common
/// practice: S_IFIFO, S_IFCHR, S_IFDIR, S_IFLNK, S_IFREG, S_IFSOCK), made here with the system's
/// own tools (mkfifo, a bound Unix socket, ln -s) and /dev/null, the character device every Linux has.
/// </summary>
public sealed class FileKindsTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private string PathOf(string name) => Path.Combine(_folder.Path, name);

    [Fact]
    public void Each_kind_of_path_is_told_apart_without_following_links()
    {
        string file = _folder.File("file.txt", "x\n");
        string fifo = PathOf("pipe");
        RunTool("mkfifo", fifo);
        string folder = Directory.CreateDirectory(PathOf("folder")).FullName;
        string link = PathOf("link");
        File.CreateSymbolicLink(link, file);
        string socketPath = PathOf("socket");
        using var socket = new Socket(AddressFamily.Unix, SocketType.Stream, ProtocolType.Unspecified);
        socket.Bind(new UnixDomainSocketEndPoint(socketPath));

        Assert.Equal(FileKind.RegularFile, FileKinds.Of(file));
        Assert.Equal(FileKind.Directory, FileKinds.Of(folder));
        Assert.Equal(FileKind.SymbolicLink, FileKinds.Of(link));
        Assert.Equal(FileKind.Absent, FileKinds.Of(PathOf("absent")));
        if (!OperatingSystem.IsLinux()) return;
        Assert.Equal(FileKind.Fifo, FileKinds.Of(fifo));
        Assert.Equal(FileKind.Device, FileKinds.Of("/dev/null"));
        Assert.Equal(FileKind.Socket, FileKinds.Of(socketPath));
    }

    [Fact]
    public void Links_are_followed_to_what_they_lead_to_when_asked()
    {
        string file = _folder.File("file.txt", "x\n");
        File.CreateSymbolicLink(PathOf("to-file"), file);
        Assert.Equal(FileKind.RegularFile, FileKinds.OfTarget(PathOf("to-file")));
        if (!OperatingSystem.IsLinux()) return;
        string fifo = PathOf("pipe");
        RunTool("mkfifo", fifo);
        File.CreateSymbolicLink(PathOf("to-pipe"), fifo);
        File.CreateSymbolicLink(PathOf("to-null"), "/dev/null");
        Assert.Equal(FileKind.Fifo, FileKinds.OfTarget(PathOf("to-pipe")));
        Assert.Equal(FileKind.Device, FileKinds.OfTarget(PathOf("to-null")));
        Assert.Equal(FileKind.SymbolicLink, FileKinds.Of(PathOf("to-pipe")));
    }

    private static void RunTool(string tool, params string[] args)
    {
        var info = new ProcessStartInfo(tool) { UseShellExecute = false };
        foreach (var arg in args) info.ArgumentList.Add(arg);
        using var process = Process.Start(info)!;
        process.WaitForExit();
        Assert.Equal(0, process.ExitCode);
    }
}
