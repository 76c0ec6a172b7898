using System.Globalization;

namespace OmicsScreen.Runs.Work;

/// <summary>Part <see cref="Index"/> (1-based) of <see cref="Count"/> of a split run.</summary>
public readonly record struct RunPart(int Index, int Count)
{
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Index}/{Count}");
}
