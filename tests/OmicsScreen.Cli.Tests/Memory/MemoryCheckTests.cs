using OmicsScreen.Cli.Memory;
using OmicsScreen.Data;
using OmicsScreen.Data.Sizing;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Tests.Memory;

public class MemoryCheckTests
{
    private static readonly PanelDimensions Wide = new(1000, 50_000, MatrixFileFormat.DelimitedText, 1L << 30);

    [Fact]
    public void The_suggested_feature_count_is_the_largest_that_fits()
    {
        var options = new ScreenOptions();
        long budget = 1L << 30;

        int fitting = MemoryCheck.LargestFittingFeatureCount(Wide, options, 2, budget);

        Assert.InRange(fitting, 1, Wide.FeatureCount - 1);
        Assert.True(MemoryCheck.Estimate(Wide with { FeatureCount = fitting }, options, 2).TotalBytes <= budget);
        Assert.True(MemoryCheck.Estimate(Wide with { FeatureCount = fitting + 1 }, options, 2).TotalBytes > budget);
    }

    [Fact]
    public void Each_suggestion_states_the_saving_the_estimate_gives_it()
    {
        var options = new ScreenOptions();
        var estimate = MemoryCheck.Estimate(Wide, options, 2);
        var lines = MemoryCheck.Refusal(Wide, options, 2, estimate, 1L << 30, limitGiven: true, available: null);

        // 50,000 features: automatic decoys stop at 5,000, and --decoys 0 is offered with what it saves.
        Assert.Contains(lines, l => l.Contains("--decoys 0") && l.Contains("saves about"));
        long fewerTrees = estimate.TotalBytes - MemoryCheck.Estimate(Wide, options with { TreesPerForest = 250 }, 2).TotalBytes;
        Assert.Contains(lines, l => l.Contains("--trees 250") && l.Contains("saves about " + ByteSize.Format(fewerTrees)));
        Assert.Contains(lines, l => l.Contains("--part I/N (split into parts)"));
        Assert.StartsWith("error: this screen would need about " + ByteSize.Format(estimate.TotalBytes), lines[0]);
    }

    [Fact]
    public void Decoys_are_offered_when_the_screen_would_make_them()
    {
        var dimensions = new PanelDimensions(1000, 5000, MatrixFileFormat.Parquet, 1L << 28);
        var options = new ScreenOptions();
        var estimate = MemoryCheck.Estimate(dimensions, options, 2);

        var lines = MemoryCheck.Refusal(dimensions, options, 2, estimate, 1L << 20, limitGiven: false, available: 1L << 20);

        Assert.Contains(lines, l => l.Contains("--decoys 0"));
        Assert.Contains("90% of the 1 MB available", lines[0]);
    }
}
