using OmicsScreen.Cli;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// --covariates on check and screen: refused before any file is read when a column is named
/// twice, left empty, or already has a role; the check summary lists each covariate.
/// </summary>
public class CovariateOptionTests
{
    [Theory]
    [InlineData("status", "--outcome")]
    [InlineData("centre", "--cohort")]
    public void A_column_with_another_role_is_refused_naming_both_options(string column, string option)
    {
        var run = CliHarness.Run("screen", "m.csv", "--outcome", "status", "--cohort", "centre", "--covariates", $"age,{column}");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.StartsWith($"error: the column '{column}' is named both by {option} and by --covariates", run.Error);
    }

    [Fact]
    public void A_column_named_twice_or_an_empty_name_is_refused()
    {
        var twice = CliHarness.Run("check", "m.csv", "--outcome", "status", "--covariates", "age, sex,age");
        Assert.Equal(ExitCode.Usage, twice.ExitCode);
        Assert.Contains("names the column 'age' twice", twice.Error);
        var empty = CliHarness.Run("check", "m.csv", "--outcome", "status", "--covariates", "age,,sex");
        Assert.Equal(ExitCode.Usage, empty.ExitCode);
        Assert.Contains("has an empty column name", empty.Error);
    }

    [Fact]
    public void Grow_does_not_offer_covariates()
    {
        var run = CliHarness.Run("grow", "m.csv", "--outcome", "status", "--covariates", "age");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("--covariates", run.Error);
    }

    [Fact]
    public void Check_lists_each_covariate_with_its_kind()
    {
        using var folder = new TempFolder();
        var matrix = new System.Text.StringBuilder("sample_id,f1,f2\n");
        var sheet = new System.Text.StringBuilder("sample_id\tstatus\tage\tsex\n");
        for (int s = 0; s < 12; s++)
        {
            matrix.Append(System.FormattableString.Invariant($"s{s},{s % 5}.5,{s % 3}\n"));
            sheet.Append(System.FormattableString.Invariant($"s{s}\t{(s % 2 == 0 ? "case" : "control")}\t{40 + s}\t{(s < 4 ? "F" : "M")}\n"));
        }
        var run = CliHarness.Run("check", folder.File("m.csv", matrix.ToString()), "--samples", folder.File("s.tsv", sheet.ToString()),
            "--outcome", "status", "--covariates", "age,sex");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        // Median of 40..51 is (45 + 46) / 2 (common practice).
        Assert.Contains("age: numeric, min 40, median 45.5, max 51", run.Out);
        Assert.Contains("sex: categorical, F 4, M 8", run.Out);
    }
}
