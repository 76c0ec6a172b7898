using System.Runtime.CompilerServices;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Engine.Sampling;

/// <summary>
/// Everything a tree's sample draw needs that does not change between trees: the eligible rows,
/// split by class and by group. Built once per forest and shared read-only by every thread.
/// </summary>
internal sealed class SamplingPlan
{
    private readonly SamplingOptions _options;
    private readonly int[] _eligibleRows;
    private readonly int[][] _rowsByClass;
    private readonly int[] _groupStarts;
    private readonly int[] _groupRows;

    public SamplingPlan(SamplingOptions options, int[] eligibleRows, ReadOnlySpan<int> sampleClasses, int classCount)
    {
        _options = options;
        _eligibleRows = eligibleRows;

        var classSizes = new int[classCount];
        foreach (int row in eligibleRows) classSizes[sampleClasses[row]]++;
        _rowsByClass = new int[classCount][];
        for (int c = 0; c < classCount; c++) _rowsByClass[c] = new int[classSizes[c]];
        Array.Clear(classSizes);
        foreach (int row in eligibleRows) _rowsByClass[sampleClasses[row]][classSizes[sampleClasses[row]]++] = row;

        if (options.Groups is { } groups)
        {
            // Compressed rows: the rows of the g-th present group are _groupRows[_groupStarts[g].._groupStarts[g+1]],
            // groups ordered by level code, rows in eligible order.
            var levels = groups.SampleLevels;
            var sizes = new int[groups.LevelCount];
            foreach (int row in eligibleRows) sizes[levels[row]]++;
            var presentIndex = new int[groups.LevelCount];
            int presentCount = 0;
            for (int level = 0; level < sizes.Length; level++)
                presentIndex[level] = sizes[level] > 0 ? presentCount++ : -1;
            _groupStarts = new int[presentCount + 1];
            for (int level = 0; level < sizes.Length; level++)
                if (presentIndex[level] >= 0) _groupStarts[presentIndex[level] + 1] = sizes[level];
            for (int g = 0; g < presentCount; g++) _groupStarts[g + 1] += _groupStarts[g];
            _groupRows = new int[eligibleRows.Length];
            var fill = (int[])_groupStarts.Clone();
            foreach (int row in eligibleRows) _groupRows[fill[presentIndex[levels[row]]]++] = row;
        }
        else
        {
            _groupStarts = [];
            _groupRows = [];
        }
    }

    public ReadOnlySpan<int> EligibleRows => _eligibleRows;

    /// <summary>Size of the scratch span <see cref="Draw"/> needs.</summary>
    public int ScratchLength => Math.Max(_eligibleRows.Length, _groupStarts.Length);

    /// <summary>
    /// Fills counts (one per sample of the panel) with how often each row is in the bag; rows not
    /// eligible stay zero. Counts must be zero on entry at every eligible row.
    /// </summary>
    public void Draw(ref Xoshiro256StarStar generator, Span<int> counts, Span<int> scratch)
    {
        if (_options.Groups is not null) DrawGroups(ref generator, counts, scratch);
        else if (_options.ClassBalanced) DrawBalanced(ref generator, counts, scratch);
        else DrawRows(_eligibleRows, _eligibleRows.Length, ref generator, counts, scratch);
    }

    private void DrawBalanced(ref Xoshiro256StarStar generator, Span<int> counts, Span<int> scratch)
    {
        int smallest = int.MaxValue;
        foreach (var rows in _rowsByClass)
            if (rows.Length > 0) smallest = Math.Min(smallest, rows.Length);
        foreach (var rows in _rowsByClass)
            if (rows.Length > 0) DrawRows(rows, smallest, ref generator, counts, scratch);
    }

    /// <summary>Bootstrap draws drawCount rows with replacement; subsampling draws fraction x drawCount without.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void DrawRows(int[] rows, int drawCount, ref Xoshiro256StarStar generator, Span<int> counts, Span<int> scratch)
    {
        if (_options.Drawing == SampleDrawing.Bootstrap)
        {
            for (int i = 0; i < drawCount; i++) counts[rows[generator.NextInt(rows.Length)]]++;
            return;
        }
        int take = SubsampleSize(drawCount);
        var pool = scratch[..rows.Length];
        rows.CopyTo(pool);
        // Partial Fisher-Yates: after step i, pool[0..i] is a uniform draw without replacement.
        for (int i = 0; i < take; i++)
        {
            int j = i + generator.NextInt(pool.Length - i);
            (pool[i], pool[j]) = (pool[j], pool[i]);
            counts[pool[i]] = 1;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void DrawGroups(ref Xoshiro256StarStar generator, Span<int> counts, Span<int> scratch)
    {
        int groupCount = _groupStarts.Length - 1;
        if (groupCount <= 0) return;
        if (_options.Drawing == SampleDrawing.Bootstrap)
        {
            for (int i = 0; i < groupCount; i++) AddGroup(generator.NextInt(groupCount), counts);
            return;
        }
        int take = SubsampleSize(groupCount);
        var pool = scratch[..groupCount];
        for (int g = 0; g < groupCount; g++) pool[g] = g;
        for (int i = 0; i < take; i++)
        {
            int j = i + generator.NextInt(groupCount - i);
            (pool[i], pool[j]) = (pool[j], pool[i]);
            AddGroup(pool[i], counts);
        }
    }

    private void AddGroup(int group, Span<int> counts)
    {
        for (int k = _groupStarts[group]; k < _groupStarts[group + 1]; k++) counts[_groupRows[k]]++;
    }

    private int SubsampleSize(int available) =>
        Math.Clamp((int)Math.Round(_options.SubsampleFraction * available, MidpointRounding.AwayFromZero), 1, available);
}
