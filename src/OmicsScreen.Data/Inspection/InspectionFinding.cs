namespace OmicsScreen.Data.Inspection;

/// <summary>One thing the loader noticed about a panel.</summary>
/// <param name="Severity">Whether it stops a screen (Error), deserves a look (Warning) or informs (Note).</param>
/// <param name="Code">A stable kebab-case code for scripts, e.g. "constant-features".</param>
/// <param name="Message">What was found and what to do, in one or two sentences.</param>
public sealed record InspectionFinding(FindingSeverity Severity, string Code, string Message);
