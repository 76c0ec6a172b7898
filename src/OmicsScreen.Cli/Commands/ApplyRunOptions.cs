using OmicsScreen.Runs.Apply;

namespace OmicsScreen.Cli.Commands;

/// <summary>Everything `omicsscreen apply` was asked to do: the job's request and how to print its result.</summary>
public sealed record ApplyRunOptions
{
    public required ApplyRequest Request { get; init; }

    /// <summary>Print the headline results as JSON on standard output instead of the text summary.</summary>
    public bool Json { get; init; }
}
