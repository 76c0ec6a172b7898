namespace OmicsScreen.TestSupport;

/// <summary>Locates the open reference data copied beside the test binaries.</summary>
public static class ReferenceData
{
    public static string Directory => Path.Combine(AppContext.BaseDirectory, "reference");

    public static string Wdbc(string fileName) => Path.Combine(Directory, "wdbc", fileName);
}
