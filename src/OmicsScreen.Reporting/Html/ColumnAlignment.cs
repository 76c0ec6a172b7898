namespace OmicsScreen.Reporting.Html;

/// <summary>How a table column's cells are aligned.</summary>
public enum ColumnAlignment
{
    /// <summary>Left-aligned text (names, labels).</summary>
    Text = 0,
    /// <summary>Right-aligned with tabular figures, so decimal places line up down the column.</summary>
    Numeric = 1,
    /// <summary>
    /// Left-aligned text that may break between any two characters (file paths, SHA-256 digests):
    /// one long unbroken string would otherwise widen the table past the page.
    /// </summary>
    Unbroken = 2,
}
