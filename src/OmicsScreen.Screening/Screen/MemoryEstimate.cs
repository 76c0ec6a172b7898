using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The peak memory a run will need, itemised, from the panel's shape and the options alone, so
/// that a run too large for the machine can be refused before anything is read.
/// </summary>
/// <remarks>
/// Sizes follow the 64-bit .NET object layout: an array costs a 24-byte header plus its
/// elements, an object a 16-byte header plus its fields, a string about 24 + 2 x length bytes.
/// The run has two phases with different live sets: loading (the raw matrix and the reader's
/// buffers) and screening (the raw matrix, its binned codes, forests, repeat matrices). The
/// peak is the larger of the two; the terms kept in <see cref="Terms"/> are those of the phase
/// that sets it. Tree sizes assume fully grown trees (minimum leaf 1, the default) on
/// d = (1 - 1/e) n distinct in-bag samples of a bootstrap of n. The baseline and the collector's
/// growth were calibrated against measured peaks (peak resident set, VmHWM) by the `memory`
/// benchmark with workstation, non-concurrent collection (the CLI's settings); the result is an
/// estimate, not a bound. Cell states are assumed for every feature, since whether a panel has
/// missing cells is unknown before it is read.
/// </remarks>
public sealed class MemoryEstimate
{
    /// <summary>
    /// Resident memory that does not grow with the panel: the runtime, compiled code, libraries,
    /// the reader's pooled buffers and the collector's young-generation budget. Measured: about
    /// 50 MB on a 60 x 100 panel; 70 MB fits the three benchmark sizes together with
    /// <see cref="CollectorGrowth"/>.
    /// </summary>
    public const long RuntimeBaselineBytes = 70L << 20;

    /// <summary>
    /// Peak heap over live data during the screen. A repeat's widened matrix and forests die
    /// after it, but survive long enough to be promoted, and the collector lets the old
    /// generation grow well past its live size before a full collection. Measured peak resident
    /// set over forced-collection live heap on the benchmark panels: 2.2 to 3.4; 2.5 is used.
    /// </summary>
    public const double CollectorGrowth = 2.5;

    private const long ArrayHeader = 24;
    private const long ObjectHeader = 16;
    private const long Reference = 8;

    /// <summary>A feature or sample name of about 16 characters, with the references that hold it.</summary>
    private const long NameBytes = ArrayHeader + 2 * 16 + 3 * Reference;

    /// <summary>Per cell of <see cref="RepeatImportances"/>: corrected, permutation, impurity, combined rank (doubles) and the selection flag.</summary>
    private const long RepeatCellBytes = 4 * sizeof(double) + sizeof(bool);

    /// <summary>The fraction of a bootstrap sample of n that is distinct, 1 - (1 - 1/n)^n, close to 1 - 1/e.</summary>
    private const double DistinctInBagShare = 0.632;

    private MemoryEstimate(IReadOnlyList<MemoryTerm> terms)
    {
        Terms = terms;
        long total = 0;
        foreach (var term in terms) total += term.Bytes;
        TotalBytes = total;
    }

    /// <summary>The terms of the phase that sets the peak; they add up to <see cref="TotalBytes"/>.</summary>
    public IReadOnlyList<MemoryTerm> Terms { get; }

    public long TotalBytes { get; }

    /// <summary>The bytes of one component, or 0 when it does not count towards the peak.</summary>
    public long Bytes(MemoryComponent component)
    {
        long bytes = 0;
        foreach (var term in Terms) if (term.Component == component) bytes += term.Bytes;
        return bytes;
    }

    /// <summary>The largest terms first, at most <paramref name="count"/>; the runtime baseline is left out, since no option changes it.</summary>
    public IReadOnlyList<MemoryTerm> Largest(int count)
    {
        var terms = new List<MemoryTerm>(Terms.Count);
        foreach (var term in Terms) if (term.Component != MemoryComponent.RuntimeBaseline && term.Bytes > 0) terms.Add(term);
        terms.Sort((a, b) => b.Bytes.CompareTo(a.Bytes));
        return terms.Count > count ? terms.GetRange(0, count) : terms;
    }

