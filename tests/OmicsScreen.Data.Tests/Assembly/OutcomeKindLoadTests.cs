using System.Globalization;
using System.Text;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Assembly;

/// <summary>
/// Reading the outcome as classes, a measured quantity or a time to an event: detection, forcing,
/// event codes, and every input error naming its file, line and column.
/// </summary>
public sealed class OutcomeKindLoadTests : IDisposable
{
    private const int SampleCount = 30;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>A samples-in-rows matrix s0..s29 with two features.</summary>
    private string Matrix()
    {
        var text = new StringBuilder("sample_id,f1,f2\n");
        for (int s = 0; s < SampleCount; s++) text.Append(CultureInfo.InvariantCulture, $"s{s},{s % 7},{s % 5}\n");
        return _folder.File("m.csv", text.ToString());
    }

    /// <summary>A sample sheet with the given columns; sample s is on line s + 2.</summary>
    private string Sheet(string header, Func<int, string> row)
    {
        var text = new StringBuilder("sample_id," + header + "\n");
        for (int s = 0; s < SampleCount; s++) text.Append(CultureInfo.InvariantCulture, $"s{s},{row(s)}\n");
        return _folder.File("sheet.csv", text.ToString());
    }

    private LoadedPanel Load(string sheet, Func<PanelLoadOptions, PanelLoadOptions> adjust) =>
        PanelLoader.Load(adjust(new PanelLoadOptions { MatrixPath = Matrix(), SampleSheetPath = sheet }));

    private static string Egfr(int s) => (40 + s * 1.5).ToString(CultureInfo.InvariantCulture);

    [Fact]
    public void Numbers_with_many_distinct_values_are_read_as_a_measured_outcome_and_said_so()
    {
        var loaded = Load(Sheet("egfr", Egfr), o => o with { OutcomeColumn = "egfr" });

        Assert.Equal(OutcomeKind.Measured, loaded.Panel.Kind);
        Assert.Equal(40 + 29 * 1.5, loaded.Panel.Measured!.Values[29]);
        Assert.Equal(OutcomeKind.Measured, loaded.Inspection.OutcomeKind);
        Assert.Empty(loaded.Inspection.Classes);
        var note = Assert.Single(loaded.Inspection.Findings, f => f.Code == "outcome-measured");
        Assert.Contains("30 different numbers", note.Message);
        Assert.Contains("--outcome-kind classes", note.Message);
        Assert.True(loaded.Inspection.CanScreen);
    }

    [Fact]
    public void Few_numeric_codes_stay_classes()
    {
        // Stages 1-4: numbers, but few distinct values, each shared by many samples.
        var loaded = Load(Sheet("stage", s => (1 + s % 4).ToString(CultureInfo.InvariantCulture)), o => o with { OutcomeColumn = "stage" });

        Assert.Equal(OutcomeKind.Classes, loaded.Panel.Kind);
        Assert.Equal(["1", "2", "3", "4"], loaded.Panel.Outcome.ClassNames);
    }

    [Fact]
    public void Forcing_classes_on_a_measurement_reads_classes_and_refuses_them_in_one_finding()
    {
        var loaded = Load(Sheet("egfr", Egfr), o => o with { OutcomeColumn = "egfr", OutcomeKind = OutcomeKindChoice.Classes });

        Assert.Equal(OutcomeKind.Classes, loaded.Panel.Kind);
        Assert.Equal(30, loaded.Panel.Outcome.ClassCount);
        var error = Assert.Single(loaded.Inspection.Findings, f => f.Severity == FindingSeverity.Error);
        Assert.Equal("outcome-not-classes", error.Code);
        Assert.Contains("--outcome-kind classes", error.Message);
    }

