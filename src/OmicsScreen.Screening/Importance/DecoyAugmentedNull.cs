namespace OmicsScreen.Screening.Importance;

/// <summary>
/// A null distribution for mean corrected importances that does not run dry on small or
/// signal-rich panels: the mirrored non-positive importances of the real features (Janitza,
/// Celik &amp; Boulesteix 2018) together with the decoys' importances and their mirror images.
/// Decoys are permuted copies of real features, so their corrected importances are draws from the
/// null, which is symmetric about zero.
/// </summary>
/// <remarks>
/// p = (1 + #{null >= x}) / (1 + |null|), the usual Monte Carlo p-value (Davison &amp; Hinkley 1997,
/// "Bootstrap methods and their application", eq. 4.11), so no feature gets p = 0 from a finite
/// null. With neither non-positive importances nor decoys the null is empty and p is NaN.
/// </remarks>
public static class DecoyAugmentedNull
{
    public static double[] NullSample(ReadOnlySpan<double> featureImportances, ReadOnlySpan<double> decoyImportances)
    {
        var mirrored = JanitzaNull.NullSample(featureImportances);
        var sample = new double[mirrored.Length + 2 * decoyImportances.Length];
        mirrored.CopyTo(sample, 0);
        int next = mirrored.Length;
        foreach (double value in decoyImportances)
        {
            sample[next++] = value;
            sample[next++] = -value;
        }
        return sample;
    }

    public static double[] PValues(ReadOnlySpan<double> featureImportances, ReadOnlySpan<double> decoyImportances, ReadOnlySpan<double> scored) =>
        JanitzaNull.ExceedanceShares(NullSample(featureImportances, decoyImportances), scored, pseudoCount: 1);
}
