using System.Globalization;
using System.Text;

namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>Compares a results folder merged from parts with the one a single screen wrote.</summary>
internal static class MergedResults
{
    /// <summary>
    /// Every table (.tsv) and the locked panel must exist in both folders and be byte-identical; the
    /// merged report must say how many parts it was merged from.
    /// </summary>
    public static void AssertSameAsSingleScreen(string single, string merged, int partCount)
    {
        var singleFiles = ComparedFiles(single);
        Assert.Contains("shortlist.tsv", singleFiles);
        Assert.Contains("locked_panel.json", singleFiles);
        Assert.Equal(singleFiles, ComparedFiles(merged));
        foreach (var file in singleFiles)
            Assert.True(File.ReadAllBytes(Path.Combine(single, file)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(merged, file))),
                file + " differs between the single screen and the merged parts");
        Assert.Contains(partCount.ToString(CultureInfo.InvariantCulture) + " parts", File.ReadAllText(Path.Combine(merged, "report.html")));
    }

    /// <summary>The text of every log file in <paramref name="folder"/>, for a failure message.</summary>
    public static string LogsIn(string folder)
    {
        if (!Directory.Exists(folder)) return "";
        var text = new StringBuilder();
        foreach (var log in Directory.EnumerateFiles(folder))
            text.Append("\n--- ").Append(Path.GetFileName(log)).Append('\n').Append(File.ReadAllText(log));
        return text.ToString();
    }

    /// <summary>Every table and the locked panel, relative to the results folder, in ordinal order.</summary>
    private static List<string> ComparedFiles(string results)
    {
        var files = new List<string>();
        foreach (var path in Directory.EnumerateFiles(results, "*", SearchOption.AllDirectories))
        {
            string relative = Path.GetRelativePath(results, path);
            if (relative.EndsWith(".tsv", StringComparison.Ordinal) || Path.GetFileName(relative) == "locked_panel.json")
                files.Add(relative);
        }
        files.Sort(StringComparer.Ordinal);
        return files;
    }
}
