namespace OmicsScreen.Reporting.Charts;

/// <summary>Settings of a <see cref="ForestPlotChart"/>.</summary>
/// <param name="Title">Chart title, also its accessible name.</param>
/// <param name="EffectAxisLabel">Label of the effect axis with its unit (for example "AUC (95% CI)").</param>
/// <param name="StudyAxisLabel">What the rows are (for example "Cohort").</param>
/// <param name="Description">Text for screen readers; a summary is generated when null.</param>
/// <param name="NullValue">Effect of no difference, drawn as a dashed line (0.5 for an AUC, 0 for a log ratio); NaN for none.</param>
/// <param name="Decimals">Decimals of the estimates printed beside the plot.</param>
public sealed record ForestPlotOptions(
    string Title,
    string EffectAxisLabel,
    string StudyAxisLabel = "Cohort",
    string? Description = null,
    double NullValue = double.NaN,
    int Decimals = 2,
    int Width = 720);
