namespace OmicsScreen.Data;

/// <summary>An input file as read, so that a report can prove which bytes it was computed from.</summary>
/// <param name="Path">The path as given by the caller.</param>
/// <param name="ByteCount">The file size in bytes.</param>
/// <param name="Sha256">The SHA-256 of the file content, lower-case hex.</param>
public sealed record InputFileRecord(string Path, long ByteCount, string Sha256);
