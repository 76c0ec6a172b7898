using OmicsScreen.Runs.Results;

namespace OmicsScreen.Runs.Tests.Results;

/// <summary>A results folder belongs to one verb and one run: refusals change nothing, and the manifest marks it as ours.</summary>
public sealed class ResultsFolderTests
{
    [Fact]
    public void A_folder_of_someone_elses_files_is_refused_unless_forced_and_left_as_it_was()
    {
        using var folder = new TempFolder();
        string theirs = folder.File("notes.txt", "keep me\n");
        var e = Assert.Throws<RunRefusedException>(() => ResultsFolder.Open(folder.Path, force: false, ResultsKind.Screen, [], TextWriter.Null));
        Assert.Equal(RunRefusal.Output, e.Refusal);
        Assert.Equal(["notes.txt"], Directory.EnumerateFileSystemEntries(folder.Path).Select(Path.GetFileName));
        using (var forced = ResultsFolder.Open(folder.Path, force: true, ResultsKind.Screen, [], TextWriter.Null)) forced.ClearEarlierOutputs();
        Assert.Equal("keep me\n", File.ReadAllText(theirs));
    }

    [Fact]
    public void A_screen_never_writes_into_the_results_of_apply()
    {
        using var folder = new TempFolder();
        using (var apply = ResultsFolder.Open(folder.Path, force: false, ResultsKind.Apply, [], TextWriter.Null))
            apply.WriteText(ResultsFolder.ManifestFileName, w => w.Write("{\n  \"tool\": \"omicsscreen\",\n  \"command\": \"apply\"\n}\n"));
        var e = Assert.Throws<RunRefusedException>(() => ResultsFolder.Open(folder.Path, force: true, ResultsKind.Screen, [], TextWriter.Null));
        Assert.Contains("holds the results of `apply`", e.Message);
    }

    [Fact]
    public void An_input_where_an_output_would_go_is_refused()
    {
        using var folder = new TempFolder();
        string input = folder.File(ScreenResultFiles.Report, "<html/>");
        var e = Assert.Throws<RunRefusedException>(() => ResultsFolder.Open(folder.Path, force: true, ResultsKind.Screen, [input], TextWriter.Null));
        Assert.Contains("is an input of this run", e.Message);
    }

    [Fact]
    public void Rerunning_removes_only_the_verbs_own_earlier_outputs()
    {
        using var folder = new TempFolder();
        using (var first = ResultsFolder.Open(folder.Path, force: false, ResultsKind.Screen, [], TextWriter.Null))
        {
            first.WriteText("shortlist.tsv", w => w.Write("old\n"));
            first.WriteText(ResultsFolder.ManifestFileName, w => w.Write("{\n  \"tool\": \"omicsscreen\"\n}\n"));
        }
        folder.File("mine.txt", "x");
        using (var second = ResultsFolder.Open(folder.Path, force: false, ResultsKind.Screen, [], TextWriter.Null)) second.ClearEarlierOutputs();
        Assert.Equal(["mine.txt"], Directory.EnumerateFiles(folder.Path).Select(Path.GetFileName));
    }
}
