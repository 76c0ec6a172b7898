namespace OmicsScreen.Data.Assembly;

/// <summary>Checks sample ids and feature names, which end up as table keys and report labels.</summary>
internal static class NameRules
{
    /// <summary>Rejects an empty name and any control character, line breaks included.</summary>
    public static void Check(string name, string kind, string filePath, long? line, string? column, bool isTableRow = false)
    {
        if (name.Length == 0)
            throw PanelInputException.At(filePath, line, column, $"the {kind} is empty.",
                $"Give every {kind} a non-empty value, or remove the row.", isTableRow: isTableRow);
        foreach (char c in name)
        {
            if (char.IsControl(c))
                throw PanelInputException.At(filePath, line, column,
                    $"the {kind} '{Display.Name(name)}' contains a line break or control character.",
                    $"Rename it using printable characters only (a quoted field may hide a line break).",
                    isTableRow: isTableRow);
        }
    }

    /// <summary>Throws when a name occurs twice, listing the repeated names.</summary>
    public static void CheckUnique(IReadOnlyList<string> names, string kind, string filePath, string fix)
    {
        var seen = new HashSet<string>(names.Count, StringComparer.Ordinal);
        var repeated = new List<string>();
        var reported = new HashSet<string>(StringComparer.Ordinal);
        foreach (var name in names)
            if (!seen.Add(name) && reported.Add(name)) repeated.Add(name);
        if (repeated.Count > 0)
            throw PanelInputException.At(filePath, null, null,
                $"{repeated.Count} {kind}{(repeated.Count == 1 ? " occurs" : "s occur")} more than once: {Display.List(repeated)}.",
                fix);
    }
}
