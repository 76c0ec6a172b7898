namespace OmicsScreen.Data.Assembly;

/// <summary>The file a matrix came from and how it was encoded.</summary>
/// <param name="Path">The matrix file.</param>
/// <param name="Format">The detected format.</param>
/// <param name="Delimiter">The field delimiter of a text file, null for Parquet and Arrow.</param>
/// <param name="Layout">The orientation read.</param>
internal sealed record MatrixSource(string Path, MatrixFileFormat Format, char? Delimiter, PanelLayout Layout)
{
    /// <summary>True when the text was gzip-compressed and decompressed while reading.</summary>
    public bool Gzip { get; init; }

    /// <summary>Comment lines ('#' or '!') skipped above the header of a text file.</summary>
    public int CommentLineCount { get; init; }

    /// <summary>How a long table was read; null for other layouts.</summary>
    public Inspection.LongTableFound? LongTable { get; init; }
}
