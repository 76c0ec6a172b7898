using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Covariates;
using OmicsScreen.Screening.Statistics;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>added_value.tsv and the report's headline say the same numbers, and the headline's verdict follows the interval.</summary>
public class AddedValueOutputTests
{
    private static AddedValue Value(double lower, double upper, string covariate = "age") =>
        new("auc", [covariate, "sex", "bmi"], 0.70, 0.74, 0.78, 0.08, new ConfidenceInterval(lower, upper, 0.95), 0.004, "delong",
            200, 5, 1, 0, 4.2);

    [Fact]
    public void The_table_has_one_row_per_model_and_the_gain_on_the_combined_row()
    {
        var writer = new StringWriter();
        AddedValueTables.Write(writer, Value(0.03, 0.13));
        var lines = writer.ToString().TrimEnd('\n').Split('\n');
        Assert.Equal("model\tcovariates\tauc\tgain_over_covariates\tgain_low95\tgain_high95\tgain_p\tinterval_method\tsamples\touter_folds\tfolds_without_panel", lines[0]);
        Assert.StartsWith("covariates\tage,sex,bmi\t0.7000\tNA", lines[1]);
        Assert.StartsWith("panel\tage,sex,bmi\t0.7400\tNA", lines[2]);
        Assert.StartsWith("covariates+panel\tage,sex,bmi\t0.7800\t0.0800\t0.0300\t0.1300\t", lines[3]);
    }

    [Fact]
    public void The_headline_names_the_gain_its_interval_and_the_covariates()
    {
        string above = AddedValueReportSection.Headline(Value(0.03, 0.13));
        Assert.StartsWith("The panel adds 0.080 AUC (95% CI +0.030 to +0.130, p = 0.004) over age, sex and bmi", above);
        Assert.Contains("lies above zero", above);
        Assert.Contains("includes zero", AddedValueReportSection.Headline(Value(-0.01, 0.17)));
    }

    [Fact]
    public void A_covariate_name_that_looks_like_a_formula_is_neutralised_in_the_table()
    {
        var writer = new StringWriter();
        AddedValueTables.Write(writer, Value(0.03, 0.13, "=cmd()"));
        Assert.DoesNotContain("\t=cmd()", writer.ToString());
    }
}
