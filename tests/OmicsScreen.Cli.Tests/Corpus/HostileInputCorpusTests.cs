namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// Runs every case of the hostile-input corpus through <c>check</c>, and a selection through
/// <c>screen --out</c>: a clear message naming the place and the fix, the documented exit code,
/// never a stack trace, and no result folder or half-written file left behind.
/// </summary>
public sealed class HostileInputCorpusTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    public static TheoryData<string> CaseNames()
    {
        var names = new TheoryData<string>();
        foreach (var corpusCase in HostileInputCorpus.Cases()) names.Add(corpusCase.Name);
        return names;
    }

    /// <summary>Cases whose input is refused; a screen of them must leave nothing behind.</summary>
    public static TheoryData<string> RefusedCaseNames()
    {
        var names = new TheoryData<string>();
        foreach (var corpusCase in HostileInputCorpus.Cases())
            if (corpusCase.ExitCode == ExitCode.InputError && !corpusCase.Name.StartsWith("100,000", StringComparison.Ordinal))
                names.Add(corpusCase.Name);
        return names;
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Check_ends_with_the_documented_exit_code_and_a_message_naming_the_place_and_the_fix(string name)
    {
        var corpusCase = Find(name);
        var run = CliHarness.Run([.. Arguments("check", corpusCase)]);

        Assert.Equal(corpusCase.ExitCode, run.ExitCode);
        string message = corpusCase.ExitCode == ExitCode.InputError ? run.Error : run.Out + run.Error;
        if (corpusCase.ExitCode == ExitCode.InputError) Assert.StartsWith("error: ", run.Error);
        foreach (var fragment in corpusCase.Fragments) Assert.Contains(fragment, message, StringComparison.OrdinalIgnoreCase);
        AssertNoTrace(run);
    }

    [Theory]
    [MemberData(nameof(RefusedCaseNames))]
    public void Screen_refuses_the_input_and_leaves_no_results_folder_or_partial_file(string name)
    {
        var corpusCase = Find(name);
        string outFolder = Path.Combine(_folder.Path, "results");
        var run = CliHarness.Run([.. Arguments("screen", corpusCase), "--out", outFolder, "--pairs", "2", "--trees", "10", "--quiet"]);

        Assert.Equal(ExitCode.InputError, run.ExitCode);
        foreach (var fragment in corpusCase.Fragments) Assert.Contains(fragment, run.Error, StringComparison.OrdinalIgnoreCase);
        AssertNoTrace(run);
        Assert.False(Directory.Exists(outFolder), $"{name}: the results folder was left behind");
        Assert.Empty(Directory.GetFiles(_folder.Path, "*.partial", SearchOption.AllDirectories));
    }

    private static CorpusCase Find(string name)
    {
        foreach (var corpusCase in HostileInputCorpus.Cases())
            if (corpusCase.Name == name) return corpusCase;
        throw new ArgumentException($"no corpus case named '{name}'", nameof(name));
    }

    private List<string> Arguments(string verb, CorpusCase corpusCase)
    {
        string matrixPath = Path.Combine(_folder.Path, corpusCase.MatrixFileName);
        if (corpusCase.Name == "a path that is a directory") Directory.CreateDirectory(matrixPath);
        else if (corpusCase.Name != "a path that does not exist") File.WriteAllBytes(matrixPath, corpusCase.MakeMatrix(_folder.Path));

        var arguments = new List<string> { verb, matrixPath, "--outcome", "status" };
        if (corpusCase.SampleSheetBytes is not null) arguments.AddRange(["--samples", _folder.File("s.csv", corpusCase.SampleSheetBytes)]);
        else if (corpusCase.SampleSheet is not null) arguments.AddRange(["--samples", _folder.File("s.csv", corpusCase.SampleSheet)]);
        if (corpusCase.FeatureSheetBytes is not null) arguments.AddRange(["--feature-sheet", _folder.File("f.csv", corpusCase.FeatureSheetBytes)]);
        else if (corpusCase.FeatureSheet is not null) arguments.AddRange(["--feature-sheet", _folder.File("f.csv", corpusCase.FeatureSheet)]);
        if (corpusCase.ExtraArguments is not null) arguments.AddRange(corpusCase.ExtraArguments);
        return arguments;
    }

    private static void AssertNoTrace(CliHarness.Outcome run)
    {
        Assert.DoesNotContain("   at ", run.Error);
        Assert.DoesNotContain("Exception", run.Error);
        Assert.DoesNotContain("   at ", run.Out);
    }
}
