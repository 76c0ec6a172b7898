using System.Globalization;
using System.Text;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Assembly;

/// <summary>
/// Reading clinical covariates: numeric or categorical by their values, levels listed, and every
/// refusal (unknown column, missing values, a feature column) naming the file, column and fix.
/// </summary>
public sealed class CovariateLoadTests : IDisposable
{
    private const int SampleCount = 20;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private string Matrix()
    {
        var text = new StringBuilder("sample_id,f1,f2\n");
        for (int s = 0; s < SampleCount; s++) text.Append(CultureInfo.InvariantCulture, $"s{s},{s % 7},{s % 5}\n");
        return _folder.File("m.csv", text.ToString());
    }

    /// <summary>A sheet with status, age, sex and a hostile-named column; sample s is on line s + 2.</summary>
    private string Sheet(Func<int, string>? age = null)
    {
        var text = new StringBuilder("sample_id,status,age,sex,=HYPERLINK(\"x\")\u202e\n");
        for (int s = 0; s < SampleCount; s++)
            text.Append(CultureInfo.InvariantCulture,
                $"s{s},{(s % 2 == 0 ? "case" : "control")},{(age ?? (i => (30 + i).ToString(CultureInfo.InvariantCulture)))(s)},{(s % 3 == 0 ? "F" : "M")},{s % 4}\n");
        return _folder.File("sheet.csv", text.ToString());
    }

    private LoadedPanel Load(string sheet, params string[] covariates) =>
        PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = Matrix(), SampleSheetPath = sheet, OutcomeColumn = "status", CovariateColumns = covariates,
        });

    [Fact]
    public void Numbers_make_a_numeric_covariate_and_text_a_categorical_one_with_its_levels_listed()
    {
        var loaded = Load(Sheet(), "age", "sex");

        var (age, sex) = (loaded.Panel.Covariates[0], loaded.Panel.Covariates[1]);
        Assert.False(age.IsCategorical);
        Assert.Equal(49, age.Values[19]);
        Assert.True(sex.IsCategorical);
        Assert.Equal(["F", "M"], sex.Levels);
        Assert.Equal(0, sex.LevelOf(0));
        Assert.Equal(1, sex.LevelOf(1));
        var summary = loaded.Inspection.Covariates;
        Assert.Equal("numeric", summary[0].Kind);
        // Median of 30..49 is (39 + 40) / 2 (the usual median of an even count; common practice).
        Assert.Equal((30.0, 39.5, 49.0), (summary[0].Minimum, summary[0].Median, summary[0].Maximum));
        Assert.Equal([new LevelCount("F", 7), new LevelCount("M", 13)], summary[1].Levels);
        var note = Assert.Single(loaded.Inspection.Findings, f => f.Code == "categorical-covariate");
        Assert.Contains("'sex' is read as categorical", note.Message);
        Assert.Contains("'F', 'M'", note.Message);
    }

    [Fact]
    public void A_stray_text_cell_makes_the_column_categorical_and_the_note_names_it()
    {
        var loaded = Load(Sheet(s => s == 4 ? "4O" : (30 + s).ToString(CultureInfo.InvariantCulture)), "age");

        Assert.True(loaded.Panel.Covariates[0].IsCategorical);
        var note = Assert.Single(loaded.Inspection.Findings, f => f.Code == "categorical-covariate");
        Assert.Contains("the first is '4O', sample 's4'", note.Message);
        Assert.Single(loaded.Inspection.Findings, f => f.Code == "many-level-covariate");
    }

    [Fact]
    public void Missing_values_are_refused_with_the_column_the_count_and_the_first_line()
    {
        var error = Assert.Throws<PanelInputException>(() => Load(Sheet(s => s is 5 or 9 ? "NA" : "40"), "age"));

        Assert.StartsWith("sheet.csv, line 7, column 'age': the covariate 'age' has no value for 2 of 20 samples (the first is sample 's5', 'NA').", error.Message);
        Assert.Contains("leave the column out of --covariates", error.Message);
    }

    [Fact]
    public void An_unknown_column_is_refused_listing_the_columns_that_exist()
    {
        var error = Assert.Throws<PanelInputException>(() => Load(Sheet(), "Age"));

        Assert.Contains("the covariate column 'Age' is not in the sample sheet sheet.csv", error.Message);
        Assert.Contains("'status', 'age', 'sex'", error.Message);
        Assert.Contains("Did you mean 'age'?", error.Message);
    }

    [Fact]
    public void A_feature_column_is_refused_as_a_covariate()
    {
        var error = Assert.Throws<PanelInputException>(() => Load(Sheet(), "f2"));

        Assert.StartsWith("m.csv, column 'f2': the covariate 'f2' is a feature column of the matrix", error.Message);
    }

    [Fact]
    public void A_hostile_column_name_is_data_and_printed_escaped()
    {
        var loaded = Load(Sheet(), "=HYPERLINK(\"x\")\u202e");

        // Its values 0..3 are numbers, so it is numeric; the name is kept exactly.
        var covariate = Assert.Single(loaded.Panel.Covariates);
        Assert.Equal("=HYPERLINK(\"x\")\u202e", covariate.Name);
        Assert.False(covariate.IsCategorical);
        var error = Assert.Throws<PanelInputException>(() => Load(Sheet(), "bad\u001b[31m"));
        Assert.Contains("'bad\\u001b[31m'", error.Message);
        Assert.DoesNotContain("\u001b", error.Message);
    }

    [Fact]
    public void Covariates_follow_the_samples_a_panel_keeps()
    {
        var panel = Load(Sheet(), "age", "sex").Panel;

        var picked = panel.SelectSamples([19, 3]);
        Assert.Equal([49.0, 33.0], picked.Covariates[0].Values.ToArray());
        Assert.Equal(["M", "F"], new[] { picked.Covariates[1].Levels[picked.Covariates[1].LevelOf(0)], picked.Covariates[1].Levels[picked.Covariates[1].LevelOf(1)] });
        Assert.Equal(2, panel.SelectFeatures([1]).Covariates.Count);
    }
}
