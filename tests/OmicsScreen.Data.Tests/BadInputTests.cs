using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;

namespace OmicsScreen.Data.Tests;

/// <summary>
/// Each kind of bad input stops with a <see cref="PanelInputException"/> whose message names the
/// file, where the problem is, what was found and what to do; a panel that was read but cannot be
/// screened stops with a <see cref="PanelNotScreenableException"/> worded the same way.
/// </summary>
public sealed class BadInputTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private const string GoodHeader = "id,group,a,b\n";

    private static PanelLoadOptions Options(string path) => new() { MatrixPath = path, OutcomeColumn = "group" };

    private static PanelInputException Fails(PanelLoadOptions options, params string[] expectedParts)
    {
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(options).EnsureScreenable());
        foreach (var part in expectedParts) Assert.Contains(part, error.Message);
        return error;
    }

    private static void NotScreenable(PanelLoadOptions options, params string[] expectedParts)
    {
        var loaded = PanelLoader.Load(options);
        var error = Assert.Throws<PanelNotScreenableException>(() => loaded.EnsureScreenable());
        foreach (var part in expectedParts) Assert.Contains(part, error.Message);
        Assert.Equal(options.MatrixPath, error.FilePath);
    }

    [Fact]
    public void Empty_file_is_reported_with_its_name_and_the_fix()
    {
        var path = _folder.File("empty.csv", "");
        var error = Fails(Options(path), "empty.csv", "is empty", "Export the matrix again");
        Assert.Equal(path, error.FilePath);
    }

    [Fact]
    public void Blank_file_is_reported_as_holding_no_rows()
    {
        Fails(Options(_folder.File("blank.csv", "\n\r\n  \n")), "blank.csv", "no text rows", "header row");
    }

    [Fact]
    public void Header_only_file_is_reported()
    {
        Fails(Options(_folder.File("header.csv", GoodHeader)), "header.csv", "header row but no data rows", "Export the matrix again");
    }

    [Fact]
    public void Ragged_row_gives_line_and_expected_and_found_field_counts()
    {
        var error = Fails(Options(_folder.File("ragged.csv", GoodHeader + "s1,x,1,2\ns2,y,3\n")),
            "ragged.csv, line 3", "3 fields but the header has 4", "one field per header column");
        Assert.Equal(3, error.Line);
    }

    [Fact]
    public void Duplicated_sample_id_lists_the_repeated_ids()
    {
        Fails(Options(_folder.File("dup.csv", GoodHeader + "s1,x,1,2\ns2,y,3,4\ns1,y,5,6\n")),
            "dup.csv", "sample id occurs more than once: 's1'", "Make sample ids unique");
    }

    [Fact]
    public void Duplicated_feature_name_lists_the_repeated_names()
    {
        Fails(Options(_folder.File("dupf.csv", "id,group,a,b,a,b,c\ns1,x,1,2,3,4,5\n")),
            "dupf.csv", "2 feature names occur more than once: 'a', 'b'", "Make feature names unique");
    }

    [Fact]
    public void Non_numeric_cell_names_line_feature_and_text_found()
    {
        var error = Fails(Options(_folder.File("text.csv", GoodHeader + "s1,x,1,2\ns2,y,3,high\n")),
            "text.csv, line 3, column 'b'", "found 'high'", "not a number", "--annotation");
        Assert.Equal("b", error.Column);
    }

    [Fact]
    public void Decimal_comma_is_explained()
    {
        Fails(Options(_folder.File("comma.csv", "id;group;a\ns1;x;1,5\ns2;y;2\n")),
            "comma.csv, line 2, column 'a'", "found '1,5'", "decimals with a point");
    }

    [Fact]
    public void Infinity_cell_is_an_error_that_says_so()
    {
        Fails(Options(_folder.File("inf.tsv", "id\tgroup\ta\ns1\tx\t1\ns2\ty\tInfinity\n")),
            "inf.tsv, line 3, column 'a'", "found 'Infinity'", "infinite value", "NA when it is missing");
    }

    [Fact]
    public void Number_beyond_float_range_is_an_infinity_error()
    {
        Fails(Options(_folder.File("big.csv", GoodHeader + "s1,x,1e400,2\ns2,y,3,4\n")),
            "big.csv, line 2, column 'a'", "found '1e400'", "beyond the float32 range");
    }

    [Fact]
    public void Missing_outcome_column_lists_the_columns_available()
    {
        Fails(Options(_folder.File("nooutcome.csv", "id,label,site,a\ns1,x,A,1\n")) with { OutcomeColumn = "Label", AnnotationColumns = ["label", "site"] },
            "nooutcome.csv", "outcome column 'Label' is not in the matrix", "'id', 'label', 'site'", "Did you mean 'label'?");
    }

    [Fact]
    public void Outcome_read_as_a_feature_because_of_its_case_is_explained()
    {
        Fails(Options(_folder.File("coded.csv", "id,Group,a\ns1,0,1\ns2,1,2\n")),
            "coded.csv", "no column 'group' (named by --outcome); did you mean 'Group'?", "use --outcome Group");
    }

    [Fact]
    public void Outcome_name_found_as_a_row_label_suggests_the_other_layout()
    {
        Fails(Options(_folder.File("rows.csv", "feature,s1,s2\ngroup,x,y\na,1,2\n")),
            "rows.csv, line 2", "'group' is a sample attribute name", "--features-in-rows");
    }

    [Fact]
    public void Single_class_cannot_be_screened()
    {
        NotScreenable(Options(_folder.File("one.csv", GoodHeader + "s1,x,1,2\ns2,x,3,4\ns3,x,5,6\n")),
            "one.csv", "single class 'x' (3 samples)", "at least two classes");
    }

    [Fact]
    public void Class_with_one_sample_cannot_be_screened()
    {
        NotScreenable(Options(_folder.File("tiny.csv", GoodHeader + "s1,x,1,2\ns2,x,3,4\ns3,y,5,6\n")),
            "tiny.csv", "class 'y' of 'group' has a single sample", "Merge it into another class or remove");
    }

    [Fact]
    public void All_features_constant_cannot_be_screened()
    {
        NotScreenable(Options(_folder.File("flat.csv", GoodHeader + "s1,x,1,NA\ns2,x,1,NA\ns3,y,1,NA\ns4,y,1,NA\n")),
            "flat.csv", "All 2 features are constant or entirely missing", "Check that this is the right file");
    }

    [Fact]
    public void Class_labels_differing_only_by_case_are_an_error()
    {
        Fails(Options(_folder.File("case.csv", GoodHeader + "s1,Case,1,2\ns2, case ,3,4\ns3,control,5,6\n")),
            "case.csv, column 'group'", "'Case' and 'case' differ only by case", "Spell each class the same way");
    }

    [Fact]
    public void Empty_sample_id_gives_the_line()
    {
        Fails(Options(_folder.File("noid.csv", GoodHeader + "s1,x,1,2\n ,y,3,4\n")),
            "noid.csv, line 3, column 'id'", "sample id is empty", "non-empty value");
    }

    [Fact]
    public void Feature_name_with_a_line_break_is_an_error()
    {
        Fails(Options(_folder.File("break.csv", "id,group,\"IL\n6\",b\ns1,x,1,2\n")),
            "break.csv", "feature name 'IL\\n6' contains a line break", "printable characters");
    }

    [Fact]
    public void Sample_id_with_a_control_character_is_an_error()
    {
        Fails(Options(_folder.File("ctrl.csv", GoodHeader + "s\u00011,x,1,2\n")),
            "ctrl.csv, line 2", "sample id 's\\u00011' contains a line break or control character");
    }

    [Fact]
    public void Sample_sheet_with_no_overlap_shows_ids_from_both_files()
    {
        var matrix = _folder.File("m.csv", "id,a,b\ns1,1,2\ns2,3,4\n");
        var sheet = _folder.File("sheet.csv", "sample,group\nS-1,x\nS-2,y\n");
        Fails(Options(matrix) with { SampleSheetPath = sheet },
            "sheet.csv", "no sample id matches the matrix m.csv", "'S-1', 'S-2'", "'s1', 's2'", "sample id column");
    }

    [Fact]
    public void Unknown_binary_format_is_an_error()
    {
        var path = _folder.File("panel.xlsx");
        File.WriteAllBytes(path, [0x50, 0x4B, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00]);
        Fails(Options(path), "panel.xlsx", "unknown binary format", "saved as CSV");
    }

    [Fact]
    public void Parquet_extension_with_wrong_magic_is_an_error()
    {
        Fails(Options(_folder.File("panel.parquet", GoodHeader + "s1,x,1,2\n")),
            "panel.parquet", "does not start with the Parquet marker PAR1", "Write the file again");
    }

    [Fact]
    public void Truncated_parquet_is_unreadable_with_the_fix()
    {
        var path = _folder.File("cut.parquet");
        ParquetPanelWriter.Write(SyntheticPanels.Mixed(), path, PanelLayout.SamplesInRows);
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(bytes.Length / 2)]);
        Fails(SyntheticPanels.MixedOptions(path, PanelLayout.SamplesInRows),
            "cut.parquet", "starts like Parquet but cannot be read", "truncated or damaged");
    }

    [Fact]
    public void Describing_columns_named_for_a_parquet_matrix_are_refused_with_the_fix()
    {
        // Common practice: an option that cannot apply is refused, not silently ignored.
        var path = _folder.File("features.parquet");
        ParquetPanelWriter.Write(SyntheticPanels.Mixed(), path, PanelLayout.FeaturesInRows);
        Fails(SyntheticPanels.MixedOptions(path, PanelLayout.FeaturesInRows) with { FeatureColumns = ["feature", "symbol"] },
            "features.parquet", "--feature-columns does not apply", "--feature-sheet");
    }

    [Fact]
    public void Truncated_arrow_file_is_unreadable_with_the_fix()
    {
        var path = _folder.File("cut.arrow");
        ArrowPanelWriter.Write(SyntheticPanels.Mixed(), path, PanelLayout.SamplesInRows);
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(bytes.Length / 2)]);
        Fails(SyntheticPanels.MixedOptions(path, PanelLayout.SamplesInRows),
            "cut.arrow", "starts like Arrow IPC (file format) but cannot be read", "truncated or damaged");
    }

    [Fact]
    public void Unknown_positive_class_lists_the_classes()
    {
        Fails(Options(_folder.File("pos.csv", GoodHeader + "s1,x,1,2\ns2,y,3,4\n")) with { PositiveClass = "case" },
            "pos.csv, column 'group'", "positive class 'case' is not one of the classes 'x', 'y'");
    }

    [Fact]
    public void Missing_file_is_reported()
    {
        Fails(Options(_folder.File("absent.csv")), "absent.csv", "does not exist");
    }
}