    [Fact]
    public void Forcing_measured_on_labels_names_the_first_label_by_file_line_and_column()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            Load(Sheet("status", s => s % 2 == 0 ? "case" : "control"), o => o with { OutcomeColumn = "status", OutcomeKind = OutcomeKindChoice.Measured }));

        Assert.StartsWith("sheet.csv, line 2, column 'status': sample 's0' has the outcome 'case', which is not a number", error.Message);
        Assert.Contains("--outcome-kind classes", error.Message);
    }

    [Fact]
    public void A_typing_slip_in_a_measured_outcome_is_named_by_line_rather_than_turning_it_into_classes()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            Load(Sheet("egfr", s => s == 7 ? "5O.5" : Egfr(s)), o => o with { OutcomeColumn = "egfr" }));

        Assert.StartsWith("sheet.csv, line 9, column 'egfr': sample 's7' has the outcome '5O.5', which is not a number", error.Message);
    }

    [Fact]
    public void A_missing_measured_outcome_stops_the_load_at_its_line()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            Load(Sheet("egfr", s => s == 12 ? "NA" : Egfr(s)), o => o with { OutcomeColumn = "egfr" }));

        Assert.Equal(14, error.Line);
        Assert.Equal("egfr", error.Column);
        Assert.Contains("sample 's12' has no outcome value ('NA')", error.Message);
    }

    private static PanelLoadOptions FollowUp(PanelLoadOptions o) => o with { FollowUpColumn = "months", EventColumn = "relapse" };

    [Fact]
    public void Follow_up_and_event_columns_make_a_time_to_event_outcome_with_every_event_code()
    {
        string[] codes = ["1", "0", "TRUE", "false", "Yes", "no"];
        var loaded = Load(Sheet("months,relapse", s => $"{s + 1}.5,{codes[s % 6]}"), FollowUp);

        Assert.Equal(OutcomeKind.TimeToEvent, loaded.Panel.Kind);
        var outcome = loaded.Panel.FollowUp!;
        Assert.Equal(15, outcome.EventCount);
        Assert.Equal([true, false, true, false, true, false], outcome.Events[..6].ToArray());
        Assert.Equal(1.5, outcome.Times[0]);
        Assert.Equal("months", loaded.Inspection.OutcomeColumn);
        Assert.Equal("relapse", loaded.Inspection.EventColumn);
        Assert.Null(loaded.Inspection.PositiveClass);
        // 15 events: above the refusal threshold of 10, below the warning threshold of 50 (common practice).
        Assert.Contains(loaded.Inspection.Findings, f => f.Code == "few-events" && f.Severity == FindingSeverity.Warning);
        Assert.True(loaded.Inspection.CanScreen);
        // The follow-up columns are sample attributes, not extra columns.
        Assert.False(loaded.Panel.ExtraColumns.ContainsKey("months"));
    }

    [Fact]
    public void Fewer_than_ten_events_is_an_error_with_the_count()
    {
        var loaded = Load(Sheet("months,relapse", s => $"{s + 1},{(s < 9 ? 1 : 0)}"), FollowUp);

        var error = Assert.Single(loaded.Inspection.Findings, f => f.Severity == FindingSeverity.Error);
        Assert.Equal("too-few-events", error.Code);
        Assert.Contains("records 9 events among 30 samples", error.Message);
        Assert.False(loaded.Inspection.CanScreen);
    }

    [Fact]
    public void An_unknown_event_code_lists_the_codes_found()
    {
        var error = Assert.Throws<PanelInputException>(() =>
            Load(Sheet("months,relapse", s => $"{s + 1},{(s == 4 ? "2" : s == 5 ? "dead" : (s % 2).ToString(CultureInfo.InvariantCulture))}"), FollowUp));

        Assert.StartsWith("sheet.csv, line 6, column 'relapse': sample 's4' has the event code '2'; the column holds the codes '0', '1', '2', 'dead'", error.Message);
        Assert.Contains("1 (the event was observed) or 0 (censored", error.Message);
    }

    [Theory]
    [InlineData("-3", "has a negative follow-up time (-3)")]
    [InlineData("12 mo", "has the follow-up time '12 mo', which is not a number")]
    [InlineData("", "has no follow-up time ('')")]
    public void A_bad_follow_up_time_is_named_by_file_line_and_column(string bad, string problem)
    {
        var error = Assert.Throws<PanelInputException>(() =>
            Load(Sheet("months,relapse", s => $"{(s == 20 ? bad : (s + 1).ToString(CultureInfo.InvariantCulture))},{s % 2}"), FollowUp));

        Assert.StartsWith($"sheet.csv, line 22, column 'months': sample 's20' {problem}", error.Message);
    }

    [Fact]
    public void Zero_follow_up_times_are_kept_with_a_warning()
    {
        var loaded = Load(Sheet("months,relapse", s => $"{(s < 2 ? 0 : s)},{s % 2}"), FollowUp);

        Assert.Equal(0, loaded.Panel.FollowUp!.Times[0]);
        var warning = Assert.Single(loaded.Inspection.Findings, f => f.Code == "zero-follow-up");
        Assert.Equal(FindingSeverity.Warning, warning.Severity);
        Assert.Contains("2 samples have a follow-up time of 0", warning.Message);
    }

    [Fact]
    public void Follow_up_columns_can_be_annotation_columns_of_the_matrix()
    {
        var text = new StringBuilder("sample_id,months,relapse,f1,f2\n");
        for (int s = 0; s < SampleCount; s++) text.Append(CultureInfo.InvariantCulture, $"s{s},{s + 1},{(s % 3 == 0 ? "yes" : "no")},{s % 7},{s % 5}\n");
        var loaded = PanelLoader.Load(FollowUp(new PanelLoadOptions { MatrixPath = _folder.File("annotated.csv", text.ToString()) }));

        Assert.Equal(["f1", "f2"], loaded.Panel.Matrix.FeatureNames);
        Assert.Equal(10, loaded.Panel.FollowUp!.EventCount);
    }

    [Fact]
    public void A_screenable_time_to_event_panel_passes_the_screenability_gate()
    {
        // Every verb takes every outcome kind; only Error findings (here none: 10 events, 20 samples) stop a panel.
        var loaded = Load(Sheet("months,relapse", s => $"{s + 1},{s % 2}"), FollowUp);

        Assert.Same(loaded, loaded.EnsureScreenable());
        Assert.Equal(OutcomeKind.TimeToEvent, loaded.Panel.Kind);
    }
}
