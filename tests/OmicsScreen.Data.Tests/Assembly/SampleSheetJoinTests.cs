using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Tests.Support;

namespace OmicsScreen.Data.Tests.Assembly;

public sealed class SampleSheetJoinTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private PanelLoadOptions Options(string matrix, string sheet) =>
        new() { MatrixPath = _folder.File("m.csv", matrix), SampleSheetPath = _folder.File("sheet.tsv", sheet), OutcomeColumn = "group" };

    [Fact]
    public void Sheet_rows_in_another_order_are_matched_by_id_and_matrix_order_is_kept()
    {
        var loaded = PanelLoader.Load(Options(
            "id,a\ns1,1\ns2,2\ns3,3\n",
            "id\tgroup\tcentre\tage\ns3\tcontrol\tOslo\t61\ns1\tcase\tLeeds\t54\ns2\tcontrol\tLeeds\t47\n") with { CohortColumn = "centre" });
        var panel = loaded.Panel;

        Assert.Equal(["s1", "s2", "s3"], panel.Matrix.SampleIds);
        Assert.Equal(["case", "control"], panel.Outcome.ClassNames);
        Assert.Equal([0, 1, 1], panel.Outcome.SampleClasses.ToArray());
        Assert.Equal(["Leeds", "Oslo"], panel.Cohort!.LevelNames);
        Assert.Equal([0, 0, 1], panel.Cohort.SampleLevels.ToArray());
        Assert.Equal(["54", "47", "61"], panel.ExtraColumns["age"]);
        Assert.Equal(2, loaded.Inputs.Count);
        Assert.Equal("comma", loaded.Inspection.Delimiter);
    }

    [Fact]
    public void Unmatched_samples_stop_the_load_and_are_listed_from_both_files()
    {
        var options = Options(
            "id,a\ns1,1\ns2,2\ns3,3\nextra1,4\nextra2,5\nextra3,6\nextra4,7\nextra5,8\nextra6,9\n",
            "id\tgroup\ns1\tx\ns2\ty\ns3\tx\nghost\ty\n");
        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(options));

        Assert.Contains("sheet.tsv", error.Message);
        Assert.Contains("6 in m.csv but not in sheet.tsv ('extra1', 'extra2', 'extra3', 'extra4', 'extra5' and 1 more)", error.Message);
        Assert.Contains("1 in sheet.tsv but not in m.csv ('ghost')", error.Message);
        Assert.Contains("--drop-unmatched", error.Message);
    }

    [Fact]
    public void Drop_option_removes_unmatched_samples_with_a_warning()
    {
        var options = Options(
            "id,a,b\ns1,1,10\nlost,2,20\ns3,3,30\ns4,4,40\n",
            "id\tgroup\ns4\ty\ns1\tx\ns3\tx\nghost\ty\n") with { DropUnmatchedSamples = true };
        var loaded = PanelLoader.Load(options);

        Assert.Equal(["s1", "s3", "s4"], loaded.Panel.Matrix.SampleIds);
        Assert.Equal([1f, 3f, 4f], loaded.Panel.Matrix.Column(0).ToArray());
        Assert.Equal([40f], loaded.Panel.Matrix.Column(1)[2..].ToArray());
        Assert.Equal([0, 0, 1], loaded.Panel.Outcome.SampleClasses.ToArray());
        Assert.Equal(["lost", "ghost"], loaded.Inspection.DroppedSamples);
        var warning = Assert.Single(loaded.Inspection.Findings, f => f.Code == "unmatched-samples-dropped");
        Assert.Equal(FindingSeverity.Warning, warning.Severity);
        Assert.Contains("'lost'", warning.Message);
        Assert.Contains("'ghost'", warning.Message);
    }

    [Fact]
    public void Outcome_labels_are_trimmed_and_classes_sorted_ordinally()
    {
        var loaded = PanelLoader.Load(Options(
            "id,a\ns1,1\ns2,2\ns3,3\ns4,4\n",
            "id\tgroup\ns1\t  control\ns2\tCase \ns3\tcase2\ns4\tCase\n"));
        // Ordinal order puts upper case first: "Case" < "case2" < "control".
        Assert.Equal(["Case", "case2", "control"], loaded.Panel.Outcome.ClassNames);
        Assert.Equal([2, 0, 1, 0], loaded.Panel.Outcome.SampleClasses.ToArray());
    }

    // Issue 13, finding 11: the sheet's column used to win silently over a disagreeing matrix column.
    [Fact]
    public void A_matrix_column_disagreeing_with_the_sheet_column_of_the_same_name_is_refused()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(Options("id,group,a\ns1,old,1\ns2,old,2\n", "id\tgroup\ns1\tx\ns2\ty\n")));
        Assert.Contains("sheet.tsv, line 2", error.Message);
        Assert.Contains("both in the sample sheet and in the matrix", error.Message);
    }

    [Fact]
    public void A_matrix_column_agreeing_with_the_sheet_column_of_the_same_name_loads()
    {
        var loaded = PanelLoader.Load(Options("id,group,a\ns1,x,1\ns2,y,2\n", "id\tgroup\ns1\tx\ns2\ty\n"));
        Assert.Equal(["x", "y"], loaded.Panel.Outcome.ClassNames);
    }

    [Fact]
    public void Duplicated_id_in_the_sheet_is_an_error_with_its_line()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(Options("id,a\ns1,1\ns2,2\n", "id\tgroup\ns1\tx\ns2\ty\ns1\ty\n")));
        Assert.Contains("sheet.tsv, line 4", error.Message);
        Assert.Contains("'s1' occurs more than once", error.Message);
    }

    [Fact]
    public void Missing_outcome_value_names_the_sample_and_line()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(Options("id,a\ns1,1\ns2,2\n", "id\tgroup\ns1\tx\ns2\t \n")));
        Assert.Contains("sheet.tsv, line 3, column 'group'", error.Message);
        Assert.Contains("sample 's2' has no outcome value", error.Message);
    }

    [Theory]
    [InlineData("NA")]
    [InlineData("n/a")]
    [InlineData("null")]
    public void Missing_value_token_as_outcome_is_not_a_class(string token)
    {
        var error = Assert.Throws<PanelInputException>(() =>
            PanelLoader.Load(Options("id,a\ns1,1\ns2,2\ns3,3\n", $"id\tgroup\ns1\tx\ns2\ty\ns3\t{token}\n")));
        Assert.Contains("sheet.tsv, line 4, column 'group'", error.Message);
        Assert.Contains($"sample 's3' has no outcome value ('{token}')", error.Message);
    }
}
