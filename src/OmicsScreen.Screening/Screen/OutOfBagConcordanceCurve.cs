using OmicsScreen.Engine.Survival;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// How a random survival forest's out-of-bag Harrell's C grows as trees are added: the screen's
/// reference forest (as the error 1 - C) and `grow` (as C) read the same curve.
/// </summary>
public static class OutOfBagConcordanceCurve
{
    /// <summary>
    /// Harrell's C of the out-of-bag mortality of trees 0..t, for every t: each sample's mortality
    /// averaged over the trees so far that left it out, over the samples some tree has left out;
    /// NaN while no pair of those samples is comparable.
    /// </summary>
    public static double[] Of(SurvivalForest forest)
    {
        int n = forest.SampleCount;
        var sums = new double[n];
        var counts = new int[n];
        var curve = new double[forest.TreeCount];
        var kept = new List<int>(n);
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var rows = forest.OutOfBagRows(t);
            var mortality = forest.OutOfBagMortality(t);
            for (int i = 0; i < rows.Length; i++)
            {
                sums[rows[i]] += mortality[i];
                counts[rows[i]]++;
            }
            kept.Clear();
            for (int s = 0; s < n; s++) if (counts[s] > 0) kept.Add(s);
            curve[t] = SampleConcordance.Of(forest.FollowUp, kept, s => sums[s] / counts[s]);
        }
        return curve;
    }
}
