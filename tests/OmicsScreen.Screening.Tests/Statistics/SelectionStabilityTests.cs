using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class SelectionStabilityTests
{
    // Three repeats over four features (rows are repeats):
    //   1 1 0 0
    //   1 0 1 0
    //   1 1 0 0
    private static readonly bool[] SmallMatrix =
    [
        true, true, false, false,
        true, false, true, false,
        true, true, false, false,
    ];

    [Fact]
    public void Nogueira_estimate_of_a_small_matrix_matches_the_definition_worked_by_hand()
    {
        // Nogueira, Sechidis & Brown (2018, JMLR 18(174)), Definition 4, by hand:
        // p = (1, 2/3, 1/3, 0), k-bar = 2, d = 4, M = 3.
        // (1/d) sum s_f^2 = (1/4) * (3/2) * (0 + 2/9 + 2/9 + 0) = 1/6; (k-bar/d)(1 - k-bar/d) = 1/4.
        // Phi = 1 - (1/6) / (1/4) = 1/3.
        var estimate = SelectionStability.Nogueira(SmallMatrix, 4);
        Assert.Equal(1.0 / 3, estimate.Stability, 14);
        Assert.Equal(2.0, estimate.MeanSelectedCount, 14);
        Assert.Equal(3, estimate.RepeatCount);
    }

    [Fact]
    public void Nogueira_variance_of_a_small_matrix_matches_the_estimator_worked_by_hand()
    {
        // The variance estimator of the same paper (Theorem 9; formula recalled from memory, and
        // checked against the authors' kappa-form code in the next test):
        // phi_r = [ (1/d) sum_f Z_rf p_f - k_r k-bar/d^2 + (Phi/2)(2 k_r k-bar/d^2 - k_r/d - k-bar/d + 1) ] / (1/4).
        // Every k_r = 2: k_r k-bar / d^2 = 1/4 and the Phi term is (1/6)(1/2 - 1/2 - 1/2 + 1) = 1/12.
        // Row sums (1/d) sum Z p: 5/12, 1/3, 5/12 -> phi = 4 (5/12 - 1/4 + 1/12) = 1, 2/3, 1.
        // Mean 8/9; squared deviations 1/81 + 4/81 + 1/81 = 2/27; Var = 4/9 * 2/27 = 8/243.
        var estimate = SelectionStability.Nogueira(SmallMatrix, 4);
        Assert.Equal(8.0 / 243, estimate.Variance, 14);
        double halfWidth = 1.959963984540054 * Math.Sqrt(8.0 / 243);
        Assert.Equal(1.0 / 3 - halfWidth, estimate.Interval.Lower, 12);
        Assert.Equal(1.0 / 3 + halfWidth, estimate.Interval.Upper, 12);
    }

    [Fact]
    public void Variance_equals_the_authors_agreement_kappa_form_on_random_matrices()
    {
        // The authors' published code for the paper (github.com/nogueirs/JMLR2018,
        // Matlab/getStabilityVariance.m) writes the estimator as Fleiss' kappa:
        // pi = k-bar/d, pe = 1 - 2 pi (1 - pi), pa = 1 - (2/d) M/(M-1) sum_f p_f (1 - p_f),
        // Phi = (pa - pe) / (1 - pe); per repeat pa_r = 1 - k_r/d - pi + (2/d) sum_f Z_rf p_f,
        // pe_r = (1 - Phi)(pi k_r/d + (1 - pi)(1 - k_r/d)), g_r = (pa_r - pe_r) / (1 - pe),
        // Var = 4/M^2 sum_r (g_r - g-bar)^2. Recomputed here independently of the product code.
        var random = new Random(17);
        for (int trial = 0; trial < 20; trial++)
        {
            int repeats = random.Next(2, 30), features = random.Next(2, 40);
            var z = new bool[repeats * features];
            for (int i = 0; i < z.Length; i++) z[i] = random.Next(4) == 0;
            if (!z.Contains(true)) z[0] = true;
            double m = repeats, d = features;
            var p = new double[features];
            var k = new double[repeats];
            for (int r = 0; r < repeats; r++)
                for (int f = 0; f < features; f++)
                    if (z[r * features + f]) { p[f] += 1 / m; k[r] += 1; }
            double pi = k.Average() / d, pe = 1 - 2 * pi * (1 - pi);
            double pa = 1 - 2 / d * m / (m - 1) * p.Sum(v => v * (1 - v));
            double phi = (pa - pe) / (1 - pe);
            var g = new double[repeats];
            for (int r = 0; r < repeats; r++)
            {
                double agreement = 0;
                for (int f = 0; f < features; f++) if (z[r * features + f]) agreement += p[f];
                double paR = 1 - k[r] / d - pi + 2 / d * agreement;
                double peR = (1 - phi) * (pi * k[r] / d + (1 - pi) * (1 - k[r] / d));
                g[r] = (paR - peR) / (1 - pe);
            }
            double variance = 4 / (m * m) * g.Sum(v => (v - g.Average()) * (v - g.Average()));

            var estimate = SelectionStability.Nogueira(z, features);
            Assert.Equal(phi, estimate.Stability, 12);
            Assert.Equal(variance, estimate.Variance, 12);
        }
    }

    [Fact]
    public void Identical_selections_have_stability_one_and_no_variance()
    {
        bool[] row = [true, false, true, false, false, true];
        var matrix = Enumerable.Repeat(row, 10).SelectMany(r => r).ToArray();
        var estimate = SelectionStability.Nogueira(matrix, row.Length);
        Assert.Equal(1.0, estimate.Stability, 14);
        Assert.Equal(0.0, estimate.Variance, 14);
    }

    [Fact]
    public void Random_selections_of_fixed_size_have_stability_near_zero()
    {
        // The estimator is corrected for chance: its expectation is 0 for independent random
        // selections of fixed size (paper, property 4 "correction for chance").
        var random = new Random(3);
        const int repeats = 400, features = 50, selected = 10;
        var matrix = new bool[repeats * features];
        for (int r = 0; r < repeats; r++)
            foreach (int f in Enumerable.Range(0, features).OrderBy(_ => random.Next()).Take(selected))
                matrix[r * features + f] = true;
        var estimate = SelectionStability.Nogueira(matrix, features);
        Assert.InRange(estimate.Stability, -0.03, 0.03);
        Assert.True(estimate.Interval.Lower < 0 && estimate.Interval.Upper > 0);
    }

    [Fact]
    public void Selection_frequencies_are_column_means()
    {
        Assert.Equal([1.0, 2.0 / 3, 1.0 / 3, 0.0], SelectionStability.SelectionFrequencies(SmallMatrix, 4));
    }

    [Fact]
    public void Selecting_nothing_gives_an_undefined_stability()
    {
        Assert.True(double.IsNaN(SelectionStability.Nogueira(new bool[12], 4).Stability));
    }

    [Fact]
    public void Meinshausen_buhlmann_bound_worked_by_hand()
    {
        // E[V] <= q^2 / ((2 pi - 1) p) (Meinshausen & Buhlmann 2010, Theorem 1):
        // q = 10, pi = 0.9, p = 1000 -> 100 / (0.8 * 1000) = 0.125.
        Assert.Equal(0.125, StabilitySelectionBound.ExpectedFalseSelections(10, 0.9, 1000), 14);
        Assert.Equal(0.9, StabilitySelectionBound.ThresholdFor(10, 1000, 0.125), 14);
        // q of the small matrix is its mean row sum, 2.
        Assert.Equal(2.0, SelectionStability.MeanSelectedCount(SmallMatrix, 4));
    }

    [Fact]
    public void Meinshausen_buhlmann_bound_refuses_thresholds_at_or_below_one_half()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => StabilitySelectionBound.ExpectedFalseSelections(5, 0.5, 100));
        Assert.Throws<ArgumentOutOfRangeException>(() => StabilitySelectionBound.ExpectedFalseSelections(5, 1.01, 100));
    }
}
