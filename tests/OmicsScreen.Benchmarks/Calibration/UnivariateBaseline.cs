using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The univariate baseline the screen's recall is measured against: one rank test per feature
/// (Mann-Whitney, positive class against the other, for two classes; Kruskal-Wallis for more)
/// and Benjamini-Hochberg at <see cref="FalseDiscoveryRate"/>.
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
}
