namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>
/// Every kind of broken input ends with one clear message naming the place and a non-zero exit,
/// never a stack trace, and leaves no result file behind.
/// </summary>
public sealed class BadInputTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private const string Sheet = "sample_id,status\ns1,case\ns2,case\ns3,control\ns4,control\n";

    /// <summary>(name, matrix file name, matrix contents, sheet contents or null, expected fragments of the message, expected exit code).</summary>
    public static TheoryData<string, string, string, string?, string[], int> Cases => new()
    {
        { "empty file", "m.csv", "", Sheet, ["m.csv", "empty"], ExitCode.InputError },
        { "header only", "m.csv", "sample_id,f1,f2\n", Sheet, ["m.csv", "no data"], ExitCode.InputError },
        { "ragged row", "m.csv", "sample_id,f1,f2\ns1,1,2\ns2,3\ns3,4,5\ns4,6,7\n", Sheet, ["m.csv", "line 3"], ExitCode.InputError },
        { "duplicated sample id", "m.csv", "sample_id,f1\ns1,1\ns1,2\ns3,3\ns4,4\n", Sheet, ["m.csv", "s1"], ExitCode.InputError },
        { "duplicated feature name", "m.csv", "sample_id,f1,f1\ns1,1,2\ns2,3,4\ns3,5,6\ns4,7,8\n", Sheet, ["m.csv", "f1"], ExitCode.InputError },
        { "non-numeric cell", "m.csv", "sample_id,f1,f2\ns1,1,2\ns2,3,abc\ns3,4,5\ns4,6,7\n", Sheet, ["m.csv", "line 3", "f2", "abc"], ExitCode.InputError },
        { "outcome column missing", "m.csv", "sample_id,f1\ns1,1\ns2,2\ns3,3\ns4,4\n", "sample_id,diagnosis\ns1,a\ns2,a\ns3,b\ns4,b\n", ["status"], ExitCode.InputError },
        { "a single class", "m.csv", "sample_id,f1\ns1,1\ns2,2\ns3,3\ns4,4\n", "sample_id,status\ns1,case\ns2,case\ns3,case\ns4,case\n", ["class"], ExitCode.NotScreenable },
        { "a class with one sample", "m.csv", "sample_id,f1\ns1,1\ns2,2\ns3,3\ns4,4\n", "sample_id,status\ns1,case\ns2,control\ns3,control\ns4,control\n", ["case"], ExitCode.NotScreenable },
        { "sample sheet with no overlap", "m.csv", "sample_id,f1\ns1,1\ns2,2\ns3,3\ns4,4\n", "sample_id,status\nx1,case\nx2,case\nx3,control\nx4,control\n", ["x1", "s1"], ExitCode.InputError },
        { "unknown file format", "m.bin", "\u0001\u0002\u0003\u0000binary\u0000", Sheet, ["m.bin"], ExitCode.InputError },
        { "unreadable Parquet", "m.parquet", "PAR1 this is not really parquet", Sheet, ["m.parquet"], ExitCode.InputError },
        { "all features constant", "m.csv", "sample_id,f1,f2\ns1,1,2\ns2,1,2\ns3,1,2\ns4,1,2\n", Sheet, ["constant"], ExitCode.NotScreenable },
        { "a cell with Infinity", "m.csv", "sample_id,f1,f2\ns1,1,2\ns2,Infinity,3\ns3,4,5\ns4,6,7\n", Sheet, ["m.csv", "line 3", "f1"], ExitCode.InputError },
        { "a feature name with a line break", "m.csv", "sample_id,\"f1\nbroken\",f2\ns1,1,2\ns2,3,4\ns3,5,6\ns4,7,8\n", Sheet, ["m.csv"], ExitCode.InputError },
        { "a missing file", "absent.csv", "", Sheet, ["absent.csv"], ExitCode.InputError },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Grow_refuses_bad_input_with_a_clear_message_and_writes_nothing(string kind, string matrixName, string matrix, string? sheet, string[] fragments, int exitCode)
    {
        string matrixPath = kind == "a missing file" ? Path.Combine(_folder.Path, matrixName) : _folder.File(matrixName, matrix);
        var args = new List<string> { "grow", matrixPath, "--outcome", "status", "--trees", "20" };
        if (sheet is not null) args.AddRange(["--samples", _folder.File("sheet.csv", sheet)]);
        string resultFile = Path.Combine(_folder.Path, "out", "importance.tsv");
        args.AddRange(["--importance-out", resultFile]);

        var run = CliHarness.Run([.. args]);

        Assert.Equal(exitCode, run.ExitCode);
        Assert.StartsWith("error: ", run.Error);
        foreach (var fragment in fragments) Assert.Contains(fragment, run.Error, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("   at ", run.Error);
        Assert.DoesNotContain("Exception", run.Error);
        Assert.False(File.Exists(resultFile), $"{kind}: a result file was written");
        Assert.Empty(Directory.GetFiles(_folder.Path, "*.partial", SearchOption.AllDirectories));
    }

    [Fact]
    public void Check_reports_an_unscreenable_panel_with_its_own_exit_code()
    {
        string matrix = _folder.File("m.csv", "sample_id,f1,f2\ns1,1,2\ns2,1,3\ns3,4,5\ns4,6,7\n");
        string sheet = _folder.File("s.csv", "sample_id,status\ns1,case\ns2,case\ns3,case\ns4,case\n");
        var run = CliHarness.Run("check", matrix, "--samples", sheet, "--outcome", "status");

        Assert.Equal(ExitCode.NotScreenable, run.ExitCode);
        Assert.Contains("ERROR", run.Out);
        Assert.Contains("cannot be screened", run.Out);
    }

    [Fact]
    public void An_unknown_option_is_a_usage_error()
    {
        var run = CliHarness.Run("grow", "x.csv", "--outcome", "status", "--no-such-option");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
    }

    [Fact]
    public void A_bad_option_value_is_a_usage_error_naming_the_option()
    {
        string matrix = _folder.File("m.csv", "sample_id,f1,f2\ns1,1,2\ns2,1,3\ns3,4,5\ns4,6,7\n");
        string sheet = _folder.File("s.csv", Sheet);
        var run = CliHarness.Run("grow", matrix, "--samples", sheet, "--outcome", "status", "--sample-fraction", "1.5");
        Assert.Equal(ExitCode.Usage, run.ExitCode);
        Assert.Contains("--sample-fraction", run.Error);
    }
}
