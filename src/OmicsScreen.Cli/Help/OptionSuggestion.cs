using System.CommandLine;

namespace OmicsScreen.Cli.Help;

/// <summary>
/// The option a user most likely meant by an unknown one: a unique option the typed text begins
/// (`--min-freq` for `--min-frequency`), else the nearest spelling within a few edits (`--tress`).
/// </summary>
internal static class OptionSuggestion
{
    public static string? For(string typed, Command command)
    {
        var names = VisibleNames(command).ToList();
        var prefixed = names.Where(name => name.StartsWith(typed, StringComparison.OrdinalIgnoreCase)).ToList();
        if (prefixed.Count == 1) return prefixed[0];
        // Edits allowed grow with length, so a short typo is not matched to an unrelated short option.
        int allowed = Math.Max(1, (typed.Length - 2) / 4);
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var name in names)
        {
            int distance = EditDistance(typed.ToLowerInvariant(), name);
            if (distance < bestDistance)
            {
                bestDistance = distance;
                best = name;
            }
        }
        return bestDistance <= allowed ? best : null;
    }

    /// <summary>Names and aliases of the options a user can type after this command, hidden ones left out.</summary>
    public static IEnumerable<string> VisibleNames(Command command)
    {
        for (Command? current = command; current is not null; current = current.Parents.OfType<Command>().FirstOrDefault())
            foreach (var option in current.Options)
            {
                if (option.Hidden || (current != command && !option.Recursive)) continue;
                yield return option.Name;
                foreach (var alias in option.Aliases) if (alias.StartsWith("--", StringComparison.Ordinal)) yield return alias;
            }
    }

    /// <summary>Optimal string alignment distance: insertions, deletions, substitutions and swaps of neighbours.</summary>
    internal static int EditDistance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (int j = 0; j <= b.Length; j++) d[0, j] = j;
        for (int i = 1; i <= a.Length; i++)
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                int value = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1]) value = Math.Min(value, d[i - 2, j - 2] + 1);
                d[i, j] = value;
            }
        return d[a.Length, b.Length];
    }
}
