namespace OmicsScreen.Data;

/// <summary>The container format of a matrix file, detected from its first bytes.</summary>
public enum MatrixFileFormat
{
    /// <summary>Delimited text: CSV, TSV or semicolon-separated.</summary>
    DelimitedText,
    Parquet,
    /// <summary>Arrow IPC file format (Feather v2), starting with ARROW1.</summary>
    ArrowFile,
    /// <summary>Arrow IPC streaming format, starting with the continuation marker.</summary>
    ArrowStream,
}
