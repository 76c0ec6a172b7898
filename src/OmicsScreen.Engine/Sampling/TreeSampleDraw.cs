using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Engine.Sampling;

/// <summary>
/// One thread's draw of a tree's samples for the forests of measured and time-to-event outcomes:
/// the in-bag rows with their weights (draw count times any sample weight) and the out-of-bag
/// rows, from the (seed, repeat, tree) sampling stream. Buffers are sized once and reused.
/// </summary>
internal sealed class TreeSampleDraw
{
    private readonly int[] _counts;
    private readonly int[] _scratch;
    private readonly int[] _rows;
    private readonly double[] _weights;

    public TreeSampleDraw(int sampleCount, int eligibleCount, int scratchLength)
    {
        _counts = new int[sampleCount];
        _scratch = new int[Math.Max(1, scratchLength)];
        _rows = new int[Math.Max(1, eligibleCount)];
        _weights = new double[_rows.Length];
    }

    public int InBagCount { get; private set; }

    /// <summary>The in-bag rows of the last draw, in eligible order.</summary>
    public ReadOnlySpan<int> InBagRows => _rows.AsSpan(0, InBagCount);

    /// <summary>Weights parallel to <see cref="InBagRows"/>.</summary>
    public ReadOnlySpan<double> InBagWeights => _weights.AsSpan(0, InBagCount);

    /// <summary>Draws tree's sample; returns its out-of-bag rows in increasing order.</summary>
    public int[] Draw(SamplingPlan plan, double[]? sampleWeights, ulong seed, int repeat, int tree)
    {
        var eligible = plan.EligibleRows;
        foreach (int row in eligible) _counts[row] = 0;
        var sampling = SeedSchedule.Generator(seed, repeat, tree, SeedPurpose.Sampling);
        plan.Draw(ref sampling, _counts, _scratch);
        int inBag = 0, outOfBag = 0;
        foreach (int row in eligible)
        {
            int drawn = _counts[row];
            if (drawn == 0) { outOfBag++; continue; }
            double weight = drawn * (sampleWeights?[row] ?? 1.0);
            if (weight <= 0) continue;
            _rows[inBag] = row;
            _weights[inBag] = weight;
            inBag++;
        }
        if (inBag == 0) throw new InvalidOperationException($"Tree {tree} drew no sample with positive weight.");
        InBagCount = inBag;
        var left = new int[outOfBag];
        int k = 0;
        foreach (int row in eligible)
            if (_counts[row] == 0) left[k++] = row;
        // Eligible rows may come in any order; out-of-bag rows are returned sorted.
        Array.Sort(left);
        return left;
    }

    /// <summary>Checks training rows (distinct, in range) and returns them, or all rows when null.</summary>
    public static int[] EligibleRows(int[]? trainingRows, int sampleCount)
    {
        int[] eligible = trainingRows ?? Enumerable.Range(0, sampleCount).ToArray();
        var seen = new bool[sampleCount];
        foreach (int row in eligible)
        {
            if ((uint)row >= (uint)sampleCount) throw new ArgumentException($"Training row {row} is out of range.");
            if (seen[row]) throw new ArgumentException($"Training row {row} is listed twice.");
            seen[row] = true;
        }
        return eligible;
    }

    /// <summary>Checks sample weights: one per sample, finite and not negative.</summary>
    public static void CheckWeights(double[]? sampleWeights, int sampleCount)
    {
        if (sampleWeights is null) return;
        if (sampleWeights.Length != sampleCount) throw new ArgumentException("One weight per sample is needed.");
        foreach (double weight in sampleWeights)
            if (!(weight >= 0) || double.IsInfinity(weight)) throw new ArgumentException("Sample weights must be finite and not negative.");
    }
}
