namespace OmicsScreen.Screening.Importance;

/// <summary>
/// Actual impurity reduction (Nembrini, König &amp; Wright 2018): real minus permuted-copy mean decrease
/// in impurity for every real feature, and the same for decoy copies.
/// </summary>
/// <param name="Features">One value per real feature, in the matrix's column order.</param>
/// <param name="Decoys">One value per decoy: MDI(decoy) - MDI(permuted copy of its source feature).</param>
/// <param name="DecoySources">The real feature each decoy permutes, parallel to <paramref name="Decoys"/>.</param>
public sealed record CorrectedImportance(double[] Features, double[] Decoys, int[] DecoySources);
