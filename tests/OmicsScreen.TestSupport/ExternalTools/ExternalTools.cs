namespace OmicsScreen.TestSupport.ExternalTools;

/// <summary>
/// Whether a test's external tools are there. Outside CI a missing tool makes the test skipped
/// (<see cref="RequiresToolFactAttribute"/>), never silently passed; on CI (CI=true) the test
/// runs and <see cref="Require"/> fails it, because CI installs every tool.
/// </summary>
public static class ExternalTools
{
    public static bool OnCi => string.Equals(Environment.GetEnvironmentVariable("CI"), "true", StringComparison.OrdinalIgnoreCase);

    public static string? SnakemakeExecutable { get; } = FindOnPath("snakemake");

    public static bool IsAvailable(ExternalTool tool) => tool switch
    {
        ExternalTool.Chromium => File.Exists("/usr/bin/chromium"),
        ExternalTool.PdfToText => File.Exists("/usr/bin/pdftotext"),
        ExternalTool.Snakemake => SnakemakeExecutable is not null,
        // It installs and starts system daemons, so it is only ever started on CI.
        ExternalTool.Slurm => OnCi,
        _ => throw new ArgumentOutOfRangeException(nameof(tool)),
    };

    /// <summary>Why a tool is missing and how to get it.</summary>
    public static string Missing(ExternalTool tool) => tool switch
    {
        ExternalTool.Chromium => "/usr/bin/chromium is missing (apt-get install chromium; CI installs it with .ci/install-packages)",
        ExternalTool.PdfToText => "/usr/bin/pdftotext is missing (apt-get install poppler-utils; CI installs it with .ci/install-packages)",
        ExternalTool.Snakemake => "snakemake is not on the PATH (apt-get install snakemake; CI installs it with .ci/install-packages)",
        ExternalTool.Slurm => "runs only with CI=true: it starts a single-node Slurm as root",
        _ => throw new ArgumentOutOfRangeException(nameof(tool)),
    };

    /// <summary>Fails the calling test when a tool is missing: reached only on CI or when a test forgot its attribute.</summary>
    public static void Require(params ExternalTool[] tools)
    {
        foreach (var tool in tools) Assert.True(IsAvailable(tool), Missing(tool));
    }

    private static string? FindOnPath(string name)
    {
        foreach (var folder in (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
        {
            string candidate = Path.Combine(folder, name);
            if (File.Exists(candidate)) return candidate;
        }
        return null;
    }
}
