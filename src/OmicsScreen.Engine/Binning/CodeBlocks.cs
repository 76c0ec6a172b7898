namespace OmicsScreen.Engine.Binning;

/// <summary>
/// Room for many features' codes, one column of <c>sampleCount</c> bytes after another in a few
/// large arrays instead of one array per feature.
/// </summary>
/// <remarks>
/// One small array per feature cost as much as sorting on a wide panel (20,000 features of 200
/// samples: the collector zeroed, promoted and copied them all). A block is not zeroed, since
/// every cell is written before it is read, and stays below 1 GiB so that panels of any size
/// fit in arrays; a column never straddles two blocks.
/// </remarks>
internal static class CodeBlocks
{
    private const long MaxBlockBytes = 1L << 30;

    /// <summary>Columns for <paramref name="featureCount"/> features of <paramref name="sampleCount"/> samples each.</summary>
    public static CodeColumn[] Allocate(int featureCount, int sampleCount)
    {
        var columns = new CodeColumn[featureCount];
        if (featureCount == 0) return columns;
        int featuresPerBlock = (int)Math.Clamp(MaxBlockBytes / Math.Max(1, sampleCount), 1, featureCount);
        for (int first = 0; first < featureCount; first += featuresPerBlock)
        {
            int inBlock = Math.Min(featuresPerBlock, featureCount - first);
            var store = GC.AllocateUninitializedArray<byte>(inBlock * sampleCount);
            for (int i = 0; i < inBlock; i++) columns[first + i] = new CodeColumn(store, i * sampleCount);
        }
        return columns;
    }
}
