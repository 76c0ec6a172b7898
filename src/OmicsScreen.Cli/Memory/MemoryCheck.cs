using System.Globalization;
using OmicsScreen.Cli.Commands;
using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Data.Sizing;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Cli.Memory;

/// <summary>
/// Before a screen reads its panel: sizes the matrix file, estimates the run's peak memory and
/// refuses, with the estimate and what would shrink it, a run that would not fit, instead of
/// letting the system kill it half-way.
/// </summary>
internal static class MemoryCheck
{
    /// <summary>Without a limit, a run may plan on this share of the available memory; the rest is the estimate's margin.</summary>
    public const double AvailableShare = 0.9;

    private const int ShownTerms = 5;

    /// <summary>Below this a saving is not worth suggesting.</summary>
    private const long SmallestSaving = 1L << 20;

    /// <summary>
    /// True when the screen may go ahead (it fits, or the file cannot be sized, in which case the
    /// loader reports the file's problem). Otherwise writes the refusal to standard error and
    /// returns false; nothing has been read or created.
    /// </summary>
    public static bool Passes(CliConsole console, ScreenRunOptions options)
    {
        if (PanelDimensionReader.TryRead(options.Panel) is not { } dimensions) return true;
        int threads = WorkerThreads.Resolve(options.Screen.ThreadCount);
        var estimate = Estimate(dimensions, options.Screen, threads);
        long? available = options.MemoryLimit is null ? AvailableMemory.Bytes() : null;
        long? budget = options.MemoryLimit ?? (available is { } a ? (long)(a * AvailableShare) : null);
        string against = options.MemoryLimit is { } limit ? $"limit {ByteSize.Format(limit)} (--memory-limit)"
            : available is { } free ? $"{ByteSize.Format(free)} available" : "available memory unknown";
        if (budget is not { } allowed || estimate.TotalBytes <= allowed)
        {
            if (!options.Quiet) console.Error.WriteLine($"memory: about {ByteSize.Format(estimate.TotalBytes)} estimated, {against}");
            return true;
        }
        foreach (var line in Refusal(dimensions, options.Screen, threads, estimate, allowed, options.MemoryLimit is not null, available))
            console.Error.WriteLine(line);
        return false;
    }

    /// <summary>The peak estimate for a sized file; the reader's buffers depend on the format and layout.</summary>
    internal static MemoryEstimate Estimate(PanelDimensions dimensions, ScreenOptions screen, int threads) =>
        MemoryEstimate.ForScreen(dimensions.SampleCount, dimensions.FeatureCount, screen, threads,
            loaderMatrixCopies: dimensions.LoaderMatrixCopies);

    /// <summary>The refusal: the estimate against the budget, its largest terms, and each option that would lower it, by how much.</summary>
    internal static List<string> Refusal(PanelDimensions dimensions, ScreenOptions screen, int threads, MemoryEstimate estimate,
        long budget, bool limitGiven, long? available)
    {
        string against = limitGiven ? $"the limit of {ByteSize.Format(budget)} (--memory-limit)"
            : Invariant($"{AvailableShare * 100:0}% of the {ByteSize.Format(available ?? budget)} available");
        var lines = new List<string>
        {
            $"error: this screen would need about {ByteSize.Format(estimate.TotalBytes)} of memory, more than {against}; stopped before reading the panel.",
            Invariant($"  Estimated for {dimensions.SampleCount} samples x {dimensions.FeatureCount} features on {threads} threads; the largest parts:"),
        };
        var largest = estimate.Largest(ShownTerms);
        foreach (var term in largest) lines.Add($"    {Describe(term.Component),-34} {ByteSize.Format(term.Bytes)}");
        if (MemoryEstimate.RuntimeBaselineBytes > budget)
            lines.Add($"  The program itself needs about {ByteSize.Format(MemoryEstimate.RuntimeBaselineBytes)}, so no setting brings a screen under this budget.");
        lines.Add("  Each of these alone would lower the estimate:");
        foreach (var (option, bytes) in Savings(dimensions, screen, threads, estimate))
        {
            string enough = estimate.TotalBytes - bytes <= budget ? " (enough on its own)" : "";
            lines.Add($"    {option,-34} saves about {ByteSize.Format(bytes)}{enough}");
        }
        int fitting = LargestFittingFeatureCount(dimensions, screen, threads, budget);
        lines.Add(fitting > 0
            ? Invariant($"    fewer features: a panel prefiltered to at most {fitting} features would fit (e.g. drop features missing in most samples, or keep the most variable).")
            : "    fewer features alone would not fit: even a one-feature panel of this many samples exceeds the budget.");
        long repeatMatrices = estimate.Bytes(MemoryComponent.RepeatImportances);
        if (repeatMatrices > 0)
            lines.Add($"    --part I/N (split into parts): each part keeps only its share of the {ByteSize.Format(repeatMatrices)} of repeat matrices; each forest still needs its own memory.");
        lines.Add(limitGiven
            ? "  Or allow more with a larger --memory-limit; the estimate is approximate."
            : "  If more memory is free than the system reports, allow it with --memory-limit SIZE (e.g. 8G); the estimate is approximate.");
        return lines;
    }

