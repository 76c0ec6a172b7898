namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>The checkout the tests were built from, found by walking up from the test output folder.</summary>
internal static class RepositoryFolder
{
    /// <summary>The repository's root folder: the first ancestor holding OmicsScreen.sln.</summary>
    public static string Root { get; } = FindRoot();

    public static string Workflows(params string[] parts) => Path.Combine([Root, "workflows", .. parts]);

    private static string FindRoot()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
            if (File.Exists(Path.Combine(folder.FullName, "OmicsScreen.sln"))) return folder.FullName;
        throw new DirectoryNotFoundException("No OmicsScreen.sln above " + AppContext.BaseDirectory);
    }
}
