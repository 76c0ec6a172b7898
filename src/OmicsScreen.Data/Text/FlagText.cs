namespace OmicsScreen.Data.Text;

/// <summary>
/// Reads a per-row flag of a long table (below detection, or a failed quality check): the
/// words laboratory systems commonly write for yes and no, any case (common practice).
/// </summary>
internal static class FlagText
{
    private static readonly string[] Set = ["1", "true", "yes", "y", "t", "flag", "flagged", "warn", "warning", "fail", "failed", "below", "blq", "lod"];
    private static readonly string[] Clear = ["", "0", "false", "no", "n", "f", "pass", "passed", "ok", "na"];

    /// <summary>The words accepted, for messages.</summary>
    public const string Accepted = "1/true/yes/flag/warn/fail for set; empty/0/false/no/pass/ok/NA for not set";

    /// <summary>True for a set flag, false for a clear one, null for text that is neither.</summary>
    public static bool? Read(ReadOnlySpan<char> text)
    {
        text = text.Trim();
        foreach (var word in Clear) if (text.Equals(word, StringComparison.OrdinalIgnoreCase)) return false;
        foreach (var word in Set) if (text.Equals(word, StringComparison.OrdinalIgnoreCase)) return true;
        return null;
    }
}
