using OmicsScreen.Engine.Parallelism;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics.X86;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Engine.Binning;

/// <summary>
/// A panel quantised once: one byte code per cell, feature-major (each feature's codes contiguous,
/// features one after another in a few large blocks, see <see cref="CodeBlocks"/>), plus each
/// feature's bins in original units. Every seed, repeat and tree reuses it.
/// </summary>
/// <remarks>
/// Columns are shared, never copied, between a matrix and the matrices derived from it
/// (<see cref="SelectFeatures"/>, <see cref="WithPermutedCopies"/>), so screening can build many
/// views of one panel cheaply. <see cref="SourceFeature"/> maps each column back to the feature
/// of the matrix originally binned.
/// </remarks>
public sealed class BinnedMatrix
{
    private readonly CodeColumn[] _codes;
    private readonly FeatureBins[] _bins;
    private readonly int[] _sourceFeatures;
    private readonly bool[] _isPermutedCopy;

    internal BinnedMatrix(IReadOnlyList<string> featureNames, int sampleCount, CodeColumn[] codes,
        FeatureBins[] bins, int[] sourceFeatures, bool[] isPermutedCopy)
    {
        FeatureNames = featureNames;
        SampleCount = sampleCount;
        // A copy holding each feature's value bin count beside its codes' place (see CodeColumn).
        _codes = new CodeColumn[codes.Length];
        for (int f = 0; f < codes.Length; f++) _codes[f] = codes[f] with { ValueBinCount = bins[f].ValueBinCount };
        _bins = bins;
        _sourceFeatures = sourceFeatures;
        _isPermutedCopy = isPermutedCopy;
    }

    public int SampleCount { get; }
    public int FeatureCount => _codes.Length;
    public IReadOnlyList<string> FeatureNames { get; }

    /// <summary>The codes of one feature, one per sample, in sample order.</summary>
    public ReadOnlySpan<byte> Codes(int feature)
    {
        var column = _codes[feature];
        return new ReadOnlySpan<byte>(column.Store, column.Start, SampleCount);
    }

    public FeatureBins Bins(int feature) => _bins[feature];

