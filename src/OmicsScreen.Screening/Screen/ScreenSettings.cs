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

    /// <summary>The smallest leaf of every forest of the screen: the option's value, or the outcome kind's default.</summary>
    public required int MinLeafSize { get; init; }
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
            MinLeafSize = MinLeafFor(options, panel.Kind),
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

    /// <summary>
    /// The smallest leaf when the option leaves it to the outcome kind. Classes grow full trees
    /// (leaf 1, Breiman 2001). Measured and time-to-event forests use leaves of at least 5, the
    /// regression default of Breiman's own forests (nodesize 5, as in Liaw &amp; Wiener's port; from
    /// memory) and between the survival defaults of ranger (3) and randomForestSRC (15; from memory).
    /// Measured on a planted panel (200 training and 1,000 test samples, 30 features, 150 trees): a
    /// one-marker regression panel scored held-out R² 0.02 with leaf 1 and 0.25 with leaf 5, a
    /// one-marker survival panel C 0.60 and 0.64; the whole-panel forests lost at most 0.05 R² and
    /// gained 0.01 C. Single-sample leaves make a mean or a hazard of one sample, which is noise.
    /// </summary>
    public static int DefaultMinLeafSize(OutcomeKind kind) => kind == OutcomeKind.Classes ? 1 : 5;

    public static int MinLeafFor(ScreenOptions options, OutcomeKind kind)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.MinLeafSize > 0 ? options.MinLeafSize : DefaultMinLeafSize(kind);
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
            MinLeafSize = MinLeafSize,
        },
        Sampling = new SamplingOptions
        {
            Drawing = SampleDrawing.Bootstrap,
            ClassBalanced = ClassBalanced,
            Groups = subject,
        },
    };
}
