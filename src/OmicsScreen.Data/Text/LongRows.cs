namespace OmicsScreen.Data.Text;

/// <summary>
/// The fast text reader (Sep) holds a whole row in one buffer of at most 16 Mi characters; a
/// longer row (a samples-in-rows export of about a million features at full precision) stops it.
/// Samples in rows are then read again row by row with no limit; a features-in-rows row that long
/// becomes an input error naming the file and the layouts that have no such limit.
/// </summary>
internal static class LongRows
{
    /// <summary>The text reader's largest row buffer, in characters.</summary>
    public const int MaxRowChars = 16 * 1024 * 1024;

    /// <summary>True for the reader's row-length error, also when a parallel enumeration wrapped it.</summary>
    public static bool IsRowTooLong(Exception error) => error switch
    {
        NotSupportedException => error.Message.Contains("maximum supported length", StringComparison.Ordinal),
        AggregateException aggregate => aggregate.InnerExceptions.Any(IsRowTooLong),
        _ => false,
    };

    /// <summary>A features-in-rows row (one feature's value in every sample) past the buffer: more samples than the row-by-row reader takes in this layout.</summary>
    public static PanelInputException FeaturesInRowsError(string path, Exception error) =>
        PanelInputException.At(path, null, null,
            FormattableString.Invariant($"has a row longer than the {MaxRowChars / (1024 * 1024)} Mi characters a features-in-rows CSV/TSV row may hold (or a quote that is never closed, which makes the rest of the file one row)."),
            "Write the matrix with one row per sample (samples in rows have no row limit), or as Parquet or Arrow; if a quote is left open, close it.",
            error);
}
