using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The decoys' evidence, computed exactly as the real features' is: mean corrected importance and
/// selection frequency over the repeats, the forest's p-value against the other decoys, the direct
/// tests on the decoy's permuted values (<see cref="DirectTestEvidence"/>), all combined
/// (<see cref="CombinedP"/>), and that combination calibrated against the other decoys'
/// (<see cref="PValues"/>).
/// </summary>
internal sealed record DecoyEvidence(double[] Means, double[] Frequencies, double[] CombinedP, double[] PValues)
{
    public int DecoyCount => Means.Length;

    public static DecoyEvidence None { get; } = new([], [], [], []);

    public static DecoyEvidence From(RepeatImportances repeats, DirectTestEvidence direct)
    {
        ArgumentNullException.ThrowIfNull(direct);
        var means = ShortlistSelection.DecoyMeans(repeats);
        var frequencies = ShortlistSelection.DecoyFrequencies(repeats);
        var forestP = DecoyNull.DecoyPValues(means);
        var combinedP = new double[means.Length];
        for (int d = 0; d < means.Length; d++)
            combinedP[d] = ScreenAggregation.Combine(forestP[d], At(direct.DecoyRankP, d), At(direct.DecoyInteractionP, d), direct.Weights);
        return new DecoyEvidence(means, frequencies, combinedP, DecoyNull.DecoyPValues(Surprise(combinedP)));
    }

    private static double At(double[] values, int index) => index < values.Length ? values[index] : double.NaN;

    /// <summary>-ln p: a statistic that grows with the evidence, whose tail the decoys' calibration fits (exponential for a uniform p).</summary>
    public static double[] Surprise(ReadOnlySpan<double> pValues)
    {
        var surprise = new double[pValues.Length];
        for (int i = 0; i < pValues.Length; i++) surprise[i] = double.IsNaN(pValues[i]) ? double.NaN : -Math.Log(Math.Max(pValues[i], 1e-300));
        return surprise;
    }
}
