using System.Text;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Text;

/// <summary>
/// Long tables (one row per sample and feature), as targeted proteomics and laboratory systems
/// export them (common practice), pivoted into the same panel as the wide layouts.
/// </summary>
public class LongTableTests
{
    private static PanelLoadOptions Options(string path) => new() { MatrixPath = path, OutcomeColumn = "status", Layout = PanelLayout.Long };

    [Fact]
    public void Per_row_detection_limits_mark_exactly_the_cells_under_their_limit()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.csv",
            "sample,feature,value,lod,status\n" +
            "s1,A,0.5,1,x\n" +   // under its limit: below detection at 1
            "s1,B,2,1,x\n" +     // above
            "s2,A,1,1,y\n" +     // equal to its limit: measured
            "s2,B,0.9,0.8,y\n" + // above its own (lower) limit
            "s3,A,<LOD,1.2,y\n" + // censored token without a value: takes the row's limit
            "s3,B,0.1,NA,y\n");   // no limit on this row: measured
        var loaded = PanelLoader.Load(Options(path) with { DetectionLimitColumn = "lod" });
        var m = loaded.Panel.Matrix;

        // Each expectation is read off the rows above (common practice: a value under the limit is "< LOD").
        Assert.Equal([CellState.BelowDetection, CellState.Measured, CellState.BelowDetection], m.States(0).ToArray());
        Assert.Equal([1f, 1f, 1.2f], m.Column(0).ToArray());
        Assert.False(m.HasUnmeasuredCells(1));
        Assert.Equal([2f, 0.9f, 0.1f], m.Column(1).ToArray());
        Assert.Equal(1, loaded.Inspection.LongTable!.CellsBelowRowLimit);
        Assert.Equal(6, loaded.Inspection.LongTable.Rows);
    }

    [Fact]
    public void Per_row_detection_limits_mark_every_cell_under_its_limit_and_no_other_in_a_whole_panel()
    {
        // 40 samples x 25 features, values and limits from fixed arithmetic patterns; a third of the rows have no
        // limit, and some values equal their limit exactly (not under it: measured). Expected states are computed
        // cell by cell from the same patterns (common practice: a value under the limit of detection is "< LOD").
        const int samples = 40, features = 25;
        static float ValueOf(int s, int f) => (s * 37 + f * 11) % 50 / 10f;
        static float LimitOf(int s, int f) => (s + f) % 3 == 0 ? float.NaN : (s * 13 + f * 7) % 30 / 10f;
        var text = new StringBuilder("sample,feature,value,lod,status\n");
        for (int f = 0; f < features; f++)
            for (int s = 0; s < samples; s++)
            {
                float limit = LimitOf(s, f);
                text.Append(FormattableString.Invariant($"S{s},F{f},{ValueOf(s, f):R},{(float.IsNaN(limit) ? "" : limit.ToString("R", System.Globalization.CultureInfo.InvariantCulture))},{(s % 2 == 0 ? "a" : "b")}\n"));
            }
        using var folder = new TempFolder();
        string path = folder.File("long.csv", text.ToString());

        var loaded = PanelLoader.Load(Options(path) with { DetectionLimitColumn = "lod" });
        var m = loaded.Panel.Matrix;

        long under = 0, equal = 0;
        for (int f = 0; f < features; f++)
            for (int s = 0; s < samples; s++)
            {
                float value = ValueOf(s, f), limit = LimitOf(s, f);
                bool below = !float.IsNaN(limit) && value < limit;
                under += below ? 1 : 0;
                equal += value == limit ? 1 : 0;
                Assert.Equal(below ? CellState.BelowDetection : CellState.Measured, m.State(f, s));
                Assert.Equal(below ? limit : value, m.Value(f, s));
            }
        // The patterns give both kinds of cell, and ties at the limit, so the check above is not empty.
        Assert.InRange(under, 50, samples * features - 50);
        Assert.True(equal > 0);
        Assert.Equal(under, loaded.Inspection.LongTable!.CellsBelowRowLimit);
    }

    [Fact]
    public void Flags_mark_below_detection_and_failed_quality_cells_and_pairs_without_a_row_are_missing()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.tsv",
            "SampleID\tAssay\tNPX\tBelow\tQC\tgroup\n" +
            "s1\tA\t1.5\tno\tPass\tx\n" +
            "s1\tB\t0.2\tyes\tPass\tx\n" +
            "s2\tA\t3\t0\tWarning\ty\n" +
            "s3\tA\t4\tfalse\tok\ty\n" +
            "s3\tB\t5\tFALSE\tPASS\ty\n");
        var loaded = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = path, OutcomeColumn = "group", Layout = PanelLayout.Long, SampleIdColumn = "SampleID",
            FeatureColumns = ["Assay"], ValueColumn = "NPX", BelowDetectionFlagColumn = "Below", QualityFlagColumn = "QC",
        });
        var m = loaded.Panel.Matrix;

        Assert.Equal(["s1", "s2", "s3"], m.SampleIds);
        Assert.Equal([CellState.Measured, CellState.Missing, CellState.Measured], m.States(0).ToArray());
        // s1/B flagged below detection (no limit column: NaN); s2/B has no row: missing.
        Assert.Equal([CellState.BelowDetection, CellState.Missing, CellState.Measured], m.States(1).ToArray());
        Assert.True(float.IsNaN(m.Value(1, 0)));
        var found = loaded.Inspection.LongTable!;
        Assert.Equal((1, 1, 1), (found.CellsFlaggedBelow, found.CellsFailingQuality, found.CellsWithoutRow));
    }

    [Fact]
    public void A_repeated_sample_and_feature_pair_is_refused_with_both_lines()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.csv", "sample,feature,value,status\ns1,A,1,x\ns1,B,2,x\ns2,A,3,y\ns1,B,2.5,x\n");

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));

        Assert.StartsWith("long.csv, line 5: sample 's1' and feature 'B' occur again (first on line 3)", error.Message);
    }

    [Fact]
    public void A_sample_attribute_that_disagrees_between_rows_is_refused_with_both_lines()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.csv", "sample,feature,value,status\ns1,A,1,x\ns2,A,3,y\ns1,B,2,y\n");

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));

        Assert.StartsWith("long.csv, line 4, column 'status': sample 's1' has 'y' here but 'x' on line 2.", error.Message);
    }

    [Fact]
    public void A_missing_role_column_names_the_option_and_the_default()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.csv", "sample,analyte,value,status\ns1,A,1,x\n");

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(path)));

        Assert.Contains("no column 'feature'", error.Message);
        Assert.Contains("--feature-columns", error.Message);
    }

    [Fact]
    public void Feature_describing_columns_of_a_long_table_travel_with_the_feature()
    {
        using var folder = new TempFolder();
        string path = folder.File("long.csv", "sample,feature,value,status,protein\ns1,A,1,x,Alpha one\ns1,B,2,x,Beta\ns2,A,3,y,Alpha one\ns2,B,4,y,Beta\n");

        var loaded = PanelLoader.Load(Options(path) with { FeatureColumns = ["feature", "protein"], DisplayNameColumn = "protein" });

        Assert.Equal(["Alpha one", "Beta"], loaded.Features.DisplayNames);
    }

    [Fact]
    public void A_long_table_is_sized_by_counting_distinct_ids_once()
    {
        using var folder = new TempFolder();
        var panel = SyntheticPanels.Mixed();
        string path = folder.File("long.csv.gz");
        File.WriteAllBytes(path, GzipFile.Compress(Encoding.UTF8.GetBytes(LayoutWriters.LongText(panel))));
        var options = SyntheticPanels.MixedOptions(path, PanelLayout.Long);

        var sized = OmicsScreen.Data.Sizing.PanelDimensionReader.TryRead(options);

        Assert.Equal((panel.SampleCount, panel.FeatureCount), (sized!.Value.SampleCount, sized.Value.FeatureCount));
    }
}
