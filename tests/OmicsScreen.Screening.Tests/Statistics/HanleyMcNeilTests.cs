using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class HanleyMcNeilTests
{
    [Fact]
    public void Rating_scale_example_of_the_paper_gives_area_0_893_and_se_0_032()
    {
        // Hanley & McNeil (1982, Radiology 143:29), Table 1: CT images rated 1 (definitely normal)
        // to 5 (definitely abnormal). 58 truly normal: 33, 6, 6, 11, 2; 51 truly abnormal: 3, 2, 2,
        // 11, 33. The paper reports W = 0.893 and SE(W) = 0.032. Counts and results from memory.
        var normal = Ratings([33, 6, 6, 11, 2]);
        var abnormal = Ratings([3, 2, 2, 11, 33]);
        double auc = MannWhitney.Test(abnormal, normal).Auc;
        Assert.Equal(0.893, auc, 0.0005);
        Assert.Equal(0.032, HanleyMcNeil.StandardError(auc, abnormal.Length, normal.Length), 0.0005);
    }

    [Fact]
    public void Standard_error_follows_the_q1_q2_formula()
    {
        // By hand for A = 0.8, n1 = 10, n0 = 20: Q1 = 0.8 / 1.2 = 0.666667, Q2 = 1.28 / 1.8 = 0.711111;
        // SE^2 = (0.16 + 9 (0.026667) + 19 (0.071111)) / 200 = (0.16 + 0.24 + 1.351111) / 200 = 0.00875556.
        double expected = Math.Sqrt((0.16 + 9 * (0.8 / 1.2 - 0.64) + 19 * (1.28 / 1.8 - 0.64)) / 200);
        Assert.Equal(expected, HanleyMcNeil.StandardError(0.8, 10, 20), 14);
        Assert.Equal(0.0935711, HanleyMcNeil.StandardError(0.8, 10, 20), 6);
    }

    private static double[] Ratings(int[] countPerRating)
    {
        var values = new List<double>();
        for (int rating = 0; rating < countPerRating.Length; rating++)
            for (int k = 0; k < countPerRating[rating]; k++) values.Add(rating + 1);
        return values.ToArray();
    }
}
