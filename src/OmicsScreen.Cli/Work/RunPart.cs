using System.Globalization;
using OmicsScreen.Cli.Commands;

namespace OmicsScreen.Cli.Work;

/// <summary>Part <see cref="Index"/> (1-based) of <see cref="Count"/> of a split run.</summary>
public readonly record struct RunPart(int Index, int Count)
{
    /// <summary>Reads "I/N" as typed after --part.</summary>
    public static RunPart Parse(string text)
    {
        var pieces = text.Split('/');
        if (pieces.Length == 2
            && int.TryParse(pieces[0], NumberStyles.None, CultureInfo.InvariantCulture, out int index)
            && int.TryParse(pieces[1], NumberStyles.None, CultureInfo.InvariantCulture, out int count)
            && count >= 1 && index >= 1 && index <= count)
            return new RunPart(index, count);
        throw new CommandInputException(
            $"--part takes I/N with 1 <= I <= N (for example 3/16), not '{text}'.", ExitCode.Usage);
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");
}
