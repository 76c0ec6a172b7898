using System.Buffers;
using Apache.Arrow.Memory;

namespace OmicsScreen.Data.Columnar;

/// <summary>
/// Arrow's native allocator with a ceiling: the body of one IPC message can never be longer than
/// the file it comes from, so a larger request can only come from a damaged length field.
/// </summary>
/// <remarks>
/// Without the ceiling Apache.Arrow 23 honours a flipped body length in a 20 kB file by
/// allocating and filling up to 2 GB before it finds the file too short.
/// </remarks>
internal sealed class FileBoundedAllocator : NativeMemoryAllocator
{
    private readonly long _fileLength;

    public FileBoundedAllocator(long fileLength) => _fileLength = fileLength;

    protected override IMemoryOwner<byte> AllocateInternal(int length, out int bytesAllocated)
    {
        if (length > _fileLength)
            throw new InvalidDataException(FormattableString.Invariant(
                $"a message claims {length} bytes but the whole file has {_fileLength}"));
        return base.AllocateInternal(length, out bytesAllocated);
    }
}
