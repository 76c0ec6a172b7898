using OmicsScreen.Data;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Cli.Commands;

/// <summary>Everything `grow` was asked to do, validated in one place.</summary>
public sealed record GrowRunOptions
{
    public required PanelLoadOptions Panel { get; init; }
    public int TreeCount { get; init; } = 500;
    public int FeaturesPerSplit { get; init; }
    public int MinLeafSize { get; init; } = 1;
    public int? MaxDepth { get; init; }
    public double? SampleFraction { get; init; }
    public bool Balanced { get; init; }
    public ulong Seed { get; init; } = 1;
    public int ThreadCount { get; init; }
    public string? ImportanceFile { get; init; }
    public bool Json { get; init; }

    public void Validate()
    {
        if (TreeCount < 1) throw new CommandInputException("--trees: the value must be at least 1.");
        if (FeaturesPerSplit < 0) throw new CommandInputException("--features-per-split: the value must be at least 1 (leave it out for the square root of the feature count).");
        if (MinLeafSize < 1) throw new CommandInputException("--min-leaf: the value must be at least 1.");
        if (MaxDepth is < 0) throw new CommandInputException("--max-depth: the value cannot be negative.");
        if (SampleFraction is { } f && !(f > 0 && f <= 1)) throw new CommandInputException("--sample-fraction: the value must be above 0 and at most 1 (for example 0.632).");
        if (ThreadCount < 0) throw new CommandInputException("--threads: the value must be at least 1 (leave it out to use all cores).");
    }

    /// <summary>The engine's options; samples of one subject are drawn together when the panel names subjects.</summary>
    public ForestOptions ToForestOptions(Panel panel) => new()
    {
        TreeCount = TreeCount,
        Seed = Seed,
        ThreadCount = ThreadCount,
        Tree = new TreeOptions
        {
            FeaturesPerSplit = FeaturesPerSplit > 0 ? FeaturesPerSplit : null,
            MinLeafSize = MinLeafSize,
            MaxDepth = MaxDepth ?? int.MaxValue,
        },
        Sampling = new SamplingOptions
        {
            Drawing = SampleFraction is null ? SampleDrawing.Bootstrap : SampleDrawing.Subsample,
            SubsampleFraction = SampleFraction ?? SamplingOptions.Default.SubsampleFraction,
            ClassBalanced = Balanced,
            Groups = panel.Subject,
        },
    };
}
