using System.CommandLine;
using OmicsScreen.Cli.Console;

namespace OmicsScreen.Cli.Help;

/// <summary>
/// Prints what is wrong with a command line, one line per problem, with the option the user
/// probably meant, and a pointer to the help instead of the whole help text.
/// </summary>
internal static class UsageErrors
{
    public static int Print(ParseResult parse, CliConsole console)
    {
        var command = parse.CommandResult.Command;
        var unknown = new HashSet<string>(StringComparer.Ordinal);
        bool previousWasUnknownOption = false;
        foreach (var token in parse.UnmatchedTokens)
        {
            if (token.StartsWith('-'))
            {
                unknown.Add(token);
                string? suggestion = OptionSuggestion.For(token, command);
                console.Error.WriteLine(suggestion is null
                    ? $"error: unknown option '{TextTable.Printable(token)}' for `{Path(command)}`."
                    : $"error: unknown option '{TextTable.Printable(token)}'; did you mean '{suggestion}'?");
                previousWasUnknownOption = true;
            }
            else
            {
                // The value of an unknown option is not a second problem worth a line of its own.
                if (!previousWasUnknownOption)
                    console.Error.WriteLine(command is RootCommand
                        ? $"error: unknown command '{TextTable.Printable(token)}'{VerbHint(token, command)}"
                        : $"error: unexpected argument '{TextTable.Printable(token)}' for `{Path(command)}`.");
                unknown.Add(token);
                previousWasUnknownOption = false;
            }
        }
        bool argumentsReported = false;
        foreach (var error in parse.Errors)
        {
            if (IsAboutUnmatched(error.Message, unknown)) continue;
            // The parser says "Required argument missing" once per missing argument without naming
            // it; one line naming them all, with the verb's usage, says what to add.
            if (error.Message.StartsWith("Required argument missing", StringComparison.Ordinal))
            {
                if (!argumentsReported) console.Error.WriteLine($"error: {MissingArguments(parse, command)}");
                argumentsReported = true;
                continue;
            }
            if (error.Message.StartsWith("Required command", StringComparison.Ordinal))
            {
                if (unknown.Count == 0)
                    console.Error.WriteLine($"error: name a command: {string.Join(", ", command.Subcommands.Select(c => c.Name))}.");
                continue;
            }
            console.Error.WriteLine($"error: {Reword(error.Message)}");
        }
        console.Error.WriteLine($"Run `{Path(command)} --help` for the options and examples.");
        return ExitCode.Usage;
    }

    /// <summary>"MODEL and PANEL are missing: `omicsscreen apply MODEL PANEL`." (every argument without a value, in order).</summary>
    internal static string MissingArguments(ParseResult parse, Command command)
    {
        var missing = command.Arguments.Where(a => !a.Hidden && parse.GetResult(a) is not { Tokens.Count: > 0 }).Select(a => a.Name).ToList();
        string usage = Path(command) + string.Concat(command.Arguments.Where(a => !a.Hidden).Select(a => " " + a.Name));
        if (missing.Count == 0) return $"an argument is missing: `{usage}`.";
        string names = missing.Count == 1 ? missing[0] : string.Join(", ", missing.Take(missing.Count - 1)) + " and " + missing[^1];
        return $"{names} {(missing.Count == 1 ? "is" : "are")} missing: `{usage}`.";
    }

    private static string VerbHint(string typed, Command root)
    {
        var nearest = root.Subcommands.Select(c => c.Name)
            .OrderBy(name => OptionSuggestion.EditDistance(typed.ToLowerInvariant(), name)).First();
        return OptionSuggestion.EditDistance(typed.ToLowerInvariant(), nearest) <= 2
            ? $"; did you mean '{nearest}'?"
            : $"; the commands are {string.Join(", ", root.Subcommands.Select(c => c.Name))}.";
    }

    private static bool IsAboutUnmatched(string message, HashSet<string> unknown)
    {
        foreach (var token in unknown)
            if (message.Contains($"'{token}'", StringComparison.Ordinal)) return true;
        return false;
    }

    /// <summary>The parser's messages in the tool's voice: they name the option and say what to write.</summary>
    private static string Reword(string message)
    {
        const string required = "Option '";
        if (message.StartsWith(required, StringComparison.Ordinal) && message.EndsWith("' is required.", StringComparison.Ordinal))
        {
            string name = message[required.Length..^"' is required.".Length];
            return $"{name} is required.";
        }
        if (message.StartsWith("Cannot parse argument '", StringComparison.Ordinal))
        {
            // "Cannot parse argument 'x' for option '--trees' as expected type 'System.Int32'."
            var parts = message.Split('\'');
            if (parts.Length >= 6)
                return $"{parts[3]} expects {TypeWord(parts[5])}, not '{parts[1]}'.";
        }
        return message;
    }

    private static string TypeWord(string clrType) => clrType switch
    {
        "System.Int32" or "System.Int64" or "System.Nullable`1[System.Int32]" => "a whole number",
        // A seed is unsigned: "a whole number, not '-1'" would not say what is wrong.
        "System.UInt64" => "a whole number from 0 to 18446744073709551615",
        "System.Double" or "System.Nullable`1[System.Double]" => "a number (with a decimal point, such as 0.6)",
        _ when clrType.Contains("BalanceMode", StringComparison.Ordinal) || clrType.Contains("InteractionScanMode", StringComparison.Ordinal) => "auto, on or off",
        _ => "another kind of value",
    };

    public static string Path(Command command)
    {
        var names = new List<string>();
        for (Command? current = command; current is not null; current = current.Parents.OfType<Command>().FirstOrDefault())
            names.Add(current is RootCommand ? "omicsscreen" : current.Name);
        names.Reverse();
        return string.Join(' ', names);
    }
}
