namespace OmicsScreen.Runs.Output;

/// <summary>What a path names on disk, without following a symbolic link.</summary>
public enum FileKind
{
    Absent,
    RegularFile,
    Directory,
    SymbolicLink,
    /// <summary>A named pipe: writing to it or renaming over it would block or destroy another program's channel.</summary>
    Fifo,
    /// <summary>A character or block device, such as /dev/null or a disk.</summary>
    Device,
    Socket,
}
