namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The forest grown on all samples and all features with the screen's settings: its
/// out-of-bag error says how predictable the outcome is, and its error curve whether the
/// forests have enough trees.
/// </summary>
/// <param name="OutOfBagError">Share of wrong out-of-bag votes (classes), out-of-bag mean squared error (measured outcome), or 1 - out-of-bag C (follow-up).</param>
/// <param name="PerClassError">Per class; empty for other outcome kinds.</param>
/// <param name="ErrorCurve">The out-of-bag error after each tree.</param>
public sealed record ReferenceForestSummary(
    double OutOfBagError,
    IReadOnlyList<double> PerClassError,
    double? OutOfBagAuc,
    IReadOnlyList<double> ErrorCurve)
{
    /// <summary>Out-of-bag R² of a measured outcome (1 - MSE / variance, divisor n); null for other kinds.</summary>
    public double? OutOfBagRSquared { get; init; }

    /// <summary>Out-of-bag Harrell's C of a follow-up (risk = the forest's mortality); null for other kinds.</summary>
    public double? OutOfBagConcordance { get; init; }

    /// <summary>
    /// Each sample's out-of-bag prediction of a measured outcome, in panel order (the mean over the
    /// trees that left it out; NaN where none did); empty for other kinds. The report plots it
    /// against the observed values; a merge regrows this forest, so it needs no place in a part.
    /// </summary>
    public IReadOnlyList<double> OutOfBagPredictions { get; init; } = [];
}
