using OmicsScreen.Data;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>Everything `grow` was asked to do, validated in one place.</summary>
public sealed record GrowRunOptions
{
    public required PanelLoadOptions Panel { get; init; }
    public int TreeCount { get; init; } = 500;
    public int FeaturesPerSplit { get; init; }
    /// <summary>Fewest samples a leaf may hold; 0 means the outcome kind's default (1 for classes, 5 otherwise; as in `screen`).</summary>
    public int MinLeafSize { get; init; }
    public int? MaxDepth { get; init; }
    public double? SampleFraction { get; init; }
    /// <summary>Class-balanced drawing, spelt as for `screen`; off by default for a single forest.</summary>
    public BalanceMode Balance { get; init; } = BalanceMode.Off;
    public ulong Seed { get; init; } = 1;
    public int ThreadCount { get; init; }
    public string? ImportanceFile { get; init; }
    public bool Json { get; init; }

    public void Validate()
    {
        if (TreeCount < 1) throw new CommandInputException("--trees: the value must be at least 1.");
        if (FeaturesPerSplit < 0) throw new CommandInputException("--features-per-split: the value must be at least 1 (leave it out for the square root of the feature count).");
        if (MinLeafSize < 0) throw new CommandInputException("--min-leaf: the value must be at least 1.");
        if (MaxDepth is < 1)
            throw new CommandInputException(FormattableString.Invariant(
                $"--max-depth {MaxDepth}: the root is level 0, so every tree would be a single leaf. Use 1 or more, or leave it out for no limit."));
        if (SampleFraction is { } f && !(f > 0 && f <= 1)) throw new CommandInputException("--sample-fraction: the value must be above 0 and at most 1 (for example 0.632).");
        if (ThreadCount < 0) throw new CommandInputException("--threads: the value must be at least 1 (leave it out to use all cores).");
    }

    /// <summary>
    /// Auto balances when the smallest class is under 2/3 of the largest: the rule `screen`
    /// applies (ScreenSettings.Resolve), so the option means the same in both commands.
    /// </summary>
    internal static bool IsBalanced(BalanceMode mode, ClassOutcome outcome)
    {
        if (mode != BalanceMode.Auto) return mode == BalanceMode.On;
        int smallest = int.MaxValue, largest = 0;
        foreach (int count in outcome.ClassCounts)
        {
            smallest = Math.Min(smallest, count);
            largest = Math.Max(largest, count);
        }
        return smallest * 3 < largest * 2;
    }

    /// <summary>The smallest leaf for this panel's outcome kind: the given one, or the kind's default.</summary>
    public int MinLeafFor(Panel panel) => MinLeafSize > 0 ? MinLeafSize : ScreenSettings.DefaultMinLeafSize(panel.Kind);

    /// <summary>
    /// The engine's options; samples of one subject are drawn together when the panel names
    /// subjects. Class balance applies to classes only; other kinds draw a plain bootstrap.
    /// </summary>
    public ForestOptions ToForestOptions(Panel panel) => new()
    {
        TreeCount = TreeCount,
        Seed = Seed,
        ThreadCount = ThreadCount,
        Tree = new TreeOptions
        {
            FeaturesPerSplit = FeaturesPerSplit > 0 ? FeaturesPerSplit : null,
            MinLeafSize = MinLeafFor(panel),
            MaxDepth = MaxDepth ?? int.MaxValue,
        },
        Sampling = new SamplingOptions
        {
            Drawing = SampleFraction is null ? SampleDrawing.Bootstrap : SampleDrawing.Subsample,
            SubsampleFraction = SampleFraction ?? SamplingOptions.Default.SubsampleFraction,
            ClassBalanced = panel.Kind == OutcomeKind.Classes && IsBalanced(Balance, panel.Outcome),
            Groups = panel.Subject,
        },
    };
}
