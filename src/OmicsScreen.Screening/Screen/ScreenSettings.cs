using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The options of a screen resolved against one panel: every "automatic" choice made concrete,
/// so the manifest records exactly what ran.
/// </summary>
public sealed record ScreenSettings
{
    public required ScreenOptions Options { get; init; }
    public required int FeatureCount { get; init; }

    /// <summary>Features tried at each split of the forests on the panel's own features (reference, each repeat's clean forest, the cohort forest).</summary>
    public required int FeaturesPerSplit { get; init; }

    /// <summary>
    /// Features tried at each split of the forests that carry a permuted copy of every feature and
    /// the decoys (corrected importance): the same rule on their 2p + decoys columns, so an
    /// automatic value is floor(sqrt(2p + decoys)), not the clean forests' floor(sqrt(p)).
    /// </summary>
    public required int CorrectedForestFeaturesPerSplit { get; init; }

    /// <summary>Features tried at each split of the outcome-permutation null's forests (2p columns: copies, no decoys); 0 when none are grown.</summary>
    public required int OutcomePermutationForestFeaturesPerSplit { get; init; }

    public required bool ClassBalanced { get; init; }
    public required int DecoyCount { get; init; }

    /// <summary>Worker threads of every step: the option, or every core for 0, resolved once here.</summary>
    public required int ThreadCount { get; init; }

    /// <summary>Whether the pairwise interaction scan runs (never without decoys, which calibrate it).</summary>
    public required bool InteractionScan { get; init; }
    public int RepeatCount => 2 * Options.HalfSamplePairs;

    public static ScreenSettings Resolve(ScreenOptions options, Panel panel)
    {
        options.Validate();
        int featureCount = panel.FeatureCount;
        // Class balance is a property of class outcomes; measured and time-to-event forests draw plain bootstraps.
        var counts = panel.Kind == OutcomeKind.Classes ? panel.Outcome.ClassCounts : [1];
        int smallest = int.MaxValue, largest = 0;
        foreach (int count in counts)
        {
            smallest = Math.Min(smallest, count);
            largest = Math.Max(largest, count);
        }
        bool balanced = options.Balance switch
        {
            BalanceMode.On => true,
            BalanceMode.Off => false,
            _ => smallest * 3 < largest * 2,
        };
        // Grouped sampling and class balance do not combine in the engine; subjects win, since
        // splitting a subject's replicates would flatter every estimate.
        if (panel.Subject is not null || panel.Kind != OutcomeKind.Classes) balanced = false;
        int decoys = DecoyCountFor(options, featureCount);
        // The engine's own rule (TreeOptions.ResolveFeaturesPerSplit) on each forest kind's width,
        // so what is recorded is what the trees try.
        var tree = new TreeOptions { FeaturesPerSplit = options.FeaturesPerSplit > 0 ? options.FeaturesPerSplit : null };
        return new ScreenSettings
        {
            Options = options,
            FeatureCount = featureCount,
            FeaturesPerSplit = tree.ResolveFeaturesPerSplit(featureCount),
            CorrectedForestFeaturesPerSplit = tree.ResolveFeaturesPerSplit(2 * featureCount + decoys),
            OutcomePermutationForestFeaturesPerSplit = options.OutcomePermutations > 0 ? tree.ResolveFeaturesPerSplit(2 * featureCount) : 0,
            ClassBalanced = balanced,
            DecoyCount = decoys,
            ThreadCount = WorkerThreads.Resolve(options.ThreadCount),
            // The scan counts 2 x 2 tables against classes; it has no counterpart for other kinds yet.
            InteractionScan = panel.Kind == OutcomeKind.Classes && InteractionScanRuns(options, featureCount, decoys),
        };
    }

    /// <summary>The scan runs when asked for or, automatically, when its pair count is within the limit; never without decoys.</summary>
    public static bool InteractionScanRuns(ScreenOptions options, int featureCount, int decoyCount)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (decoyCount == 0) return false;
        return options.InteractionScan switch
        {
            InteractionScanMode.On => true,
            InteractionScanMode.Off => false,
            _ => (long)(featureCount + decoyCount) * featureCount <= options.InteractionScanPairLimit,
        };
    }

    /// <summary>Decoys of the run: the number asked for, or automatically one per feature within the floor and the ceiling.</summary>
    public static int DecoyCountFor(ScreenOptions options, int featureCount)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.DecoyCount >= 0 ? options.DecoyCount
            : Math.Clamp(featureCount, options.AutomaticDecoyFloor, options.AutomaticDecoyCeiling);
    }

    /// <summary>The engine options of every forest of this screen; its random streams (from <see cref="RandomStreams"/>) are set per forest.</summary>
    public ForestOptions ForestOptions(SampleGrouping? subject, ForestStreams streams, int? featuresPerSplit = null) => new()
    {
        TreeCount = Options.TreesPerForest,
        Seed = streams.Seed,
        Repeat = streams.Repeat,
        ThreadCount = ThreadCount,
        Tree = new TreeOptions
        {
            FeaturesPerSplit = featuresPerSplit ?? (Options.FeaturesPerSplit > 0 ? Options.FeaturesPerSplit : null),
            MinLeafSize = Options.MinLeafSize,
        },
        Sampling = new SamplingOptions
        {
            Drawing = SampleDrawing.Bootstrap,
            ClassBalanced = ClassBalanced,
            Groups = subject,
        },
    };
}
