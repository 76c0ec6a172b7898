using OmicsScreen.Data;
using OmicsScreen.Runs.Work;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Tests.Work;

/// <summary>
/// The part and merge jobs without a command line: parts merged give the single run's result,
/// and what cannot be done is refused with a <see cref="RunRefusedException"/> before anything is written.
/// </summary>
public sealed class PartAndMergeJobTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    // The Wisconsin diagnostic data (UCI; reference/wdbc/README.md), its outcome column in the matrix.
    private static readonly PanelLoadOptions Panel = new() { MatrixPath = ReferenceData.Wdbc("wdbc.csv"), OutcomeColumn = "diagnosis" };

    private static readonly ScreenOptions Screen = new()
    {
        HalfSamplePairs = 2, TreesPerForest = 40, CurveFolds = 2, CurveInnerPairs = 1, CurveMaxPanelSize = 3, DecoyCount = 50,
    };

    private static LoadedPanel Load() => PanelLoader.Load(Panel).EnsureScreenable();

    private PartRequest Request(int index, int count) => new()
    {
        Panel = Panel, Screen = Screen, Part = new RunPart(index, count), Folder = Path.Combine(_folder.Path, $"part{index}"),
    };

    [Fact]
    public void Two_parts_merged_give_the_result_of_a_single_run()
    {
        var loaded = Load();
        var single = ScreenRunner.Run(loaded.Panel, Screen);
        var folders = new List<string>();
        for (int index = 1; index <= 2; index++)
        {
            // Parts on different thread counts: results never depend on them.
            var request = Request(index, 2) with { Screen = Screen with { ThreadCount = index } };
            var part = PartJob.Open(loaded, request);
            part.Run(progress: null);
            Assert.InRange(part.Units.Count, 1, part.UnitCount - 1);
            folders.Add(request.Folder);
        }

        using var merge = MergeJob.Open([folders[1], folders[0]], Path.Combine(_folder.Path, "merged"), force: false, threadCount: 2, TextWriter.Null);
        Assert.Equal(2, merge.PartCount);
        var merged = merge.Run(progress: null);

        Assert.Equal(single.Repeats.Corrected, merged.Repeats.Corrected);
        Assert.Equal(single.Repeats.Permutation, merged.Repeats.Permutation);
        Assert.Equal(single.Features, merged.Features);
        Assert.Equal(single.Order, merged.Order);
        Assert.Equal(single.Shortlist.Select(e => e.Forest.Feature), merged.Shortlist.Select(e => e.Forest.Feature));
        Assert.Equal(single.PanelSize!.Points, merged.PanelSize!.Points);
    }

    [Fact]
    public void A_split_into_more_parts_than_work_units_is_refused_before_its_folder_is_made()
    {
        var request = Request(1, 10_000);
        var refused = Assert.Throws<RunRefusedException>(() => PartJob.Open(Load(), request));
        Assert.Equal(RunRefusal.Usage, refused.Refusal);
        Assert.Contains("at most", refused.Message);
        Assert.False(Directory.Exists(request.Folder));
    }

    [Fact]
    public void A_merge_of_an_unfinished_part_is_refused_and_leaves_the_results_folder_unmade()
    {
        var loaded = Load();
        var first = Request(1, 2);
        PartJob.Open(loaded, first).Run(progress: null);
        // Part 2 opened but never run: its record says it did not finish.
        var second = Request(2, 2);
        PartJob.Open(loaded, second);
        string results = Path.Combine(_folder.Path, "merged");

        var refused = Assert.Throws<RunRefusedException>(() => MergeJob.Open([first.Folder, second.Folder], results, force: false, threadCount: 1, TextWriter.Null));
        Assert.Equal(RunRefusal.Input, refused.Refusal);
        Assert.Contains("did not finish", refused.Message);
        Assert.False(Directory.Exists(results));
    }
}
