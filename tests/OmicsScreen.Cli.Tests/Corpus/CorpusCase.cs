namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// One hostile or broken input: the matrix bytes (made at test time, so large cases are not
/// committed), an optional sample sheet, the exit code the command must end with and the
/// fragments its message must contain (file, place, and the fix). <see cref="SampleSheetBytes"/>,
/// when given, replaces the UTF-8 text of <see cref="SampleSheet"/> for sheets in other encodings;
/// <see cref="FeatureSheet"/>, when given, is written beside them and passed with --feature-sheet.
/// </summary>
public sealed record CorpusCase(
    string Name,
    string MatrixFileName,
    Func<string, byte[]> MakeMatrix,
    string? SampleSheet,
    int ExitCode,
    string[] Fragments,
    string[]? ExtraArguments = null,
    byte[]? SampleSheetBytes = null,
    string? FeatureSheet = null,
    byte[]? FeatureSheetBytes = null)
{
    public override string ToString() => Name;
}
