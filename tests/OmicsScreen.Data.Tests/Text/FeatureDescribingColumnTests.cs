using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>
/// Features-in-rows files with describing columns before the samples (an id, a symbol, a
/// description), as expression and protein matrices are commonly written (common practice).
/// </summary>
public class FeatureDescribingColumnTests
{
    private const string SamplesInRows = "id,status,F1,F2,F3\ns1,x,1,4,<0.5\ns2,y,2,5,NA\ns3,y,3,6,9\n";

    private const string WithDescriptors =
        "gene_id\tsymbol\tdescription\ts1\ts2\ts3\n" +
        "status\t\t\tx\ty\ty\n" +
        "F1\tGENE0\tfirst \"made-up\" gene\t1\t2\t3\n" +
        "F2\tGENE1\t\t4\t5\t6\n" +
        "F3\tGENE2\tthird, with comma\t<0.5\tNA\t9\n";

    private static PanelLoadOptions Options(string path, PanelLayout layout) => new() { MatrixPath = path, OutcomeColumn = "status", Layout = layout };

    [Fact]
    public void Leading_text_columns_are_taken_as_describing_columns_and_the_panel_is_the_same()
    {
        using var folder = new TempFolder();
        var expected = PanelLoader.Load(Options(folder.File("s.csv", SamplesInRows), PanelLayout.SamplesInRows));

        var loaded = PanelLoader.Load(Options(folder.File("f.tsv", WithDescriptors), PanelLayout.FeaturesInRows));

        PanelAssert.Identical(expected.Panel, loaded.Panel);
        // The values below are the describing cells written above, in feature order.
        Assert.Equal(["symbol", "description"], loaded.Features.Annotations.Select(a => a.Name));
        Assert.Equal(["GENE0", "GENE1", "GENE2"], loaded.Features.Annotations[0].Values);
        Assert.Equal(["first \"made-up\" gene", "", "third, with comma"], loaded.Features.Annotations[1].Values);
        Assert.Null(loaded.Features.DisplayNames);
        Assert.Equal("gene_id", loaded.Inspection.FeatureColumns!.IdColumn);
        Assert.True(loaded.Inspection.FeatureColumns.Detected);
        Assert.Equal(["symbol", "description"], loaded.Inspection.FeatureColumns.AnnotationColumns);
    }

    [Fact]
    public void A_describing_column_named_by_the_display_name_option_gives_the_lab_facing_names()
    {
        using var folder = new TempFolder();
        var loaded = PanelLoader.Load(Options(folder.File("f.tsv", WithDescriptors), PanelLayout.FeaturesInRows) with { DisplayNameColumn = "symbol" });

        Assert.Equal(["GENE0", "GENE1", "GENE2"], loaded.Features.DisplayNames);
        Assert.Equal(["description"], loaded.Features.Annotations.Select(a => a.Name));
    }

    [Fact]
    public void A_numeric_describing_column_is_taken_when_named_and_otherwise_the_error_names_the_option()
    {
        using var folder = new TempFolder();
        // An Entrez-like numeric id between the probe and the symbol: only naming the columns tells it from a sample.
        string text = "probe,entrez,symbol,s1,s2,s3\nstatus,,,x,y,y\nP1,7157,GENE0,1,2,3\nP2,7158,GENE1,4,5,6\n";
        string path = folder.File("f.csv", text);

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path, PanelLayout.FeaturesInRows)));
        var loaded = PanelLoader.Load(Options(path, PanelLayout.FeaturesInRows) with { FeatureColumns = ["probe", "entrez", "symbol"] });

        Assert.Contains("--feature-columns", error.Message);
        Assert.Equal(["s1", "s2", "s3"], loaded.Panel.Matrix.SampleIds);
        Assert.Equal(["P1", "P2"], loaded.Panel.Matrix.FeatureNames);
        Assert.Equal(["7157", "7158"], loaded.Features.Annotations[0].Values);
        Assert.False(loaded.Inspection.FeatureColumns!.Detected);
    }

    [Fact]
    public void A_sample_column_with_one_mistyped_cell_stays_a_sample_column()
    {
        using var folder = new TempFolder();
        // Most cells of s1 are numbers, so it is not a describing column: the typo is reported where it is.
        string path = folder.File("f.csv", "feature,s1,s2,s3\nstatus,x,y,y\nF1,1,2,3\nF2,4,5,6\nF3,7x,8,9\n");

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path, PanelLayout.FeaturesInRows)));

        Assert.StartsWith("f.csv, line 5, column 's1': found '7x'", error.Message);
    }

    [Fact]
    public void A_named_describing_column_that_is_not_in_the_file_is_an_error_naming_it()
    {
        using var folder = new TempFolder();
        string path = folder.File("f.tsv", WithDescriptors);

        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(Options(path, PanelLayout.FeaturesInRows) with { FeatureColumns = ["gene_id", "Symbol"] }));

        Assert.Contains("no column 'Symbol' (named by --feature-columns)", error.Message);
    }
}
