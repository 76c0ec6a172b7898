using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// One of the cohort check's analyses: a forest that predicts the cohort from every feature. Its
/// out-of-bag accuracy far above the largest cohort's share means strong batch structure, and its
/// importance ranks say which features carry it. It never sees the outcome, so it means the same
/// for every outcome kind.
/// </summary>
/// <param name="Accuracy">Out-of-bag accuracy of the forest predicting the cohort.</param>
/// <param name="ImportanceRanks">Each feature's rank (1 = most) by the forest's mean decrease in Gini impurity.</param>
/// <param name="LargestShare">Accuracy of always guessing the largest cohort.</param>
internal sealed record CohortPrediction(double Accuracy, int[] ImportanceRanks, double LargestShare)
{
    public static CohortPrediction Grow(ScreenContext context, int[][] rowsOf)
    {
        var (panel, matrix, settings) = (context.Panel, context.Matrix, context.Settings);
        var cohort = panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var cohortOutcome = new ClassOutcome(cohort.ColumnName, cohort.LevelNames, cohort.SampleLevels.ToArray());
        var cohortOptions = settings.ForestOptions(panel.Subject, RandomStreams.CohortForest(settings.Options.Seed));
        // Cohorts of unequal size are the design, not a nuisance to balance away.
        var forest = ForestTrainer.Train(matrix, cohortOutcome, cohortOptions with
        {
            Sampling = cohortOptions.Sampling with { ClassBalanced = false },
        });
        double accuracy = 1 - new OutOfBagVotes(forest, cohortOutcome).Error;
        var ranks = RankDescending(ImpurityImportance.From(forest).MeanDecrease);
        double largestShare = rowsOf.Max(r => r.Length) / (double)panel.SampleCount;
        return new CohortPrediction(accuracy, ranks, largestShare);
    }

    /// <summary>Ranks 1..n by decreasing value, ties by feature index so the ranks never depend on sort stability.</summary>
    private static int[] RankDescending(ReadOnlySpan<double> values)
    {
        var copy = values.ToArray();
        var order = Enumerable.Range(0, copy.Length).ToArray();
        Array.Sort(order, (a, b) => copy[a] != copy[b] ? copy[b].CompareTo(copy[a]) : a.CompareTo(b));
        var ranks = new int[copy.Length];
        for (int i = 0; i < order.Length; i++) ranks[order[i]] = i + 1;
        return ranks;
    }
}
