namespace OmicsScreen.Cli;

/// <summary>The process exit codes, one meaning each, documented in the README.</summary>
public static class ExitCode
{
    public const int Success = 0;
    /// <summary>The command line itself is wrong (unknown option, missing argument).</summary>
    public const int Usage = 1;
    /// <summary>An input file is unreadable or malformed; the message names the place.</summary>
    public const int InputError = 2;
    /// <summary>The input was read but cannot be screened as it is (e.g. a single class).</summary>
    public const int NotScreenable = 3;
    /// <summary>A result could not be written (permissions, disk full, folder not ours).</summary>
    public const int OutputError = 4;
    /// <summary>
    /// Refused before reading the panel: the estimated memory exceeds --memory-limit (or 90% of the
    /// available memory); the message gives the estimate and what would lower it.
    /// </summary>
    public const int NotEnoughMemory = 5;
    /// <summary>A bug: the message asks the user to report it.</summary>
    public const int InternalError = 70;
    /// <summary>Stopped by Ctrl+C; nothing half-written is left.</summary>
    public const int Cancelled = 130;
}
