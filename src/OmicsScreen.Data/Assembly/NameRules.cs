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
            // U+FFFD is what a UTF-8 decoder puts for bytes that are not UTF-8 (an accent saved as
            // Latin-1 or Windows-1252); U+FEFF inside a file is a byte-order mark left by joining
            // files. Either would make a name that no other file spells the same way.
            if (c == '\uFFFD')
                throw PanelInputException.At(filePath, line, column,
                    $"the {kind} '{Display.Name(name)}' holds bytes that are not valid UTF-8 (the file is probably Latin-1 or Windows-1252).",
                    "Save the file again as UTF-8 (\"CSV UTF-8\" in spreadsheet programs).", isTableRow: isTableRow);
            if (c == '\uFEFF')
                throw PanelInputException.At(filePath, line, column,
                    $"the {kind} '{Display.Name(name)}' holds a byte-order mark (U+FEFF), left by joining files.",
                    "Remove the byte-order mark: save each part as UTF-8 without BOM before joining them.", isTableRow: isTableRow);
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
