namespace OmicsScreen.Runs;

/// <summary>What a refused run was refused for; the command line maps each to its exit code.</summary>
public enum RunRefusal
{
    /// <summary>What was asked for cannot be done as asked (a missing value, a wrong combination).</summary>
    Usage,
    /// <summary>An input (a panel, a part, a checkpoint, a locked panel) is not what the run needs.</summary>
    Input,
    /// <summary>A result cannot go where it was asked to go (a folder not ours, a pipe, an input in the way).</summary>
    Output,
}
