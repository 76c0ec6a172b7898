using OmicsScreen.Cli.Console;
using OmicsScreen.Data;
using OmicsScreen.Runs;

namespace OmicsScreen.Cli;

/// <summary>
/// Runs a command body and turns every failure into one clear line on standard error and a
/// named exit code: users get the file, place and fix, never a stack trace.
/// </summary>
internal static class CommandRunner
{
    /// <summary>Set OMICSSCREEN_DEBUG=1 to see the stack trace of an internal error.</summary>
    private static bool ShowStackTraces =>
        Environment.GetEnvironmentVariable("OMICSSCREEN_DEBUG") is "1" or "true";

    public static int Run(CliConsole console, Func<int> body)
    {
        try
        {
            return body();
        }
        catch (PanelInputException e)
        {
            console.Error.WriteLine($"error: {TextTable.Printable(e.Message)}");
            return ExitCode.InputError;
        }
        catch (PanelNotScreenableException e)
        {
            console.Error.WriteLine($"error: {TextTable.Printable(e.Message)}");
            return ExitCode.NotScreenable;
        }
        catch (CommandInputException e)
        {
            console.Error.WriteLine($"error: {TextTable.Printable(e.Message)}");
            return e.Code;
        }
        catch (RunRefusedException e)
        {
            console.Error.WriteLine($"error: {TextTable.Printable(e.Message)}");
            return e.Refusal switch
            {
                RunRefusal.Input => ExitCode.InputError,
                RunRefusal.Output => ExitCode.OutputError,
                _ => ExitCode.Usage,
            };
        }
        catch (OperationCanceledException)
        {
            console.Error.WriteLine("stopped: cancelled before the results were complete; nothing partial was kept.");
            return ExitCode.Cancelled;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            console.Error.WriteLine($"error: {TextTable.Printable(e.Message)}");
            console.Error.WriteLine("  Check that the folder exists, is writable and has free space, then run the command again.");
            return ExitCode.OutputError;
        }
        catch (Exception e)
        {
            console.Error.WriteLine($"internal error: {TextTable.Printable(e.Message)}");
            console.Error.WriteLine("  This is a bug in OmicsScreen. Please report it with the command line you ran"
                + (ShowStackTraces ? "." : " and the output of the same command with OMICSSCREEN_DEBUG=1."));
            if (ShowStackTraces) console.Error.WriteLine(e);
            return ExitCode.InternalError;
        }
    }
}
