namespace OmicsScreen.Data;

/// <summary>How the column named as the outcome is read.</summary>
public enum OutcomeKindChoice
{
    /// <summary>Classes, unless the column holds numbers with many distinct values: then a measured quantity.</summary>
    Auto,
    /// <summary>Always classes, even when the labels are numbers.</summary>
    Classes,
    /// <summary>Always a measured quantity: every cell must be a number.</summary>
    Measured,
}
