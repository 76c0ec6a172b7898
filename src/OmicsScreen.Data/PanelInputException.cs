namespace OmicsScreen.Data;

/// <summary>
/// An input file cannot become a panel. The message names the file, where the problem is (line,
/// column, feature or sample), what was found and what to do about it.
/// </summary>
public sealed class PanelInputException : Exception
{
    public PanelInputException(string message, string filePath, long? line = null, string? column = null,
        Exception? innerException = null)
        : base(message, innerException)
    {
        FilePath = filePath;
        Line = line;
        Column = column;
    }

    public string FilePath { get; }

    /// <summary>The 1-based line of a text file, or the 1-based row of a Parquet/Arrow table, when one is to blame.</summary>
    public long? Line { get; }

    /// <summary>The column (or, for features in rows, the feature) to blame, when there is one.</summary>
    public string? Column { get; }

    /// <summary>Builds the standard message: "file, line L, column 'C': problem Fix" ("row R" for Parquet/Arrow).</summary>
    public static PanelInputException At(string filePath, long? line, string? column, string problem, string fix,
        Exception? innerException = null, bool isTableRow = false)
    {
        // A problem may quote a library's own message, which can run over several lines; the
        // message is shown as one line, so line breaks become spaces.
        problem = Display.OneLine(problem);
        var place = Path.GetFileName(filePath);
        if (line is { } l) place += FormattableString.Invariant($", {(isTableRow ? "row" : "line")} {l}");
        if (column is not null) place += $", column '{Display.Name(column)}'";
        return new PanelInputException($"{place}: {problem} {fix}", filePath, line, column, innerException);
    }
}
