using OmicsScreen.Data;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Tests.Locking;

/// <summary>What `apply` says when the cohort's file or sample ids are the discovery data's.</summary>
public class DiscoveryOverlapTests
{
    private static readonly LockProvenance Provenance = new("test", 1, 2, 10, 4,
        new Dictionary<string, string> { ["plasma.csv"] = new string('a', 64) });

    private static readonly InputFileRecord SameFile = new("/data/plasma.csv", 100, new string('a', 64));

    [Fact]
    public void The_discovery_file_scored_on_its_own_samples_measures_fit()
    {
        var hashes = DiscoveryOverlap.SampleIdHashes(["s1", "s2"]).Select(n => n!.GetValue<string>()).ToHashSet();
        var warning = Assert.Single(DiscoveryOverlap.Warnings(Provenance, hashes, [SameFile], ["s1", "s2"]));
        Assert.Contains("is the discovery file 'plasma.csv' itself (same SHA-256): the panel was chosen on these samples", warning);
    }

    /// <summary>A held-out centre of one matrix file: the same file, but none of the scored ids was screened.</summary>
    [Fact]
    public void The_discovery_file_scored_on_samples_the_screen_left_out_says_so()
    {
        var hashes = DiscoveryOverlap.SampleIdHashes(["s1", "s2"]).Select(n => n!.GetValue<string>()).ToHashSet();
        var warning = Assert.Single(DiscoveryOverlap.Warnings(Provenance, hashes, [SameFile], ["e1", "e2", "e3"]));
        Assert.Contains("but none of the 3 samples scored here has the id of a discovery sample", warning);
        Assert.DoesNotContain("measures fit", warning);
    }

    [Fact]
    public void Another_file_sharing_ids_is_counted_without_naming_them()
    {
        var hashes = DiscoveryOverlap.SampleIdHashes(["s1", "s2"]).Select(n => n!.GetValue<string>()).ToHashSet();
        var other = new InputFileRecord("/data/validation.csv", 100, new string('b', 64));
        var warning = Assert.Single(DiscoveryOverlap.Warnings(Provenance, hashes, [other], ["s2", "v1"]));
        Assert.StartsWith("1 of 2 samples have the ids of discovery samples", warning);
        Assert.DoesNotContain("'s2'", warning);
    }
}