    /// <summary>Estimates the `screen` verb on a panel of this shape.</summary>
    /// <param name="threadCount">Threads that grow trees at once (resolved: never 0).</param>
    /// <param name="classCount">Outcome classes; 2 when not yet known.</param>
    /// <param name="loaderMatrixCopies">
    /// Matrix-sized buffers the reader holds beside the result while loading: 1 for CSV/TSV and
    /// Parquet (columns gathered into file order), 2 for Arrow (the file's float64 batches are all in memory).
    /// </param>
    public static MemoryEstimate ForScreen(int sampleCount, int featureCount, ScreenOptions options, int threadCount,
        int classCount = 2, double loaderMatrixCopies = 1)
    {
        ArgumentNullException.ThrowIfNull(options);
        CheckShape(sampleCount, featureCount, threadCount, classCount);
        long samples = sampleCount, features = featureCount;
        long decoys = ScreenSettings.DecoyCountFor(options, featureCount);
        long repeats = 2L * options.HalfSamplePairs;
        long trees = options.TreesPerForest;

        long raw = RawMatrixBytes(samples, features);
        long loader = (long)(loaderMatrixCopies * ColumnBytes(features, 4 * samples));

        long binned = BinnedBytes(samples, features);
        int contrasts = classCount == 2 ? 1 : classCount;
        // A univariate row (about 20 numbers and references) per feature and contrast, and a screen summary row per feature.
        long tables = features * (contrasts * 100L + 100L);
        long reference = ForestBytes(samples, trees, classCount);

        // A repeat grows on a half-sample; with outcome permutations a corrected forest also grows on all samples.
        long half = Math.Max(1, samples / 2);
        long correctedRows = options.OutcomePermutations > 0 ? samples : half;
        long repeatForests = ForestBytes(half, trees, classCount) + ForestBytes(correctedRows, trees, classCount);
        long widened = features + decoys;
        // Permuted-copy and decoy codes, their "copy:" names, and the widened matrix's per-column arrays.
        long copies = ColumnBytes(widened, samples) + widened * (NameBytes + 14) + (features + widened) * (3 * Reference + 9);
        long inFlight = threadCount * WorkerBytes(samples, features + widened, classCount);
        long repeatMatrices = repeats * features * RepeatCellBytes + repeats * decoys * (sizeof(double) + sizeof(bool));
        long curve = options.CurveFolds > 0 ? 2L * options.CurveInnerPairs * features * RepeatCellBytes : 0;
        var screenTerms = new List<MemoryTerm>
        {
            new(MemoryComponent.BinnedCodes, binned),
            new(MemoryComponent.FeatureTables, tables),
            new(MemoryComponent.ReferenceForest, reference),
            new(MemoryComponent.RepeatForests, repeatForests),
            new(MemoryComponent.PermutedCopyAndDecoyColumns, copies),
            new(MemoryComponent.TreesInFlight, inFlight),
            new(MemoryComponent.RepeatImportances, repeatMatrices),
            new(MemoryComponent.PanelSizeCurve, curve),
        };
        return Combine(raw, loader, screenTerms);
    }

    /// <summary>Estimates the `grow` verb: one forest on all samples.</summary>
    public static MemoryEstimate ForGrow(int sampleCount, int featureCount, int treeCount, int threadCount,
        int classCount = 2, double loaderMatrixCopies = 1)
    {
        CheckShape(sampleCount, featureCount, threadCount, classCount);
        if (treeCount < 1) throw new ArgumentOutOfRangeException(nameof(treeCount), "A forest has at least one tree.");
        long samples = sampleCount, features = featureCount;
        long raw = RawMatrixBytes(samples, features);
        long loader = (long)(loaderMatrixCopies * ColumnBytes(features, 4 * samples));
        var growTerms = new List<MemoryTerm>
        {
            new(MemoryComponent.BinnedCodes, BinnedBytes(samples, features)),
            new(MemoryComponent.ReferenceForest, ForestBytes(samples, treeCount, classCount)),
            new(MemoryComponent.TreesInFlight, threadCount * WorkerBytes(samples, features, classCount)),
        };
        return Combine(raw, loader, growTerms);
    }

