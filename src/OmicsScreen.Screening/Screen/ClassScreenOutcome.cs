using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Classes: Gini forests, the out-of-bag accuracy drop as permutation importance, the Mann-Whitney
/// test (class against the rest, Bonferroni over classes) beside the forest, and held-out panels
/// scored by AUC (two classes) or accuracy (more).
/// </summary>
internal sealed class ClassScreenOutcome(ClassOutcome outcome) : ScreenOutcome
{
    public override OutcomeKind Kind => OutcomeKind.Classes;

    public override string ScoreName => outcome.ClassCount == 2 ? "auc" : "accuracy";

    public override ResamplingStrata Strata { get; } = ResamplingStrata.Of(outcome);

    public override void GrowRepeat(BinnedMatrix matrix, int[] rows, ForestOptions options, ReadOnlySpan<int> decoySources,
        int threadCount, Span<double> impurity, Span<double> permutation, Span<double> corrected, Span<double> decoys)
    {
        var forest = ForestTrainer.Train(matrix, outcome, options, rows);
        ImpurityImportance.From(forest).MeanDecrease.CopyTo(impurity);
        OutOfBagPermutationImportance.Measure(forest, matrix, outcome, threadCount).MeanAccuracyDrop.CopyTo(permutation);
        var air = CorrectedImpurityImportance.Measure(matrix, outcome, rows, decoySources, options);
        air.Features.CopyTo(corrected);
        air.Decoys.CopyTo(decoys);
    }

    public override ReferenceForest GrowReference(BinnedMatrix matrix, ForestOptions options)
    {
        var forest = ForestTrainer.Train(matrix, outcome, options);
        var votes = new OutOfBagVotes(forest, outcome);
        var summary = new ReferenceForestSummary(votes.Error, votes.PerClassError.ToArray(), votes.Auc, votes.ErrorCurve.ToArray());
        return new ReferenceForest(summary,
            (binned, groups, threads) => OutOfBagPermutationImportance.MeasureGroups(forest, binned, outcome, groups, threads))
        {
            LeafValues = TreeLeafValues.OfClassForest(forest, outcome.PositiveClass),
        };
    }

    public override IReadOnlyList<TreeLeafValues> GrowLeafValues(BinnedMatrix matrix, ForestOptions options) =>
        TreeLeafValues.OfClassForest(ForestTrainer.Train(matrix, outcome, options), outcome.PositiveClass);

    /// <summary>The classes.</summary>
    public override int[] PartnerStrata() => outcome.SampleClasses.ToArray();

    /// <summary>The rank tests of every class contrast; a feature's rank is by its smallest p over contrasts.</summary>
    public override SingleMarkerStatistics SingleMarkers(Panel panel, int threadCount)
    {
        var table = UnivariateScreen.Compute(panel);
        var best = new double[panel.FeatureCount];
        Array.Fill(best, double.PositiveInfinity);
        foreach (var row in table.AllSamples)
            if (!double.IsNaN(row.PValue)) best[row.FeatureIndex] = Math.Min(best[row.FeatureIndex], row.PValue);
        string positive = outcome.ClassNames[outcome.PositiveClass];
        int contrast = 0;
        for (int c = 0; c < table.Contrasts.Count; c++)
            if (table.Contrasts[c] == positive) { contrast = c; break; }
        return new SingleMarkerStatistics(table, [], [], Ranking.OrdinalRanks(best, ScoreDirection.LowerIsBetter), contrast);
    }

    public override double[] RankTestPValues(FeatureMatrix values, int[] rows, int threadCount) =>
        UnivariateScreen.RankTestPValues(values, outcome, rows, threadCount);

    public override PanelScore ScorePanel(BinnedMatrix matrix, ReadOnlySpan<int> features, int[] trainingRows, ReadOnlySpan<int> testRows,
        ForestOptions options)
    {
        var selected = matrix.SelectFeatures(features);
        var forest = ForestTrainer.Train(selected, outcome, options, trainingRows);
        var prediction = forest.Predict(selected);
        var classes = outcome.SampleClasses;
        int wrong = 0;
        var probabilities = new double[testRows.Length];
        var positive = new bool[testRows.Length];
        var hits = new double[testRows.Length];
        for (int i = 0; i < testRows.Length; i++)
        {
            int row = testRows[i];
            if (prediction.PredictedClasses[row] != classes[row]) wrong++;
            else hits[i] = 1;
            probabilities[i] = prediction.Probability(row, outcome.PositiveClass);
            positive[i] = classes[row] == outcome.PositiveClass;
        }
        double error = (double)wrong / testRows.Length;
        double score = outcome.ClassCount == 2 ? MannWhitneyAuc.Compute(probabilities, positive) : 1 - error;
        return new PanelScore(score, error, probabilities, positive) { Hits = hits };
    }

    /// <summary>AUC 0.5 with every sample called alike, or the accuracy of always calling the training part's largest class.</summary>
    public override PanelScore ChanceScore(int[] trainingRows, int[] testRows)
    {
        var classes = outcome.SampleClasses;
        var positive = new bool[testRows.Length];
        for (int i = 0; i < testRows.Length; i++) positive[i] = classes[testRows[i]] == outcome.PositiveClass;
        var probabilities = new double[testRows.Length];
        Array.Fill(probabilities, 0.5);
        var counts = new int[outcome.ClassCount];
        foreach (int row in trainingRows) counts[classes[row]]++;
        int largest = 0;
        for (int c = 1; c < counts.Length; c++) if (counts[c] > counts[largest]) largest = c;
        int right = 0;
        var hits = new double[testRows.Length];
        for (int i = 0; i < testRows.Length; i++)
        {
            if (classes[testRows[i]] != largest) continue;
            right++;
            hits[i] = 1;
        }
        double accuracy = (double)right / testRows.Length;
        return new PanelScore(outcome.ClassCount == 2 ? 0.5 : accuracy, 1 - accuracy, probabilities, positive) { Hits = hits };
    }
}
