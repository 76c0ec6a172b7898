namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The forest grown on all samples and all features with the screen's settings: its
/// out-of-bag error says how separable the classes are, and its error curve whether the
/// forests have enough trees.
/// </summary>
public sealed record ReferenceForestSummary(
    double OutOfBagError,
    IReadOnlyList<double> PerClassError,
    double? OutOfBagAuc,
    IReadOnlyList<double> ErrorCurve);