    /// <summary>What changing one option alone would save, by re-estimating with it; largest saving first.</summary>
    private static List<(string Option, long Bytes)> Savings(PanelDimensions dimensions, ScreenOptions screen, int threads,
        MemoryEstimate estimate)
    {
        var candidates = new List<(string, ScreenOptions, int)>();
        if (ScreenSettings.DecoyCountFor(screen, dimensions.FeatureCount) > 0)
            candidates.Add(("--decoys 0", screen with { DecoyCount = 0 }, threads));
        if (threads > 1) candidates.Add(("--threads 1", screen, 1));
        int fewerTrees = Math.Max(10, screen.TreesPerForest / 2);
        if (fewerTrees < screen.TreesPerForest)
            candidates.Add((Invariant($"--trees {fewerTrees}"), screen with { TreesPerForest = fewerTrees }, threads));
        int fewerPairs = Math.Max(1, screen.HalfSamplePairs / 2);
        if (fewerPairs < screen.HalfSamplePairs)
            candidates.Add((Invariant($"--pairs {fewerPairs}"), screen with { HalfSamplePairs = fewerPairs }, threads));
        if (screen.CurveFolds > 0) candidates.Add(("--curve-folds 0 (no panel-size curve)", screen with { CurveFolds = 0 }, threads));
        if (screen.OutcomePermutations > 0)
            candidates.Add(("--outcome-permutations 0", screen with { OutcomePermutations = 0 }, threads));
        var savings = new List<(string Option, long Bytes)>();
        foreach (var (option, changed, changedThreads) in candidates)
        {
            long saving = estimate.TotalBytes - Estimate(dimensions, changed, changedThreads).TotalBytes;
            if (saving >= SmallestSaving) savings.Add((option, saving));
        }
        savings.Sort((a, b) => b.Bytes.CompareTo(a.Bytes));
        return savings;
    }

    /// <summary>The most features whose estimate fits the budget (0 if none); the estimate grows with the feature count, so bisection finds it.</summary>
    internal static int LargestFittingFeatureCount(PanelDimensions dimensions, ScreenOptions screen, int threads, long budget)
    {
        int low = 0, high = dimensions.FeatureCount;
        // Invariant: low features fit (or low is 0); more than high do not, or high is the panel's own count.
        while (low < high)
        {
            int middle = low + (high - low + 1) / 2;
            if (Estimate(dimensions with { FeatureCount = middle }, screen, threads).TotalBytes <= budget) low = middle;
            else high = middle - 1;
        }
        return low;
    }

    private static string Describe(MemoryComponent component) => component switch
    {
        MemoryComponent.RuntimeBaseline => "program and runtime",
        MemoryComponent.RawMatrix => "panel as loaded",
        MemoryComponent.LoaderTransient => "reader's buffers while loading",
        MemoryComponent.BinnedCodes => "binned codes",
        MemoryComponent.FeatureTables => "per-feature result tables",
        MemoryComponent.ReferenceForest => "forest on all samples",
        MemoryComponent.RepeatForests => "a repeat's two forests",
        MemoryComponent.PermutedCopyAndDecoyColumns => "permuted-copy and decoy columns",
        MemoryComponent.TreesInFlight => "trees being grown (per thread)",
        MemoryComponent.RepeatImportances => "repeat matrices",
        MemoryComponent.PanelSizeCurve => "panel-size curve",
        MemoryComponent.CollectorHeadroom => "garbage not yet collected",
        _ => component.ToString(),
    };

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
