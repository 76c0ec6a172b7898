using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public class BenjaminiHochbergTests
{
    // Benjamini & Hochberg (1995, JRSS-B 57:289), section 4 example: 15 p-values from a
    // myocardial infarction trial. Values from memory. At q* = 0.05 the step-up procedure rejects
    // the four smallest (0.0095 <= 4 * 0.05 / 15 = 0.0133, but 0.0201 > 5 * 0.05 / 15 = 0.0167 and
    // no larger rank qualifies), where Bonferroni rejects only three.
    private static readonly double[] PaperPValues =
        [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.0000];

    [Fact]
    public void Paper_example_rejects_the_four_smallest_at_five_percent()
    {
        var rejected = BenjaminiHochberg.RejectionSet(PaperPValues, 0.05);
        Assert.Equal(4, rejected.Count(r => r));
        Assert.True(rejected[..4].All(r => r));
    }

    [Fact]
    public void Paper_example_adjusted_values_follow_the_step_up_formula()
    {
        // By hand from q_(i) = min_{k>=i} min(1, 15 p_(k) / k):
        // q_(1) = min(0.0015, 0.003, 0.0095, 0.035625, ...) = 0.0015; q_(4) = 0.035625;
        // q_(5) = min(0.0603, 0.0695, 0.063857, 0.0645, 0.0765, ...) = 0.0603; q_(15) = 1.
        var q = BenjaminiHochberg.Adjust(PaperPValues);
        Assert.Equal(0.0015, q[0], 12);
        Assert.Equal(0.003, q[1], 12);
        Assert.Equal(0.0095, q[2], 12);
        Assert.Equal(0.035625, q[3], 12);
        Assert.Equal(0.0603, q[4], 12);
        Assert.Equal(1.0, q[14], 12);
        Assert.True(q.Count(v => v <= 0.05) == 4);
    }

    [Fact]
    public void Adjusted_values_match_the_wdbc_reference_columns()
    {
        // Source: reference/wdbc/feature_stats.csv welch_p_bh and mw_p_bh (bh_adjust in make_reference.py).
        var data = WdbcFeatureStatistics.Instance;
        foreach (var (raw, adjusted) in new[] { ("welch_p", "welch_p_bh"), ("mw_p", "mw_p_bh") })
        {
            var p = data.FeatureNames.Select(n => data.FeatureStats[n][raw]).ToArray();
            var q = BenjaminiHochberg.Adjust(p);
            for (int f = 0; f < p.Length; f++)
                Tolerance.Relative(data.FeatureStats[data.FeatureNames[f]][adjusted], q[f], 1e-12, data.FeatureNames[f]);
        }
    }

    [Fact]
    public void NaN_p_values_pass_through_and_do_not_count_as_tests()
    {
        double[] p = [0.01, double.NaN, 0.04, double.NaN];
        var q = BenjaminiHochberg.Adjust(p);
        // m = 2 tested: q = (min(0.02, 0.04), 0.04).
        Assert.Equal(0.02, q[0], 15);
        Assert.True(double.IsNaN(q[1]));
        Assert.Equal(0.04, q[2], 15);
        Assert.True(double.IsNaN(q[3]));
        Assert.Equal([true, false, true, false], BenjaminiHochberg.RejectionSet(p, 0.04));
    }

    [Fact]
    public void Rejecting_q_at_most_alpha_equals_the_step_up_set_and_q_is_monotone()
    {
        var random = new Random(11);
        for (int trial = 0; trial < 50; trial++)
        {
            var p = new double[200];
            for (int i = 0; i < p.Length; i++) p[i] = i < 20 ? random.NextDouble() * 1e-3 : random.NextDouble();
            var q = BenjaminiHochberg.Adjust(p);
            var stepUp = BenjaminiHochberg.RejectionSet(p, 0.1);
            for (int i = 0; i < p.Length; i++)
            {
                Assert.Equal(stepUp[i], q[i] <= 0.1);
                Assert.True(q[i] >= p[i] && q[i] <= 1);
            }
            var order = Enumerable.Range(0, p.Length).OrderBy(i => p[i]).ToArray();
            for (int k = 1; k < order.Length; k++) Assert.True(q[order[k]] >= q[order[k - 1]]);
        }
    }

    [Fact]
    public void P_values_outside_the_unit_interval_are_refused()
    {
        Assert.Throws<ArgumentException>(() => BenjaminiHochberg.Adjust([0.5, 1.2]));
    }
}
