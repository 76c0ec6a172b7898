namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// Independent features shifted by a fixed number of SDs in the positive class, planted beside an
/// interaction or a threshold so that a design also holds markers any rank test can find.
/// </summary>
public static class MarginalMarkers
{
    /// <summary>Shifts of the three marginal markers of designs (b) and (c), in SD units.</summary>
    public static IReadOnlyList<double> DefaultEffects { get; } = [0.8, 1.0, 1.2];

    /// <summary>Adds effects[i] to marker i's standardised value in every sample of class 1.</summary>
    public static void Shift(double[][] standardised, IReadOnlyList<int> markers, IReadOnlyList<double> effects, int[] classes)
    {
        for (int m = 0; m < markers.Count; m++)
        {
            var column = standardised[markers[m]];
            for (int s = 0; s < column.Length; s++) if (classes[s] == 1) column[s] += effects[m];
        }
    }
}
