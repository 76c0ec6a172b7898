using System.Numerics;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Screening.Univariate;

/// <summary>
/// A scan of every feature against every real feature for the one interaction a forest grown to
/// a greedy split rule cannot see: two markers that decide the class together while neither shifts
/// it alone (both high or both low against one high and one low). For a pair (a, b) each sample is
/// put on the same side of both medians or on opposite sides, and the classes are compared
/// between the two sides by Pearson's chi-square on the 2 x K table. A feature's statistic is its
/// largest chi-square over partners, with that partner.
/// </summary>
/// <remarks>
/// Why: a greedy split on either member of such a pair gains nothing in expectation, so the forest
/// rarely uses them and their importance stays at the null (measured by the calibration suite's
/// interacting-pair design: the forest's p-value of the pair was 0.14-0.91; on forests and
/// interactions see Wright, Ziegler &amp; Koenig 2016, BMC Bioinformatics 17:145, cited from memory). Comparing sides of the medians is the sign-product
/// contrast x_a x_b &gt; 0 of a centred pair, the simplest form such an interaction takes.
/// The maximum over partners has no closed-form null; the screen calibrates it against decoys
/// scanned the same way (<see cref="Importance.DecoyNull"/>). A marker with a marginal shift and
/// an unrelated partner gives no contrast: which side of the partner's median a sample falls is
/// independent of its class. Cost: (features + decoys) x features pairs, each a few word
/// operations per 64 samples (samples packed one bit each).
/// </remarks>
public static class PairwiseInteractionScan
{
    /// <summary>
    /// The largest chi-square of each column of <paramref name="partners"/> (then of
    /// <paramref name="others"/>, when given) over every partner column other than itself.
    /// </summary>
    /// <param name="rows">The samples the scan uses; medians are taken over them.</param>
    public static (double[] Statistics, int[] Partners) Scan(FeatureMatrix partners, FeatureMatrix? others,
        ClassOutcome outcome, int[] rows, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(partners);
        ArgumentNullException.ThrowIfNull(outcome);
        ArgumentNullException.ThrowIfNull(rows);
        int partnerCount = partners.FeatureCount;
        int otherCount = others?.FeatureCount ?? 0;
        int columnCount = partnerCount + otherCount;
        int words = (rows.Length + 63) / 64;
        int classCount = outcome.ClassCount;

        // Packed sides: high[c] has a bit for every sample above column c's median, valid[c] for
        // every sample whose side is known (measured, or below detection: lower than any measured).
        var high = new ulong[columnCount * words];
        var valid = new ulong[columnCount * words];
        var parallel = WorkerThreads.Options(threadCount);
        Parallel.For(0, columnCount, parallel, () => new double[rows.Length], (c, _, scratch) =>
        {
            var matrix = c < partnerCount ? partners : others!;
            int feature = c < partnerCount ? c : c - partnerCount;
            PackSides(matrix.Column(feature), matrix.States(feature), rows, scratch,
                high.AsSpan(c * words, words), valid.AsSpan(c * words, words));
            return scratch;
        }, _ => { });

        var classBits = new ulong[classCount * words];
        var classes = outcome.SampleClasses;
        for (int i = 0; i < rows.Length; i++)
            classBits[classes[rows[i]] * words + (i >> 6)] |= 1UL << (i & 63);

        var statistics = new double[columnCount];
        var best = new int[columnCount];
        Parallel.For(0, columnCount, parallel, () => new long[2 * classCount], (a, _, counts) =>
        {
            var (largest, partner) = classCount == 2
                ? BestPartnerTwoClasses(a, partnerCount, high, valid, classBits.AsSpan(words, words), words)
                : BestPartner(a, partnerCount, high, valid, classBits, classCount, words, counts);
            statistics[a] = largest;
            best[a] = partner;
            return counts;
        }, _ => { });
        return (statistics, best);
    }

    /// <summary>The largest chi-square of column a over partners b != a; ties keep the lowest partner index, whatever the thread count.</summary>
    private static (double Largest, int Partner) BestPartner(int a, int partnerCount, ulong[] high, ulong[] valid,
        ulong[] classBits, int classCount, int words, long[] counts)
    {
        double largest = 0;
        int partner = -1;
        var highA = high.AsSpan(a * words, words);
        var validA = valid.AsSpan(a * words, words);
        for (int b = 0; b < partnerCount; b++)
        {
            if (b == a) continue;
            double chiSquare = PairChiSquare(highA, validA, high.AsSpan(b * words, words), valid.AsSpan(b * words, words),
                classBits, classCount, words, counts);
            if (chiSquare > largest)
            {
                largest = chiSquare;
                partner = b;
            }
        }
        return (largest, partner);
    }