    /// <summary>
    /// Loading holds the raw matrix and the reader's buffers, short-lived enough that the heap
    /// stays near its live size; the run holds the raw matrix and its own terms for minutes of
    /// allocation, so its heap grows by <see cref="CollectorGrowth"/>. The larger phase is the peak.
    /// </summary>
    private static MemoryEstimate Combine(long raw, long loader, List<MemoryTerm> runTerms)
    {
        long live = raw;
        foreach (var term in runTerms) live += term.Bytes;
        long headroom = (long)((CollectorGrowth - 1) * live);
        var terms = new List<MemoryTerm>
        {
            new(MemoryComponent.RuntimeBaseline, RuntimeBaselineBytes),
            new(MemoryComponent.RawMatrix, raw),
        };
        if (raw + loader > live + headroom) terms.Add(new MemoryTerm(MemoryComponent.LoaderTransient, loader));
        else
        {
            terms.AddRange(runTerms);
            terms.Add(new MemoryTerm(MemoryComponent.CollectorHeadroom, headroom));
        }
        return new MemoryEstimate(terms);
    }

    /// <summary>
    /// Float32 columns, a cell-state byte per cell (assumed for every feature: a panel with
    /// missing or below-detection cells anywhere in a feature carries a state array for it),
    /// and the feature names and sample ids.
    /// </summary>
    private static long RawMatrixBytes(long samples, long features) =>
        ColumnBytes(features, 4 * samples) + ColumnBytes(features, samples) + (features + samples) * NameBytes;

    /// <summary>
    /// A byte code per cell, and each feature's bin bounds: one float per distinct value up to
    /// BinMapper.MaxValueBins, in an object of its own, plus the matrix's per-column arrays.
    /// </summary>
    private static long BinnedBytes(long samples, long features)
    {
        long bounds = ObjectHeader + 8 + ArrayHeader + 4 * Math.Min(samples, BinMapper.MaxValueBins);
        return ColumnBytes(features, samples) + features * (bounds + 3 * Reference + 9);
    }

    /// <summary>One array of the given element bytes per column, and the reference that holds it.</summary>
    private static long ColumnBytes(long columns, long bytesPerColumn) => columns * (ArrayHeader + bytesPerColumn + Reference);

    /// <summary>
    /// A forest grown on n rows: per tree, d nodes for d = 0.632 n distinct in-bag rows, the
    /// tree's node arrays and object, and the out-of-bag rows with their predicted classes.
    /// </summary>
    /// <remarks>
    /// A tree could have up to 2 d - 1 nodes (a leaf per distinct sample), but fully grown trees
    /// were measured at about 0.45 d nodes on a pure-noise panel and fewer on one with signal,
    /// since leaves turn pure while holding several samples; d leaves a margin of about two.
    /// </remarks>
    internal static long ForestBytes(long rows, long trees, int classCount)
    {
        long distinct = Math.Max(1, (long)Math.Ceiling(DistinctInBagShare * rows));
        long nodes = distinct;
        long outOfBag = rows - distinct;
        long tree = nodes * DecisionTree.BytesPerNode(classCount) + DecisionTree.NodeArrayCount * (ArrayHeader + Reference)
            + ObjectHeader + Reference;
        long outOfBagRows = 2 * (ArrayHeader + 4 * outOfBag) + ObjectHeader + 2 * Reference;
        return trees * (tree + outOfBagRows + 2 * Reference);
    }

    /// <summary>One thread's tree worker, as the engine states it.</summary>
    private static long WorkerBytes(long samples, long columns, int classCount) =>
        ForestTrainer.ScratchBytesPerThread(samples, columns, classCount);

    private static void CheckShape(int sampleCount, int featureCount, int threadCount, int classCount)
    {
        if (sampleCount < 1) throw new ArgumentOutOfRangeException(nameof(sampleCount), "A panel has at least one sample.");
        if (featureCount < 1) throw new ArgumentOutOfRangeException(nameof(featureCount), "A panel has at least one feature.");
        if (threadCount < 1) throw new ArgumentOutOfRangeException(nameof(threadCount), "Resolve the thread count first.");
        if (classCount < 2) throw new ArgumentOutOfRangeException(nameof(classCount), "An outcome has at least two classes.");
    }
}
