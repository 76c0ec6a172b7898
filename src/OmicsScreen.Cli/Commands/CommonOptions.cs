using System.CommandLine;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// The options several verbs share (--threads, --quiet, --out, --force, --seed), declared once so
/// they have one name, value name, type and check everywhere; each verb only says in the
/// description what the option means for it.
/// </summary>
internal static class CommonOptions
{
    public const string QuietDescription = "No progress display.";

    /// <summary>--threads N; left out means every core (read with <see cref="ThreadCount"/>).</summary>
    public static Option<int?> Threads(string description) => new("--threads") { HelpName = "N", Description = description };

    /// <summary>The thread count given, checked (at least 1), or 0 for every core when it was left out.</summary>
    public static int ThreadCount(ParseResult parse, Option<int?> threads) =>
        ScreenOptionChecks.Given(parse.GetValue(threads), "--threads", 1, "leave it out to use all cores");

    public static Option<bool> Quiet() => new("--quiet") { Description = QuietDescription };

    /// <summary>--out DIR, optional (the verb chooses a folder when it is left out).</summary>
    public static Option<string?> Out(string description) => new("--out") { Description = description, HelpName = "DIR" };

    /// <summary>--out DIR that must be given.</summary>
    public static Option<string> RequiredOut(string description) => new("--out") { Description = description, HelpName = "DIR", Required = true };

    /// <summary>--out DIR with a default folder.</summary>
    public static Option<string> Out(string description, string defaultFolder) =>
        new("--out") { Description = description, HelpName = "DIR", DefaultValueFactory = _ => defaultFolder };

    public static Option<bool> Force(string description) => new("--force") { Description = description };

    public static Option<ulong> Seed(string description, ulong defaultSeed) =>
        new("--seed") { Description = description, HelpName = "S", DefaultValueFactory = _ => defaultSeed };
}
