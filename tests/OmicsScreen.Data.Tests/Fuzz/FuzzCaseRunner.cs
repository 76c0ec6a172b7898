using OmicsScreen.Data.Sizing;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// Loads one fuzz case from files in its own folder on a worker, with a time bound, and judges
/// the outcome with <see cref="FuzzVerdict"/>.
/// </summary>
internal static class FuzzCaseRunner
{
    /// <summary>
    /// Processor time of the case's own thread: far above the milliseconds a 30 x 12 panel takes to
    /// load, so that only pathological work can reach it. Processor time, not wall time: on the
    /// shared two-core machine at load 30-46 a case waited for a core past 40 s of wall time.
    /// Where the thread's processor time cannot be read, the bound applies to wall time.
    /// </summary>
    public static readonly TimeSpan TimeBound = TimeSpan.FromSeconds(10);

    /// <summary>Wall time after which a case counts as hung, whatever the load.</summary>
    public static readonly TimeSpan HangBound = TimeSpan.FromSeconds(120);

    /// <summary>Returns null when the case loaded soundly or was refused cleanly, otherwise what went wrong.</summary>
    public static string? Run(FuzzCase fuzzCase, string folder)
    {
        Directory.CreateDirectory(folder);
        string matrixPath = Path.Combine(folder, fuzzCase.Seed.MatrixFileName);
        File.WriteAllBytes(matrixPath, fuzzCase.MatrixBytes);
        string? sheetPath = null;
        if (fuzzCase.SampleSheetBytes is { } sheet)
        {
            sheetPath = Path.Combine(folder, fuzzCase.Seed.SampleSheetFileName!);
            File.WriteAllBytes(sheetPath, sheet);
        }

        using var cancel = new CancellationTokenSource();
        var options = fuzzCase.Seed.Options(matrixPath, sheetPath);
        // The memory check sizes the file before any load: it must never throw or hang either.
        if (BoundedCall.WithinBounds(() => PanelDimensionReader.TryRead(options), TimeBound, HangBound, out var dimensions, out var sizingError) is { } slowSizing)
            return "sizing the file " + slowSizing;
        if (sizingError is not null)
            return $"sizing the file threw {sizingError.GetType().FullName}: {sizingError.Message}{Environment.NewLine}{sizingError.StackTrace}";
        if (BoundedCall.WithinBounds(() => PanelLoader.Load(options, cancel.Token).EnsureScreenable(), TimeBound, HangBound, out var loaded, out var error) is { } slowLoad)
        {
            cancel.Cancel();
            return "loading " + slowLoad;
        }
        if (error is null)
        {
            // Sizing gives upper bounds (blank lines and attribute rows count), never less than what loads.
            var panel = loaded!.Panel;
            if (dimensions is { } size && (size.SampleCount < panel.SampleCount || size.FeatureCount < panel.FeatureCount))
                return $"sizing found {size.SampleCount} x {size.FeatureCount}, fewer than the {panel.SampleCount} x {panel.FeatureCount} loaded";
            return FuzzVerdict.OfPanel(panel, fuzzCase);
        }
        // A panel that loads but cannot be screened (one class left, every feature constant) is a clean refusal too.
        if (error is PanelNotScreenableException notScreenable)
            return notScreenable.Message.Contains(Path.GetFileName(matrixPath), StringComparison.Ordinal) && !notScreenable.Message.Contains('\n')
                ? null
                : $"refused as unscreenable with a message that does not name the matrix on one line: {notScreenable.Message}";
        return error is PanelInputException refusal
            ? FuzzVerdict.OfRefusal(refusal, matrixPath, sheetPath)
            : $"threw {error.GetType().FullName}: {error.Message}{Environment.NewLine}{error.StackTrace}";
    }

    /// <summary>Writes the damaged files beside the test binaries, named for the case, and returns the folder.</summary>
    public static string Keep(FuzzCase fuzzCase)
    {
        string folder = Path.Combine(AppContext.BaseDirectory, "fuzz-failures");
        Directory.CreateDirectory(folder);
        string prefix = FormattableString.Invariant($"seed-{fuzzCase.MasterSeed}-case-{fuzzCase.Number:0000}-");
        File.WriteAllBytes(Path.Combine(folder, prefix + fuzzCase.Seed.MatrixFileName), fuzzCase.MatrixBytes);
        if (fuzzCase.SampleSheetBytes is { } sheet)
            File.WriteAllBytes(Path.Combine(folder, prefix + fuzzCase.Seed.SampleSheetFileName), sheet);
        return folder;
    }
}
