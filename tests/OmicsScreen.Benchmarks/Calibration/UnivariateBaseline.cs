using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The univariate baseline the screen's recall is measured against: one rank test per feature
/// (Mann-Whitney, positive class against the other, for two classes; Kruskal-Wallis for more;
/// Spearman for a measured outcome; the Cox score test on ranks for follow-up) and
/// Benjamini-Hochberg at <see cref="FalseDiscoveryRate"/>.
/// </summary>
/// <remarks>
/// Cells follow the screen's own convention: below-detection cells rank below every measured
/// value (as -infinity, tied with one another), missing cells are left out.
/// </remarks>
public static class UnivariateBaseline
{
    public const double FalseDiscoveryRate = 0.10;

    /// <summary>Per feature, whether the baseline calls it a discovery.</summary>
    public static bool[] Discoveries(Panel panel) => BenjaminiHochberg.RejectionSet(PValues(panel), FalseDiscoveryRate);

    /// <summary>Per feature, the rank test's p-value; NaN where the test cannot be run.</summary>
    public static double[] PValues(Panel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        if (panel.Kind != OutcomeKind.Classes) return OtherKindPValues(panel);
        var outcome = panel.Outcome;
        var classes = outcome.SampleClasses;
        var pValues = new double[panel.FeatureCount];
        var values = new double[panel.SampleCount];
        var groups = new int[panel.SampleCount];
        var positive = new List<double>(panel.SampleCount);
        var negative = new List<double>(panel.SampleCount);
        for (int f = 0; f < panel.FeatureCount; f++)
        {
            var column = panel.Matrix.Column(f);
            int usable = 0;
            for (int s = 0; s < panel.SampleCount; s++)
            {
                var state = panel.Matrix.State(f, s);
                if (state == CellState.Missing || (state == CellState.Measured && float.IsNaN(column[s]))) continue;
                values[usable] = state == CellState.BelowDetection ? double.NegativeInfinity : column[s];
                groups[usable] = classes[s];
                usable++;
            }
            if (outcome.ClassCount == 2)
            {
                positive.Clear();
                negative.Clear();
                for (int i = 0; i < usable; i++) (groups[i] == outcome.PositiveClass ? positive : negative).Add(values[i]);
                pValues[f] = MannWhitney.Test(positive.ToArray(), negative.ToArray()).PValue;
            }
            else
            {
                pValues[f] = KruskalWallis.PValue(values.AsSpan(0, usable), groups.AsSpan(0, usable), outcome.ClassCount);
            }
        }
        return pValues;
    }

    /// <summary>
    /// Spearman's test of each feature against a measured outcome (<see cref="SpearmanTest"/>), or
    /// the Cox score test of each feature's mid-ranks against follow-up (<see cref="CoxSingleMarker"/>):
    /// the rank tests the screen places beside its forests, here used alone.
    /// </summary>
    private static double[] OtherKindPValues(Panel panel)
    {
        var pValues = new double[panel.FeatureCount];
        var kept = new List<int>(panel.SampleCount);
        var values = new List<double>(panel.SampleCount);
        for (int f = 0; f < panel.FeatureCount; f++)
        {
            var column = panel.Matrix.Column(f);
            kept.Clear();
            values.Clear();
            for (int s = 0; s < panel.SampleCount; s++)
            {
                var state = panel.Matrix.State(f, s);
                if (state == CellState.Missing || (state == CellState.Measured && float.IsNaN(column[s]))) continue;
                kept.Add(s);
                values.Add(state == CellState.BelowDetection ? double.NegativeInfinity : column[s]);
            }
            if (kept.Count < 3)
            {
                pValues[f] = double.NaN;
                continue;
            }
            if (panel.Kind == OutcomeKind.Measured)
            {
                var outcome = panel.Measured!.Values;
                var y = new double[kept.Count];
                for (int i = 0; i < y.Length; i++) y[i] = outcome[kept[i]];
                pValues[f] = SpearmanTest.Test(values.ToArray(), y).PValue;
            }
            else
            {
                var followUp = panel.FollowUp!;
                var time = new double[kept.Count];
                var observed = new bool[kept.Count];
                for (int i = 0; i < time.Length; i++)
                {
                    time[i] = followUp.Times[kept[i]];
                    observed[i] = followUp.Events[kept[i]];
                }
                pValues[f] = CoxSingleMarker.ScoreTest(time, observed, Ranking.Rank(values.ToArray())).PValue;
            }
        }
        return pValues;
    }
}
