namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// One misuse of the command line or fault around it: <see cref="Arrange"/> sets up the scene and
/// returns the arguments; the run must end with <see cref="ExitCode"/> and a message holding
/// every fragment (the place and the fix). Unless <see cref="MayWrite"/> names what the run may
/// write or replace, nothing that existed before may change, and a refused run creates nothing.
/// </summary>
internal sealed record MisuseCase(
    string Name,
    Func<MisuseScene, string[]> Arrange,
    int ExitCode,
    string[] Fragments,
    Func<MisuseScene, IReadOnlySet<string>>? MayWrite = null,
    Action<MisuseScene, CliHarness.Outcome>? Verify = null)
{
    public override string ToString() => Name;
}
