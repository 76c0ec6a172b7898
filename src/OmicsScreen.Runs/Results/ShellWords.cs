namespace OmicsScreen.Runs.Results;

/// <summary>A command line as text that can be pasted back into a POSIX shell.</summary>
public static class ShellWords
{
    /// <summary>POSIX single quotes where a word needs them.</summary>
    public static string Quote(string word) =>
        word.Length > 0 && word.All(c => char.IsAsciiLetterOrDigit(c) || "-_./=:,+@".Contains(c))
            ? word
            : "'" + word.Replace("'", "'\\''") + "'";

    public static string Join(IEnumerable<string> words) => string.Join(' ', words.Select(Quote));
}
