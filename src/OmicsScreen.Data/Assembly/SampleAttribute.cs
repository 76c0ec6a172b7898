namespace OmicsScreen.Data.Assembly;

/// <summary>A sample attribute column in panel sample order, with the file and lines it came from.</summary>
internal sealed record SampleAttribute(string Name, string[] Values, string FilePath, long[] Lines);
