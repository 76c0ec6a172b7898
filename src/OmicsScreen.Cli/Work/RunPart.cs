using System.Globalization;
using OmicsScreen.Cli.Commands;

namespace OmicsScreen.Cli.Work;

/// <summary>Part <see cref="Index"/> (1-based) of <see cref="Count"/> of a split run.</summary>
public readonly record struct RunPart(int Index, int Count)
{
    /// <summary>Reads "I/N" as typed after --part.</summary>
    public static RunPart Parse(string text)
    {
        var (index, count) = IndexOfCount.Parse(text, "--part", "3/16");
        return new RunPart(index, count);
    }

    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");
}
