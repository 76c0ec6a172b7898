namespace OmicsScreen.Data.Inspection;

/// <summary>How much a finding matters: an Error stops a screen, a Warning deserves a look, a Note informs.</summary>
public enum FindingSeverity
{
    Note,
    Warning,
    Error,
}
