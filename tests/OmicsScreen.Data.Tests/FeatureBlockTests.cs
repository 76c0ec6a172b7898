using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests;

/// <summary>
/// A wide panel can be read a block of features at a time, or narrowed to a list of features,
/// and what is read equals the same columns of the whole panel exactly.
/// </summary>
public class FeatureBlockTests
{
    private const PanelLayout Samples = PanelLayout.SamplesInRows;

    public static TheoryData<string> Formats() => new("csv", "parquet", "arrow");

    private static string Write(Panel panel, TempFolder folder, string format)
    {
        string path = folder.File("panel." + format);
        switch (format)
        {
            case "csv": DelimitedPanelWriter.Write(panel, path, Samples, ','); break;
            case "parquet": ParquetPanelWriter.Write(panel, path, Samples); break;
            default: ArrowPanelWriter.Write(panel, path, Samples); break;
        }
        return path;
    }

    [Theory]
    [MemberData(nameof(Formats))]
    public void The_blocks_of_a_panel_are_its_columns_in_order_with_identical_values(string format)
    {
        using var folder = new TempFolder();
        var expected = SyntheticPanels.Mixed();
        string path = Write(expected, folder, format);
        var whole = PanelLoader.Load(SyntheticPanels.MixedOptions(path, Samples)).Panel;
        int featureCount = whole.FeatureCount;
        for (int blockCount = 1; blockCount <= featureCount; blockCount += 2)
        {
            var names = new List<string>();
            for (int b = 1; b <= blockCount; b++)
            {
                var block = PanelLoader.Load(SyntheticPanels.MixedOptions(path, Samples) with { FeatureBlock = new FeatureBlock(b, blockCount) }).Panel;
                // Nearly equal blocks: sizes differ by at most one (common practice for contiguous splits).
                Assert.InRange(block.FeatureCount, featureCount / blockCount, (featureCount + blockCount - 1) / blockCount);
                int offset = names.Count;
                for (int f = 0; f < block.FeatureCount; f++)
                {
                    Assert.Equal(whole.Matrix.FeatureNames[offset + f], block.Matrix.FeatureNames[f]);
                    Assert.True(whole.Matrix.Column(offset + f).SequenceEqual(block.Matrix.Column(f)));
                    Assert.True(whole.Matrix.States(offset + f).SequenceEqual(block.Matrix.States(f)));
                }
                names.AddRange(block.Matrix.FeatureNames);
                Assert.Equal(whole.Outcome.SampleClasses.ToArray(), block.Outcome.SampleClasses.ToArray());
            }
            Assert.Equal(whole.Matrix.FeatureNames, names);
        }
    }

    [Theory]
    [MemberData(nameof(Formats))]
    public void A_feature_list_keeps_those_columns_in_file_order(string format)
    {
        using var folder = new TempFolder();
        var expected = SyntheticPanels.Mixed();
        string path = Write(expected, folder, format);
        var names = expected.Matrix.FeatureNames;
        var kept = PanelLoader.Load(SyntheticPanels.MixedOptions(path, Samples) with { KeepFeatures = [names[3], names[0], names[3]] }).Panel;
        Assert.Equal(new[] { names[0], names[3] }, kept.Matrix.FeatureNames);
        Assert.True(expected.Matrix.Column(3).SequenceEqual(kept.Matrix.Column(1)));
    }

    [Fact]
    public void A_listed_feature_that_is_not_in_the_file_is_named_in_the_error()
    {
        using var folder = new TempFolder();
        string path = Write(SyntheticPanels.Mixed(), folder, "csv");
        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(SyntheticPanels.MixedOptions(path, Samples) with { KeepFeatures = ["no_such_marker"] }));
        Assert.Contains("no_such_marker", error.Message);
        Assert.Contains("panel.csv", error.Message);
    }

    [Fact]
    public void More_blocks_than_features_and_blocks_of_a_features_in_rows_file_are_refused_with_a_fix()
    {
        using var folder = new TempFolder();
        var panel = SyntheticPanels.Mixed();
        string path = Write(panel, folder, "csv");
        var tooMany = Assert.Throws<PanelInputException>(() => PanelLoader.Load(SyntheticPanels.MixedOptions(path, Samples) with
        {
            FeatureBlock = new FeatureBlock(1, panel.FeatureCount + 1),
        }));
        Assert.Contains("fewer blocks", tooMany.Message);

        string rows = folder.File("rows.csv");
        DelimitedPanelWriter.Write(panel, rows, PanelLayout.FeaturesInRows, ',');
        var inRows = Assert.Throws<PanelInputException>(() => PanelLoader.Load(SyntheticPanels.MixedOptions(rows, PanelLayout.FeaturesInRows) with
        {
            FeatureBlock = new FeatureBlock(1, 2),
        }));
        Assert.Contains("split it by rows", inRows.Message);
    }
}
