using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class RankingTests
{
    [Fact]
    public void Tied_values_share_the_mean_of_the_ranks_they_span()
    {
        // Worked by hand: sorted 1, 2, 2, 3, 3, 3, 7 -> ranks 1, 2.5, 2.5, 5, 5, 5, 7.
        double[] values = [3, 2, 7, 3, 1, 2, 3];
        var ranks = new double[values.Length];
        double tieTerm = Ranking.Rank(values, ranks);

        Assert.Equal([5, 2.5, 7, 5, 1, 2.5, 5], ranks);
        // T = (2^3 - 2) + (3^3 - 3) = 6 + 24 = 30.
        Assert.Equal(30, tieTerm);
    }

    [Fact]
    public void Minimum_and_maximum_tie_rules_take_the_ends_of_the_run()
    {
        double[] values = [3, 2, 7, 3, 1, 2, 3];
        Assert.Equal([4, 2, 7, 4, 1, 2, 4], Ranking.Rank(values, RankTies.Minimum));
        Assert.Equal([6, 3, 7, 6, 1, 3, 6], Ranking.Rank(values, RankTies.Maximum));
    }

    [Fact]
    public void Dense_ranks_number_the_distinct_values_without_gaps()
    {
        // Worked by hand: distinct values 1, 2, 3, 7 -> 1, 2, 3, 4; -0.0 and 0.0 are one value.
        double[] values = [3, 2, 7, 3, 1, 2, 3];
        Assert.Equal([3, 2, 4, 3, 1, 2, 3], Ranking.Rank(values, RankTies.Dense));
        Assert.Equal([1, 1, 2], Ranking.Rank([-0.0, 0.0, 5], RankTies.Dense));
    }

    [Fact]
    public void Average_ranks_always_sum_to_n_times_n_plus_one_over_two()
    {
        var random = new Random(7);
        var values = new double[501];
        for (int i = 0; i < values.Length; i++) values[i] = random.Next(40);
        double sum = Ranking.Rank(values).Sum();
        Assert.Equal(501.0 * 502 / 2, sum);
    }

    [Fact]
    public void Tie_term_of_a_sorted_sample_matches_the_ranking_tie_term()
    {
        double[] values = [5, 1, 1, 1, 4, 4, 9, 9, 9, 9];
        double fromRanking = Ranking.Rank(values, new double[values.Length]);
        var sorted = values.Order().ToArray();
        Assert.Equal(fromRanking, Ranking.TieTermOfSorted(sorted));
        // (3^3 - 3) + (2^3 - 2) + (4^3 - 4) = 24 + 6 + 60 = 90.
        Assert.Equal(90, fromRanking);
    }

    [Fact]
    public void Ranking_NaN_is_refused()
    {
        Assert.Throws<ArgumentException>(() => Ranking.Rank([1.0, double.NaN]));
    }

    [Fact]
    public void Ordinal_ranks_match_scipy_ordinal_ranks_in_both_directions()
    {
        // Reference library: scipy 1.10.1 stats.rankdata(a, method="ordinal") gives [4 2 7 5 1 3 6],
        // and rankdata(-a, method="ordinal") gives [2 5 1 3 7 6 4] (ties in order of appearance).
        double[] values = [3, 2, 7, 3, 1, 2, 3];
        Assert.Equal([4, 2, 7, 5, 1, 3, 6], Ranking.OrdinalRanks(values, ScoreDirection.LowerIsBetter));
        Assert.Equal([2, 5, 1, 3, 7, 6, 4], Ranking.OrdinalRanks(values, ScoreDirection.HigherIsBetter));
    }

    [Fact]
    public void Best_first_puts_missing_scores_last_in_index_order_whatever_the_direction()
    {
        // Common practice: a feature without a p-value (or an importance) ranks after every scored one.
        double[] values = [double.NaN, 0.5, double.NaN, 0.01, double.PositiveInfinity];
        Assert.Equal([3, 1, 4, 0, 2], Ranking.BestFirst(values, ScoreDirection.LowerIsBetter));
        Assert.Equal([4, 1, 3, 0, 2], Ranking.BestFirst(values, ScoreDirection.HigherIsBetter));
        Assert.Equal([4, 2, 5, 1, 3], Ranking.OrdinalRanks(values, ScoreDirection.LowerIsBetter));
    }
}
