using OmicsScreen.Data;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>Everything `screen` was asked to do.</summary>
public sealed record ScreenRunOptions
{
    public required PanelLoadOptions Panel { get; init; }
    public required ScreenOptions Screen { get; init; }
    public string? OutputFolder { get; init; }
    public bool Force { get; init; }

    /// <summary>Continue the unfinished run whose checkpoint is in the results folder (or the part folder).</summary>
    public bool Resume { get; init; }

    /// <summary>Run only this part of the work and write it as a part, for merging later; null runs everything.</summary>
    public RunPart? Part { get; init; }
    public bool Quiet { get; init; }

    /// <summary>Print the headline results as JSON on standard output instead of the text summary.</summary>
    public bool Json { get; init; }

    /// <summary>Largest memory the run may plan to use, in bytes; null compares the estimate with 90% of the available memory.</summary>
    public long? MemoryLimit { get; init; }

    /// <summary>Let sample identifiers into the HTML report (chart descriptions and the hover title of each point); off by default, since identifiers can be personal data.</summary>
    public bool ShowSampleIds { get; init; }

    /// <summary>The command line as typed, recorded in the manifest so the run can be repeated.</summary>
    public IReadOnlyList<string> CommandLine { get; init; } = [];

    /// <summary>The results folder: the one given, or reports/ and the panel file's name.</summary>
    public string ResolveOutputFolder() =>
        OutputFolder ?? Path.Combine("reports", SafeFolderName(Path.GetFileNameWithoutExtension(Panel.MatrixPath)));

    /// <summary>A file name is data: keep letters, digits, dot, dash and underscore only, so it can never leave reports/.</summary>
    internal static string SafeFolderName(string name)
    {
        var chars = name.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' ? c : '_').ToArray();
        string safe = new string(chars).Trim('.');
        return safe.Length == 0 ? "screen" : safe;
    }
}
