using System.Text.Json;

namespace OmicsScreen.Cli.Console;

/// <summary>
/// Snake case, with a count named for what it counts (SampleCount becomes samples, ByteCount
/// bytes), the way the manifest names them, so one concept has one key in every JSON the tool writes.
/// </summary>
internal sealed class CountsAsPluralsNamingPolicy : JsonNamingPolicy
{
    public override string ConvertName(string name)
    {
        string snake = SnakeCaseLower.ConvertName(name);
        return name.EndsWith("Count", StringComparison.Ordinal) && name.Length > "Count".Length
            ? snake[..^"_count".Length] + "s"
            : snake;
    }
}