    /// <summary>
    /// <see cref="BestPartner"/> for two classes, the common case, with the 2 x 2 table counted
    /// in registers: four population counts per 64 samples and pair.
    /// </summary>
    private static (double Largest, int Partner) BestPartnerTwoClasses(int a, int partnerCount, ulong[] high, ulong[] valid,
        ReadOnlySpan<ulong> positive, int words)
    {
        double largest = 0;
        int partner = -1;
        int baseA = a * words;
        for (int b = 0; b < partnerCount; b++)
        {
            if (b == a) continue;
            int baseB = b * words;
            long same = 0, samePositive = 0, opposite = 0, oppositePositive = 0;
            for (int w = 0; w < words; w++)
            {
                ulong known = valid[baseA + w] & valid[baseB + w];
                ulong differ = (high[baseA + w] ^ high[baseB + w]) & known;
                ulong agree = known & ~differ;
                ulong inClass = positive[w];
                same += BitOperations.PopCount(agree);
                samePositive += BitOperations.PopCount(agree & inClass);
                opposite += BitOperations.PopCount(differ);
                oppositePositive += BitOperations.PopCount(differ & inClass);
            }
            double chiSquare = TwoByTwoChiSquare(samePositive, same - samePositive, oppositePositive, opposite - oppositePositive);
            if (chiSquare > largest)
            {
                largest = chiSquare;
                partner = b;
            }
        }
        return (largest, partner);
    }

    /// <summary>Pearson's chi-square of the 2 x 2 table [[a, b], [c, d]]: N (ad - bc)^2 / (row and column totals' product); 0 when a margin is empty.</summary>
    internal static double TwoByTwoChiSquare(long a, long b, long c, long d)
    {
        double product = (double)(a + b) * (c + d) * (a + c) * (b + d);
        if (product == 0) return 0;
        double difference = (double)a * d - (double)b * c;
        return (a + b + c + d) * difference * difference / product;
    }

    /// <summary>
    /// Pearson's chi-square of class against side (same side of both medians, or opposite sides)
    /// over the samples where both sides are known; 0 when either margin is empty.
    /// </summary>
    internal static double PairChiSquare(ReadOnlySpan<ulong> highA, ReadOnlySpan<ulong> validA,
        ReadOnlySpan<ulong> highB, ReadOnlySpan<ulong> validB, ReadOnlySpan<ulong> classBits, int classCount, int words, Span<long> counts)
    {
        counts.Clear();
        for (int w = 0; w < words; w++)
        {
            ulong known = validA[w] & validB[w];
            ulong opposite = (highA[w] ^ highB[w]) & known;
            ulong same = known & ~opposite;
            for (int k = 0; k < classCount; k++)
            {
                ulong inClass = classBits[k * words + w];
                counts[2 * k] += BitOperations.PopCount(same & inClass);
                counts[2 * k + 1] += BitOperations.PopCount(opposite & inClass);
            }
        }
        long sameTotal = 0, oppositeTotal = 0;
        for (int k = 0; k < classCount; k++)
        {
            sameTotal += counts[2 * k];
            oppositeTotal += counts[2 * k + 1];
        }
        long total = sameTotal + oppositeTotal;
        if (sameTotal == 0 || oppositeTotal == 0) return 0;
        double chiSquare = 0;
        for (int k = 0; k < classCount; k++)
        {
            long inClass = counts[2 * k] + counts[2 * k + 1];
            if (inClass == 0) continue;
            double expectedSame = (double)sameTotal * inClass / total;
            double expectedOpposite = (double)oppositeTotal * inClass / total;
            double d1 = counts[2 * k] - expectedSame, d2 = counts[2 * k + 1] - expectedOpposite;
            chiSquare += d1 * d1 / expectedSame + d2 * d2 / expectedOpposite;
        }
        return chiSquare;
    }

    /// <summary>
    /// Marks which of <paramref name="rows"/> lie above the column's median (below-detection cells
    /// count as lower than every measured value; missing cells have no side).
    /// </summary>
    internal static void PackSides(ReadOnlySpan<float> column, ReadOnlySpan<CellState> states, int[] rows, double[] scratch,
        Span<ulong> high, Span<ulong> valid)
    {
        high.Clear();
        valid.Clear();
        int known = 0;
        for (int i = 0; i < rows.Length; i++)
        {
            var state = states.IsEmpty ? CellState.Measured : states[rows[i]];
            if (state == CellState.Missing || (state == CellState.Measured && float.IsNaN(column[rows[i]]))) continue;
            scratch[known++] = state == CellState.BelowDetection ? double.NegativeInfinity : column[rows[i]];
        }
        if (known == 0) return;
        var values = scratch.AsSpan(0, known);
        values.Sort();
        // The sample median (mean of the two middle values for an even count); "above" is strict,
        // so ties at the median, and a column that is mostly below detection, lean to the low side.
        double median = known % 2 == 1 ? values[known / 2] : 0.5 * (values[known / 2 - 1] + values[known / 2]);
        for (int i = 0; i < rows.Length; i++)
        {
            var state = states.IsEmpty ? CellState.Measured : states[rows[i]];
            if (state == CellState.Missing || (state == CellState.Measured && float.IsNaN(column[rows[i]]))) continue;
            valid[i >> 6] |= 1UL << (i & 63);
            if (state == CellState.Measured && column[rows[i]] > median) high[i >> 6] |= 1UL << (i & 63);
        }
    }
}
