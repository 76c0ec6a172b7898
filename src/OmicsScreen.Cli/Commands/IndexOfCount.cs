using System.Globalization;
using OmicsScreen.Runs.Work;

namespace OmicsScreen.Cli.Commands;

/// <summary>Reads "I/N" as typed after an option (--part, --feature-block): 1 &lt;= I &lt;= N, digits only.</summary>
internal static class IndexOfCount
{
    public static (int Index, int Count) Parse(string text, string optionName, string example)
    {
        var pieces = text.Split('/');
        if (pieces.Length == 2
            && int.TryParse(pieces[0], NumberStyles.None, CultureInfo.InvariantCulture, out int index)
            && int.TryParse(pieces[1], NumberStyles.None, CultureInfo.InvariantCulture, out int count)
            && count >= 1 && index >= 1 && index <= count)
            return (index, count);
        throw new CommandInputException($"{optionName} takes I/N with 1 <= I <= N (for example {example}), not '{text}'.");
    }

    /// <summary>Reads "I/N" as typed after --part.</summary>
    public static RunPart ParsePart(string text)
    {
        var (index, count) = Parse(text, "--part", "3/16");
        return new RunPart(index, count);
    }
}
