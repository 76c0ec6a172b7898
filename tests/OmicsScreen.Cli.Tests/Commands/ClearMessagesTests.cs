namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// Issue 14: every message names the file or the option to change and the fix in the user's
/// terms, and the wrong diagnoses it lists are right. Each case runs through the command line.
/// </summary>
public sealed class ClearMessagesTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private const string Matrix = "sample_id,f1,f2\ns1,1,2\ns2,3,4\ns3,5,6\ns4,7,8\ns5,9,10\ns6,11,13\n";

    private const string Sheet = "sample_id,status\ns1,case\ns2,case\ns3,case\ns4,control\ns5,control\ns6,control\n";

    private static string[] Lines(string text) => text.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);

    [Fact]
    public void A_mistyped_option_prints_the_suggestion_in_one_line_without_the_help()
    {
        var run = CliHarness.Run("screen", "m.csv", "--outcome", "status", "--tress", "10");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        var lines = Lines(run.Error);
        Assert.Equal("error: unknown option '--tress'; did you mean '--trees'?", lines[0]);
        Assert.Equal(2, lines.Length);
        Assert.Contains("omicsscreen screen --help", lines[1]);
        Assert.DoesNotContain("Usage:", run.Out + run.Error);
        Assert.DoesNotContain("Options:", run.Out + run.Error);
    }

    [Fact]
    public void A_shortened_option_suggests_the_option_it_begins()
    {
        var run = CliHarness.Run("screen", "m.csv", "--outcome", "status", "--min-freq", "0.7");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("did you mean '--min-frequency'?", run.Error);
    }

    [Fact]
    public void A_mistyped_command_suggests_the_command()
    {
        var run = CliHarness.Run("scren", "m.csv");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("did you mean 'screen'?", run.Error);
    }

    [Fact]
    public void A_value_of_the_wrong_kind_names_the_option()
    {
        var run = CliHarness.Run("screen", "m.csv", "--outcome", "status", "--trees", "many");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("error: --trees expects a whole number, not 'many'.", run.Error);
    }

    [Theory]
    [InlineData("--min-frequency", "0.4", "above 0.5")]
    [InlineData("--trees", "5", "at least 10")]
    [InlineData("--max-q", "0", "above 0")]
    [InlineData("--redundancy-rho", "1.5", "at most 1")]
    [InlineData("--curve-folds", "1", "or 0 to skip")]
    public void An_out_of_range_value_names_its_option_and_what_it_accepts(string option, string value, string rule)
    {
        string matrix = _folder.File("m.csv", Matrix);
        string sheet = _folder.File("s.csv", Sheet);
        var run = CliHarness.Run("screen", matrix, "--samples", sheet, "--outcome", "status", "--out", Path.Combine(_folder.Path, "out"),
            "--quiet", option, value);
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.StartsWith($"error: {option} {value}: ", run.Error);
        Assert.Contains(rule, run.Error);
    }

    [Fact]
    public void An_outcome_spelt_with_another_case_is_named_with_the_column_meant()
    {
        string matrix = _folder.File("m.csv", "sample_id,diagnosis,f1\ns1,malignant,1\ns2,benign,2\ns3,malignant,3\ns4,benign,4\n");
        var run = CliHarness.Run("check", matrix, "--outcome", "Diagnosis");
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("no column 'Diagnosis' (named by --outcome); did you mean 'diagnosis'?", run.Error);
        Assert.Contains("--outcome diagnosis", run.Error);
        Assert.DoesNotContain("not a number", run.Error);
    }

    [Fact]
    public void An_outcome_missing_from_a_matrix_with_a_text_column_suggests_that_column()
    {
        string matrix = _folder.File("m.csv", "sample_id,diagnosis,f1\ns1,malignant,1\ns2,benign,2\ns3,malignant,3\ns4,benign,4\n");
        var run = CliHarness.Run("check", matrix, "--outcome", "status");
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("no column 'status' named by --outcome", run.Error);
        Assert.Contains("use --outcome diagnosis", run.Error);
    }

    [Fact]
    public void A_numeric_outcome_is_read_as_measured_and_grow_says_so_in_one_line()
    {
        var rows = new System.Text.StringBuilder("sample_id,age,f1,f2\n");
        for (int s = 0; s < 60; s++) rows.Append(System.FormattableString.Invariant($"s{s},{40 + s * 0.5},{s % 7},{s % 5}\n"));
        string matrix = _folder.File("m.csv", rows.ToString());
        var run = CliHarness.Run("grow", matrix, "--outcome", "age", "--trees", "100");
        // Many distinct numbers are a measured quantity, not 60 one-sample classes: one line says which forest was grown.
        Assert.True(run.ExitCode == ExitCode.Success, run.Error);
        var kindLines = Lines(run.Out).Where(l => l.StartsWith("Outcome: ", StringComparison.Ordinal)).ToList();
        Assert.Single(kindLines);
        Assert.Contains("'age', a measured quantity", kindLines[0]);
        Assert.DoesNotContain("single sample", run.Error);
        Assert.DoesNotContain("single sample", run.Out);
    }

    [Fact]
    public void A_comment_line_above_the_header_is_not_taken_for_the_header()
    {
        string matrix = _folder.File("m.csv", "# exported 2026-01-02; instrument 7\n" + Matrix);
        string sheet = _folder.File("s.csv", "# study sheet, version 2\n" + Sheet);
        var run = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "status", "--json");
        Assert.Equal(ExitCode.Success, run.ExitCode);
        Assert.Contains("\"features\": 2", run.Out);
    }

    [Fact]
    public void Unmatched_samples_name_the_option_that_drops_them()
    {
        string matrix = _folder.File("m.csv", Matrix + "s7,1,1\n");
        string sheet = _folder.File("s.csv", Sheet);
        var run = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "status");
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("--drop-unmatched", run.Error);
        Assert.DoesNotContain("DropUnmatchedSamples", run.Error);
    }

    [Fact]
    public void Ids_that_never_match_name_the_id_option()
    {
        string matrix = _folder.File("m.csv", Matrix);
        string sheet = _folder.File("s.csv", Sheet.Replace("\ns", "\nx"));
        var run = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "status");
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("--id-column", run.Error);
        Assert.DoesNotContain("set the sample id column", run.Error);
    }

    [Fact]
    public void A_missing_sheet_column_lists_each_column_once()
    {
        string matrix = _folder.File("m.csv", Matrix);
        string sheet = _folder.File("s.csv", Sheet);
        var run = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "Status");
        Assert.Equal(ExitCode.InputError, run.ExitCode);
        Assert.Contains("Did you mean 'status'?", run.Error);
        int first = run.Error.IndexOf("'sample_id'", StringComparison.Ordinal);
        Assert.True(first >= 0);
        Assert.Equal(-1, run.Error.IndexOf("'sample_id'", first + 1, StringComparison.Ordinal));
    }

    [Fact]
    public void Every_error_line_starts_the_same_way()
    {
        string matrix = _folder.File("m.csv", Matrix);
        foreach (var args in new[]
                 {
                     new[] { "check", matrix, "--outcome", "nothing" },
                     ["screen", matrix, "--outcome", "status", "--trees", "1"],
                     ["grow", matrix, "--outcome", "status", "--min-leaf", "0"],
                     ["screen", matrix, "--tres", "3"],
                 })
        {
            var run = CliHarness.Run(args);
            Assert.NotEqual(ExitCode.Success, run.ExitCode);
            Assert.StartsWith("error: ", run.Error);
            Assert.DoesNotContain("Error:", run.Error);
        }
    }
}
