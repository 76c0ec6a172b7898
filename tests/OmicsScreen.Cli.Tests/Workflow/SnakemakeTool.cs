namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>Finds Debian's snakemake on the PATH; CI installs it with .ci/install-packages.</summary>
internal static class SnakemakeTool
{
    public static string? Executable { get; } = FindOnPath("snakemake");

    /// <summary>
    /// True when snakemake can be used. On CI (CI=true) a missing snakemake fails the calling test;
    /// elsewhere the test may return early.
    /// </summary>
    public static bool AvailableOrFailOnCi()
    {
        if (Executable is not null) return true;
        bool onCi = string.Equals(Environment.GetEnvironmentVariable("CI"), "true", StringComparison.OrdinalIgnoreCase);
        Assert.False(onCi, "snakemake is not on the PATH; CI installs Debian's snakemake with .ci/install-packages.");
        return false;
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
