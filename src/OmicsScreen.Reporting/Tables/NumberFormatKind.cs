namespace OmicsScreen.Reporting.Tables;

/// <summary>The three ways a number column can be written.</summary>
public enum NumberFormatKind
{
    /// <summary>Shortest text that parses back to the identical double ("R").</summary>
    RoundTrip = 0,
    /// <summary>A stated count of significant digits ("G" with a precision).</summary>
    SignificantDigits = 1,
    /// <summary>A stated count of decimals ("F" with a precision).</summary>
    FixedDecimals = 2,
}
