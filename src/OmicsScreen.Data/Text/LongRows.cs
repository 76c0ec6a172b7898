namespace OmicsScreen.Data.Text;

/// <summary>
/// The fast text reader (Sep) holds a whole row in one buffer of at most 16 Mi characters; a
/// longer row (a samples-in-rows export of about a million features at full precision, or a
/// features-in-rows file of about a million samples) stops it. The file is then read again row by
/// row with no limit but memory, in either layout.
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
}
