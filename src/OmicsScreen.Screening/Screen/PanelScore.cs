namespace OmicsScreen.Screening.Screen;

/// <summary>
/// A k-marker panel's forest scored on held-out samples, in the order of the test rows: each
/// one's probability of the positive class (the share of trees voting for it), its true class
/// against the positive one, and the share of samples whose majority vote is wrong.
/// </summary>
internal sealed record PanelScore(double[] PositiveProbabilities, bool[] IsPositive, double Error);
