using OmicsScreen.Cli.Tests.Workflow;

namespace OmicsScreen.Cli.Tests.Repository;

/// <summary>
/// Words the project no longer uses: one is the signature term of another selection program, the
/// other names a different idea in the forest literature (trees whose leaves are filled from other
/// samples). Code, prose and tables say "permuted copy" and "selection-aware" instead.
/// </summary>
public sealed class RetiredTermsTests
{
    private static readonly string[] Retired = ["shad" + "ow", "hon" + "est"];
    private static readonly string[] Extensions = [".cs", ".md", ".py", ".sh", ".json", ".tsv", ".txt", ".html", ".R", ".smk", ""];

    [Fact]
    public void No_source_prose_or_table_in_the_repository_uses_a_retired_term()
    {
        var hits = new List<string>();
        foreach (string path in Directory.EnumerateFiles(RepositoryFolder.Root, "*", SearchOption.AllDirectories))
        {
            string relative = Path.GetRelativePath(RepositoryFolder.Root, path);
            if (Skipped(relative) || !Extensions.Contains(Path.GetExtension(path))) continue;
            var info = new FileInfo(path);
            if (info.Length > 5_000_000) continue;
            int lineNumber = 0;
            foreach (string line in File.ReadLines(path))
            {
                lineNumber++;
                foreach (string term in Retired)
                    if (line.Contains(term, StringComparison.OrdinalIgnoreCase)) hits.Add($"{relative}:{lineNumber}: {term}");
            }
        }
        Assert.True(hits.Count == 0, "Retired terms found:\n" + string.Join('\n', hits.Take(40)));
    }

    private static bool Skipped(string relative)
    {
        foreach (string part in relative.Split(Path.DirectorySeparatorChar))
            if (part is "bin" or "obj" or ".git" or "out" or "reports" || part.StartsWith('.')) return true;
        return false;
    }
}
