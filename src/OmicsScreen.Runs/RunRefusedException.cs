namespace OmicsScreen.Runs;

/// <summary>
/// A run refused before it could do harm: the message names the file, folder or option and the
/// fix. Raised by the application layer, which knows no exit codes; the command line maps
/// <see cref="Refusal"/> to one.
/// </summary>
public sealed class RunRefusedException : Exception
{
    public RunRefusedException(string message, RunRefusal refusal = RunRefusal.Usage) : base(message) => Refusal = refusal;

    public RunRefusal Refusal { get; }
}
