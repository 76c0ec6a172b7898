using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;

namespace OmicsScreen.Screening.Tests.Statistics;

public class WelchTestTests
{
    [Fact]
    public void T_df_and_p_match_scipy_on_every_wdbc_feature()
    {
        // Source: reference/wdbc/feature_stats.csv, scipy.stats.ttest_ind(equal_var=False) and the
        // Welch-Satterthwaite df written out in make_reference.py.
        foreach (var (name, expected, malignant, benign) in WdbcFeatureStatistics.Instance.FeaturesByClass())
        {
            var result = WelchTest.Test(malignant, benign);
            Tolerance.Relative(expected["welch_t"], result.T, 1e-9, name + " t");
            Tolerance.Relative(expected["welch_df"], result.DegreesOfFreedom, 1e-9, name + " df");
            Tolerance.Relative(expected["welch_p"], result.PValue, 1e-6, name + " p");
        }
    }

    [Fact]
    public void Student_t_tail_matches_scipy_down_to_1e_minus_209()
    {
        // Source: stats_reference.json "student_t_two_sided", 2 * scipy.stats.t.sf(|t|, df).
        foreach (var item in StatsReference.Block("student_t_two_sided"))
            Tolerance.Relative(item.Number("p"), WelchTest.StudentTTwoSided(item.Number("t"), item.Number("df")), 1e-9,
                $"t={item.Number("t")} df={item.Number("df")}");
    }

    [Fact]
    public void Small_example_matches_the_formula_worked_by_hand()
    {
        // By hand: {1, 2, 3, 4} mean 2.5 var 5/3; {2, 4, 6} mean 4 var 4.
        // SE^2 = 5/12 + 4/3 = 1.75, t = -1.5 / sqrt(1.75);
        // df = 1.75^2 / ((5/12)^2 / 3 + (4/3)^2 / 2) = 3.0625 / (0.0578704 + 0.8888889) = 3.2348...
        var result = WelchTest.Test([1.0, 2, 3, 4], [2.0, 4, 6]);
        Assert.Equal(-1.5 / Math.Sqrt(1.75), result.T, 12);
        Assert.Equal(3.0625 / (25.0 / 144 / 3 + 16.0 / 9 / 2), result.DegreesOfFreedom, 12);
        Assert.Equal(-1.5, result.MeanDifference, 12);
    }

    [Fact]
    public void Two_constant_samples_give_an_undefined_test()
    {
        var result = WelchTest.Test([1.0, 1, 1], [2.0, 2, 2]);
        Assert.True(double.IsNaN(result.T));
        Assert.True(double.IsNaN(result.PValue));
        Assert.Equal(-1, result.MeanDifference);
    }
}
