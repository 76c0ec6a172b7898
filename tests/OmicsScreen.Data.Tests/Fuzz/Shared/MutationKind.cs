namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// The ways a panel file is damaged by the fuzz corpus. The list is common practice (fuzzing):
/// the accidents that happen to exported tables on their way to an analyst, plus raw byte
/// damage. Text kinds edit lines and fields; every file (text or binary) takes the byte kinds.
/// </summary>
internal enum MutationKind
{
    /// <summary>XOR one to four bytes with a random non-zero mask.</summary>
    FlipBytes,
    /// <summary>Cut the file at a random byte, as an interrupted copy does.</summary>
    Truncate,
    /// <summary>Insert one to six bytes, drawn from NUL, 0xFF, broken UTF-8 sequences, a BOM, CR, a quote or any byte.</summary>
    InsertBytes,
    DeleteLine,
    DuplicateLine,
    /// <summary>Replace one of comma, tab and semicolon by another within one line.</summary>
    SwapDelimiterInLine,
    /// <summary>Replace one of comma, tab and semicolon by another throughout the file.</summary>
    SwapDelimiterInFile,
    InsertStrayQuote,
    /// <summary>Remove the text of one field of one line, keeping its delimiters.</summary>
    EmptyCell,
    /// <summary>Give one header field the name of another.</summary>
    DuplicateHeaderName,
}
