namespace OmicsScreen.Reporting.Charts;

/// <summary>One study (cohort) of a forest plot: its effect estimate and confidence interval.</summary>
/// <param name="Weight">Weight in the pooled estimate (inverse variance); sets the square's area. NaN draws every square alike.</param>
public sealed record ForestRow(string Label, double Estimate, double Low, double High, double Weight = double.NaN);
