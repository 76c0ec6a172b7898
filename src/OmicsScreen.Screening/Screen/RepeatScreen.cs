using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The repeated core of a screen: on each half-sample, one forest for the out-of-bag
/// permutation and impurity importances, and one forest carrying permuted copies and decoys for
/// the corrected importance (of the outcome's kind: <see cref="ScreenOutcome.GrowRepeat"/>); then each repeat's selection and combined rank. The two forests of a
/// repeat draw the same bootstrap samples (the same (seed, repeat) streams), so the repeat's
/// importances differ only by the added columns, not by the samples.
/// </summary>
/// <remarks>
/// Two forests per repeat, because the permuted-copy columns compete for splits: the forest that carries
/// them is used for corrected importances only, never for errors, votes or permutation importance.
/// </remarks>
internal static class RepeatScreen
{
    /// <summary>All 2 x <paramref name="pairCount"/> repeats of a screen at <paramref name="runSeed"/> on the eligible rows.</summary>
    public static RepeatImportances Run(ScreenContext context, ReadOnlySpan<int> eligibleRows, ulong runSeed, int pairCount)
    {
        var halves = HalfSamplePairs.Draw(context.ScreenOutcome.Strata, context.Subject, eligibleRows, pairCount, runSeed);
        var result = new RepeatImportances(halves.Length, context.Matrix.FeatureCount, context.Settings.DecoyCount);
        for (int repeat = 0; repeat < halves.Length; repeat++)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            RunOne(context, halves[repeat], RandomStreams.ScreenRepeat(runSeed, repeat), result, repeat);
        }
        return result;
    }

    /// <summary>
    /// One repeat on the half-sample <paramref name="rows"/>, written into row
    /// <paramref name="row"/> of <paramref name="result"/>. Its random streams come from
    /// <paramref name="streams"/> (run seed, repeat) alone, so a repeat computed on its own equals
    /// the same repeat of a loop.
    /// </summary>
    internal static void RunOne(ScreenContext context, int[] rows, ForestStreams streams, RepeatImportances result, int row)
    {
        var (matrix, settings) = (context.Matrix, context.Settings);
        int featureCount = matrix.FeatureCount, decoyCount = result.DecoyCount;
        ulong runSeed = streams.Seed;
        result.TrainingSampleCounts[row] = rows.Length;
        var options = settings.ForestOptions(context.Subject, streams);

        var decoySources = DecoyPlan.For(featureCount, decoyCount, runSeed).Sources;
        context.ScreenOutcome.GrowRepeat(matrix, rows, options, decoySources, context.ThreadCount,
            result.Row(result.Impurity, row), result.Row(result.Permutation, row), result.Row(result.Corrected, row),
            result.DecoyCorrected.AsSpan(row * decoyCount, decoyCount));

        Select(result, row, settings.Options.RepeatSelectionLevel, settings.Options.SelectedPerRepeat);

        // Ranks of both measures, 1 = most important, ties averaged; their mean is the
        // repeat's combined rank, so neither measure alone decides the order.
        var correctedRanks = new double[featureCount];
        var permutationRanks = new double[featureCount];
        var negated = new double[featureCount];
        Negate(result.Row(result.Corrected, row), negated);
        Ranking.Rank(negated, correctedRanks);
        Negate(result.Row(result.Permutation, row), negated);
        Ranking.Rank(negated, permutationRanks);
        var combined = result.Row(result.CombinedRank, row);
        for (int f = 0; f < featureCount; f++) combined[f] = 0.5 * (correctedRanks[f] + permutationRanks[f]);
    }

    /// <summary>
    /// A repeat selects the features (and decoys) whose corrected importance is above zero and
    /// above the (1 - level) quantile of the repeat's decoys: a test per repeat against known-null
    /// features that carry the same persistent chance association as null features do. Real
    /// features and decoys face the same rule, so the decoys' selection frequencies follow the law
    /// of a null feature's (target-decoy reasoning). Without decoys the repeat's null is the mirrored
    /// non-positive importances (Janitza et al. 2018), which is narrower than the truth. An optional
    /// cap keeps the best ones.
    /// </summary>
    internal static void Select(RepeatImportances result, int repeat, double level, int cap)
    {
        int featureCount = result.FeatureCount, decoyCount = result.DecoyCount;
        var features = result.Row(result.Corrected, repeat);
        var decoys = result.DecoyCorrected.AsSpan(repeat * decoyCount, decoyCount);
        var nullSample = decoyCount > 0 ? decoys.ToArray() : JanitzaNull.NullSample(features);
        double threshold = 0;
        if (nullSample.Length > 0)
        {
            Array.Sort(nullSample);
            // The order statistic at ceil((1 - level) |null|): an upper quantile (Hyndman-Fan type 1).
            int index = Math.Clamp((int)Math.Ceiling((1 - level) * nullSample.Length) - 1, 0, nullSample.Length - 1);
            threshold = Math.Max(0, nullSample[index]);
        }
        var candidates = new List<(double Value, int Index)>();
        for (int f = 0; f < featureCount; f++) if (features[f] > threshold) candidates.Add((features[f], f));
        for (int d = 0; d < decoyCount; d++) if (decoys[d] > threshold) candidates.Add((decoys[d], featureCount + d));
        // Highest first; equal values by index so the choice never depends on sort stability.
        candidates.Sort((a, b) => a.Value != b.Value ? b.Value.CompareTo(a.Value) : a.Index.CompareTo(b.Index));
        int take = cap > 0 ? Math.Min(cap, candidates.Count) : candidates.Count;
        for (int i = 0; i < take; i++)
        {
            int index = candidates[i].Index;
            if (index < featureCount) result.Selected[repeat * featureCount + index] = true;
            else result.DecoySelected[repeat * decoyCount + index - featureCount] = true;
        }
    }

    private static void Negate(ReadOnlySpan<double> values, Span<double> negated)
    {
        for (int i = 0; i < values.Length; i++) negated[i] = -values[i];
    }
}
