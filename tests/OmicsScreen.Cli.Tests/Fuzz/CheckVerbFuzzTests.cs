using System.Text;
using OmicsScreen.Data.Tests.Fuzz;

namespace OmicsScreen.Cli.Tests.Fuzz;

/// <summary>
/// The text cases of the loader fuzz corpus (common practice: fuzzing) through the <c>check</c>
/// verb in-process: every damaged panel ends with success, an input error or "cannot be
/// screened", never an internal error or a stack trace, and within a time bound.
/// </summary>
public sealed class CheckVerbFuzzTests : IDisposable
{
    private const int CaseCount = 150;
    // Work bound on the case thread's processor time, hang bound on wall time (see the loader fuzz harness's FuzzCaseRunner).
    private static readonly TimeSpan TimeBound = TimeSpan.FromSeconds(10);
    private static readonly TimeSpan HangBound = TimeSpan.FromSeconds(120);
    private static readonly int[] AllowedExitCodes = [ExitCode.Success, ExitCode.InputError, ExitCode.NotScreenable];

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Check_of_every_damaged_text_panel_ends_with_a_documented_exit_code_and_no_trace()
    {
        ulong masterSeed = FuzzCorpus.MasterSeed;
        var textSeeds = TextSeedPanels.All();
        var failures = new List<string>();
        int caseCount = FuzzCorpus.CaseCount(CaseCount);
        // The first text cases of the corpus: case numbers whose last digit is 3 to 9.
        for (int number = 0, run = 0; run < caseCount; number++)
        {
            if (FuzzCorpus.IsBinary(number)) continue;
            run++;
            var fuzzCase = FuzzCorpus.Case(masterSeed, number, textSeeds, []);
            string? problem = Check(fuzzCase, Path.Combine(_folder.Path, FormattableString.Invariant($"case-{number}")));
            if (problem is not null) failures.Add($"{fuzzCase.Describe()}{Environment.NewLine}  {problem}");
        }
        var report = new StringBuilder(FormattableString.Invariant($"{failures.Count} of {caseCount} damaged panels failed check:"));
        foreach (var failure in failures.Take(20)) report.AppendLine().AppendLine(failure);
        Assert.True(failures.Count == 0, report.ToString());
    }

    /// <summary>Runs check on one case; null when the run ended as allowed, otherwise what went wrong.</summary>
    private static string? Check(FuzzCase fuzzCase, string folder)
    {
        Directory.CreateDirectory(folder);
        string matrix = Path.Combine(folder, fuzzCase.Seed.MatrixFileName);
        File.WriteAllBytes(matrix, fuzzCase.MatrixBytes);
        var arguments = new List<string> { "check", matrix, "--outcome", fuzzCase.Seed.OutcomeColumn };
        if (fuzzCase.SampleSheetBytes is { } sheetBytes)
        {
            string sheet = Path.Combine(folder, fuzzCase.Seed.SampleSheetFileName!);
            File.WriteAllBytes(sheet, sheetBytes);
            arguments.AddRange(["--samples", sheet]);
        }
        if (fuzzCase.Seed.CohortColumn is { } cohort) arguments.AddRange(["--cohort", cohort]);
        if (fuzzCase.Seed.Layout == Data.PanelLayout.FeaturesInRows) arguments.Add("--features-in-rows");

        if (BoundedCall.WithinBounds(() => CliHarness.Run([.. arguments]), TimeBound, HangBound, out var outcome, out var error) is { } slow)
            return "check " + slow;
        if (error is not null) return $"check threw {error.GetType().FullName}: {error.Message}";
        string output = outcome!.Out + outcome.Error;
        if (Array.IndexOf(AllowedExitCodes, outcome.ExitCode) < 0)
            return $"exit code {outcome.ExitCode}: {outcome.Error}";
        if (output.Contains("   at ", StringComparison.Ordinal)) return $"a stack trace was printed: {output}";
        if (output.Contains("internal error", StringComparison.OrdinalIgnoreCase)) return $"an internal error was reported: {output}";
        return null;
    }
}
