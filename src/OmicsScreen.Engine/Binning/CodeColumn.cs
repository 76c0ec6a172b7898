namespace OmicsScreen.Engine.Binning;

/// <summary>
/// Where one feature's codes live: <c>sampleCount</c> bytes from <see cref="Start"/> in a block
/// shared with other features (<see cref="CodeBlocks"/>); in a <see cref="BinnedMatrix"/> also
/// the feature's number of value bins, so that split search finds all it needs to know about a
/// feature drawn at random in one 16-byte entry (one cache miss, not two).
/// </summary>
internal readonly record struct CodeColumn(byte[] Store, int Start, int ValueBinCount = 0);
