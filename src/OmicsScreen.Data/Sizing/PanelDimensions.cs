namespace OmicsScreen.Data.Sizing;

/// <summary>
/// Samples x features of a matrix file, found from its header, line count or metadata without
/// parsing a value, with the file's format and size (what its reader will hold while loading).
/// An upper bound where the file holds rows that are neither features nor samples (sample
/// attribute rows of a features-in-rows file, blank lines).
/// </summary>
/// <param name="FileBytes">The file's size on disk (compressed, for gzip).</param>
/// <param name="Layout">How the file is read; a long table's reader holds other buffers than a wide one.</param>
public readonly record struct PanelDimensions(int SampleCount, int FeatureCount, MatrixFileFormat Format, long FileBytes,
    PanelLayout Layout = PanelLayout.SamplesInRows)
{
    /// <summary>A long table's columns start at this many samples and double (LongTableReader).</summary>
    private const int LongTableFirstCapacity = 16;

    /// <summary>
    /// Float32-matrix-sized buffers the reader holds beside the loaded panel, for the memory
    /// estimate. Wide text is parsed into columns that are then gathered into file order (one
    /// more matrix; gzip adds only its 64 KiB window and buffers, so it counts as plain text);
    /// Parquet is read a column at a time (little); Arrow holds every record batch, the whole
    /// file. A long table holds, at its peak, each feature's values and state bytes at the
    /// capacity its doubling reached (the first power of two from 16 not below the sample count),
    /// 5 bytes a cell against the matrix's 4, before they are cut to the sample count.
    /// </summary>
    public double LoaderMatrixCopies => Layout == PanelLayout.Long
        ? 1.25 * LongTableCapacity(SampleCount) / Math.Max(1, SampleCount)
        : Format switch
        {
            MatrixFileFormat.DelimitedText => 1,
            MatrixFileFormat.Parquet => 0.25,
            _ => Math.Max(1, FileBytes / (4.0 * SampleCount * FeatureCount)),
        };

    private static long LongTableCapacity(int sampleCount)
    {
        long capacity = LongTableFirstCapacity;
        while (capacity < sampleCount) capacity *= 2;
        return capacity;
    }
}
