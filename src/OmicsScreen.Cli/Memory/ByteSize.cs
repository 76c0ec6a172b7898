using System.CommandLine.Parsing;
using System.Globalization;

namespace OmicsScreen.Cli.Memory;

/// <summary>
/// Memory sizes as people type and read them: plain bytes, or a number with K, M, G or T
/// (powers of 1024, as memory is counted; an optional trailing B or iB), e.g. 512M, 8G, 2.5G.
/// </summary>
internal static class ByteSize
{
    private const string Units = "KMGT";

    /// <summary>The bytes a size stands for, or null when the text is not a positive size.</summary>
    public static long? TryParse(string? text)
    {
        if (string.IsNullOrWhiteSpace(text)) return null;
        var span = text.AsSpan().Trim();
        if (span.EndsWith("iB", StringComparison.OrdinalIgnoreCase)) span = span[..^2];
        else if (span.Length > 1 && span[^1] is 'B' or 'b') span = span[..^1];
        double scale = 1;
        if (span.Length > 0 && char.IsAsciiLetter(span[^1]))
        {
            int unit = Units.IndexOf(char.ToUpperInvariant(span[^1]));
            if (unit < 0) return null;
            scale = Math.Pow(1024, unit + 1);
            span = span[..^1].TrimEnd();
        }
        // Digits and at most one decimal point only: no sign, exponent, thousands separator or culture's comma.
        if (span.IsEmpty || span.ContainsAnyExcept("0123456789.") || span.Count('.') > 1 || span is ".") return null;
        if (!double.TryParse(span, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out double number)) return null;
        double bytes = Math.Round(number * scale);
        if (!(bytes >= 1) || bytes >= long.MaxValue) return null;
        return (long)bytes;
    }

    /// <summary>Parses an option's value; an invalid size is a usage error that names the option.</summary>
    public static long? ParseOption(ArgumentResult result)
    {
        string text = result.Tokens.Count > 0 ? result.Tokens[0].Value : "";
        if (TryParse(text) is { } bytes) return bytes;
        string option = result.Parent is OptionResult parent ? parent.Option.Name : "the size";
        result.AddError($"{option}: '{text}' is not a memory size; give bytes, or a number with K, M, G or T (e.g. 512M, 8G, 2.5G).");
        return null;
    }

    /// <summary>A size for people: "850 MB", "1.2 GB" (powers of 1024, as memory is counted).</summary>
    public static string Format(long bytes)
    {
        const double Kilo = 1024, Mega = Kilo * 1024, Giga = Mega * 1024, Tera = Giga * 1024;
        double value = bytes;
        return value switch
        {
            >= Tera => Number(value / Tera) + " TB",
            >= Giga => Number(value / Giga) + " GB",
            >= Mega => Number(value / Mega) + " MB",
            >= Kilo => Number(value / Kilo) + " KB",
            _ => bytes.ToString(CultureInfo.InvariantCulture) + " bytes",
        };
    }

    /// <summary>Two significant digits below 10, whole numbers above: enough for an estimate.</summary>
    private static string Number(double value) =>
        value.ToString(value < 10 ? "0.#" : "0", CultureInfo.InvariantCulture);
}