    /// <summary>
    /// Asks the processor to start loading the cache lines of a feature's codes that the given
    /// rows will read: each row's line when the rows are fewer than the column's lines, else the
    /// whole column. Split search visits many columns in random order and, deep in a tree, reads
    /// a few scattered codes from each, so almost every read would otherwise wait for memory. A
    /// hint only: it changes no result.
    /// </summary>
    internal unsafe void PrefetchCodes(int feature, ReadOnlySpan<int> rows)
    {
        if (!Sse.IsSupported) return;
        var column = _codes[feature];
        // The address may go stale if the collector moves the array; a prefetch of any address is harmless.
        byte* start = (byte*)Unsafe.AsPointer(ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(column.Store), column.Start));
        int sampleCount = SampleCount;
        if (rows.Length > (sampleCount >> 6))
        {
            for (int offset = 0; offset < sampleCount; offset += 64) Sse.Prefetch0(start + offset);
            Sse.Prefetch0(start + sampleCount - 1);
        }
        else foreach (int row in rows) Sse.Prefetch0(start + row);
    }

    /// <summary>The number of value bins of a feature; its missing code.</summary>
    public int ValueBinCount(int feature) => _codes[feature].ValueBinCount;

    /// <summary>
    /// Asks the processor to start loading the entry that says where a feature's codes are
    /// (split search draws features at random, so on a wide panel the entry is rarely cached).
    /// A hint only.
    /// </summary>
    internal unsafe void PrefetchColumnEntry(int feature)
    {
        if (Sse.IsSupported) Sse.Prefetch0(Unsafe.AsPointer(ref _codes[feature]));
    }

    /// <summary>The feature of the originally binned matrix this column holds (or permutes).</summary>
    public int SourceFeature(int feature) => _sourceFeatures[feature];

    /// <summary>True for a column added by <see cref="WithPermutedCopies"/>.</summary>
    public bool IsPermutedCopy(int feature) => _isPermutedCopy[feature];

    /// <summary>The largest code count of any feature; sizes histogram buffers.</summary>
    public int MaxCodeCount
    {
        get
        {
            int most = 0;
            foreach (var bins in _bins) most = Math.Max(most, bins.CodeCount);
            return most;
        }
    }

    /// <summary>A matrix of the given columns, in the given order; codes are shared, not copied.</summary>
    public BinnedMatrix SelectFeatures(ReadOnlySpan<int> features)
    {
        var names = new string[features.Length];
        var codes = new CodeColumn[features.Length];
        var bins = new FeatureBins[features.Length];
        var sources = new int[features.Length];
        var copyFlags = new bool[features.Length];
        for (int i = 0; i < features.Length; i++)
        {
            int f = features[i];
            names[i] = FeatureNames[f];
            codes[i] = _codes[f];
            bins[i] = _bins[f];
            sources[i] = _sourceFeatures[f];
            copyFlags[i] = _isPermutedCopy[f];
        }
        return new BinnedMatrix(names, SampleCount, codes, bins, sources, copyFlags);
    }

    /// <summary>
    /// This matrix's columns followed by <paramref name="other"/>'s, codes shared: for example a
    /// panel's markers beside clinical covariates binned on their own. The other matrix's source
    /// features are numbered after this one's (<see cref="FeatureCount"/> + its own).
    /// </summary>
    public BinnedMatrix Beside(BinnedMatrix other)
    {
        ArgumentNullException.ThrowIfNull(other);
        if (other.SampleCount != SampleCount) throw new ArgumentException("Both matrices must hold the same samples.", nameof(other));
        int total = FeatureCount + other.FeatureCount;
        var names = new string[total];
        var codes = new CodeColumn[total];
        var bins = new FeatureBins[total];
        var sources = new int[total];
        var copyFlags = new bool[total];
        for (int f = 0; f < total; f++)
        {
            bool mine = f < FeatureCount;
            var from = mine ? this : other;
            int g = mine ? f : f - FeatureCount;
            names[f] = from.FeatureNames[g];
            codes[f] = from._codes[g];
            bins[f] = from._bins[g];
            sources[f] = mine ? _sourceFeatures[g] : FeatureCount + other._sourceFeatures[g];
            copyFlags[f] = from._isPermutedCopy[g];
        }
        return new BinnedMatrix(names, SampleCount, codes, bins, sources, copyFlags);
    }

    /// <summary>
    /// This matrix followed by one permuted-copy column per listed feature: the feature's codes permuted
    /// over samples, which keeps its distribution and destroys any link to the outcome. Copy
    /// features give a null for importance (Kursa &amp; Rudnicki 2010, J Stat Softw 36(11); the
    /// corrected impurity importance of Nembrini, König &amp; Wright 2018, Bioinformatics 34(21)).
    /// </summary>
    /// <remarks>
    /// Copy i is permuted by the generator of (runSeed, repeat, i, PermutedCopy), so the same
    /// arguments always give the same permuted copies. Its name is the source name with a "copy:" prefix.
    /// </remarks>
    /// <param name="threadCount">Threads that build the permuted-copy columns; 0 means all cores. The result is the same for any count.</param>
    public BinnedMatrix WithPermutedCopies(ReadOnlySpan<int> sourceFeatures, ulong runSeed, int repeat, int threadCount = 0)
    {
        int original = FeatureCount;
        int total = original + sourceFeatures.Length;
        var names = new string[total];
        var codes = new CodeColumn[total];
        var bins = new FeatureBins[total];
        var sources = new int[total];
        var copyFlags = new bool[total];
        for (int f = 0; f < original; f++)
        {
            names[f] = FeatureNames[f];
            codes[f] = _codes[f];
            bins[f] = _bins[f];
            sources[f] = _sourceFeatures[f];
            copyFlags[f] = _isPermutedCopy[f];
        }
        var listed = sourceFeatures.ToArray();
        CodeBlocks.Allocate(listed.Length, SampleCount).CopyTo(codes.AsSpan(original));
        // Each permuted copy has its own generator and its own slot, so columns are built in parallel
        // (on a very wide panel this is most of a repeat's one-thread time) with the same result
        // on any number of threads. Chunks of columns keep the per-task overhead small.
        const int chunk = 256;
        int chunkCount = (listed.Length + chunk - 1) / chunk;
        var parallel = WorkerThreads.Options(threadCount);
        Parallel.For(0, chunkCount, parallel, c =>
        {
            int end = Math.Min(listed.Length, (c + 1) * chunk);
            for (int i = c * chunk; i < end; i++)
            {
                int f = listed[i];
                int target = original + i;
                var permuted = codes[target].Store.AsSpan(codes[target].Start, SampleCount);
                Codes(f).CopyTo(permuted);
                var generator = SeedSchedule.Generator(runSeed, repeat, i, SeedPurpose.PermutedCopy);
                generator.Shuffle(permuted);
                names[target] = "copy:" + FeatureNames[f];
                bins[target] = _bins[f];
                sources[target] = _sourceFeatures[f];
                copyFlags[target] = true;
            }
        });
        return new BinnedMatrix(names, SampleCount, codes, bins, sources, copyFlags);
    }

    /// <summary>The codes of new samples measured on the same features, binned with this matrix's bins.</summary>
    public BinnedMatrix Encode(FeatureMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        if (matrix.FeatureCount != FeatureCount)
            throw new ArgumentException("The matrix must have the same features, in the same order.");
        var codes = CodeBlocks.Allocate(FeatureCount, matrix.SampleCount);
        for (int f = 0; f < FeatureCount; f++)
        {
            var column = matrix.Column(f);
            var states = matrix.States(f);
            var bins = _bins[f];
            var target = codes[f].Store.AsSpan(codes[f].Start, matrix.SampleCount);
            for (int s = 0; s < target.Length; s++)
                target[s] = bins.CodeOf(column[s], states.IsEmpty ? CellState.Measured : states[s]);
        }
        return new BinnedMatrix(FeatureNames, matrix.SampleCount, codes, _bins, _sourceFeatures, _isPermutedCopy);
    }
}
