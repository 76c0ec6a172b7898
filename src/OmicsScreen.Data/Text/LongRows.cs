namespace OmicsScreen.Data.Text;

/// <summary>
/// The text reader (Sep) holds a whole row in one buffer of at most 16 Mi characters; a longer
/// row (a samples-in-rows export of about a million features at full precision) stops it. That
/// limit becomes an input error naming the file and the layouts that have no such limit, instead
/// of an internal error.
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

    public static PanelInputException Error(string path, Exception error) =>
        PanelInputException.At(path, null, null,
            FormattableString.Invariant($"has a row longer than the {MaxRowChars / (1024 * 1024)} Mi characters a CSV/TSV row may hold here (or a quote that is never closed, which makes the rest of the file one row)."),
            "Write the matrix with one row per feature and read it with --features-in-rows (each row then holds one feature's values), or as Parquet or Arrow, which have no row limit; if a quote is left open, close it.",
            error);
}
