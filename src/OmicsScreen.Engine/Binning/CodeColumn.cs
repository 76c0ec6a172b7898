namespace OmicsScreen.Engine.Binning;

/// <summary>
/// Where one feature's codes live: <c>sampleCount</c> bytes from <see cref="Start"/> in a block
/// shared with other features (<see cref="CodeBlocks"/>).
/// </summary>
internal readonly record struct CodeColumn(byte[] Store, int Start);
