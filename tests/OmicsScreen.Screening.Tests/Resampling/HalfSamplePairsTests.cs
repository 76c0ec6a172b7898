using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Resampling;

namespace OmicsScreen.Screening.Tests.Resampling;

public class HalfSamplePairsTests
{
    private static ClassOutcome Outcome(int cases, int controls)
    {
        var codes = new int[cases + controls];
        for (int i = 0; i < cases; i++) codes[i * (cases + controls) / cases] = 1;
        return new ClassOutcome("status", ["control", "case"], codes);
    }

    [Fact]
    public void Each_pair_splits_the_eligible_rows_into_two_disjoint_halves()
    {
        var outcome = Outcome(31, 70);
        var rows = Enumerable.Range(0, 101).Where(r => r % 7 != 3).ToArray();
        var halves = HalfSamplePairs.Draw(outcome, null, rows, pairCount: 10, runSeed: 42);

        Assert.Equal(20, halves.Length);
        for (int pair = 0; pair < 10; pair++)
        {
            var a = halves[2 * pair];
            var b = halves[2 * pair + 1];
            Assert.Empty(a.Intersect(b));
            Assert.Equal(rows, a.Concat(b).Order().ToArray());
            Assert.InRange(a.Length - b.Length, -1, 1);
        }
    }

    [Fact]
    public void Halves_keep_the_class_balance()
    {
        var outcome = Outcome(30, 90);
        var rows = Enumerable.Range(0, 120).ToArray();
        foreach (var half in HalfSamplePairs.Draw(outcome, null, rows, pairCount: 5, runSeed: 1))
            Assert.Equal(15, half.Count(r => outcome.SampleClasses[r] == 1));
    }

    [Fact]
    public void Samples_of_one_subject_stay_in_the_same_half()
    {
        var outcome = Outcome(20, 40);
        var subjectOf = Enumerable.Range(0, 60).Select(r => $"subject{r / 3}").ToArray();
        // Give each subject the class of its first sample, as replicates share an outcome.
        var codes = Enumerable.Range(0, 60).Select(r => outcome.SampleClasses[r / 3 * 3]).ToArray();
        var sharedOutcome = new ClassOutcome("status", ["control", "case"], codes);
        var subject = SampleGrouping.FromLabels("subject", subjectOf);
        var halves = HalfSamplePairs.Draw(sharedOutcome, subject, Enumerable.Range(0, 60).ToArray(), pairCount: 8, runSeed: 3);
        foreach (var half in halves)
        {
            var subjects = half.Select(r => subjectOf[r]).ToHashSet();
            foreach (var s in subjects) Assert.Equal(3, half.Count(r => subjectOf[r] == s));
        }
    }

    [Fact]
    public void A_pair_depends_only_on_the_seed_and_its_index()
    {
        var outcome = Outcome(25, 50);
        var rows = Enumerable.Range(0, 75).ToArray();
        var few = HalfSamplePairs.Draw(outcome, null, rows, pairCount: 2, runSeed: 9);
        var many = HalfSamplePairs.Draw(outcome, null, rows, pairCount: 6, runSeed: 9);
        var other = HalfSamplePairs.Draw(outcome, null, rows, pairCount: 2, runSeed: 10);

        Assert.Equal(few[0], many[0]);
        Assert.Equal(few[3], many[3]);
        Assert.NotEqual(few[0], other[0]);
        Assert.NotEqual(many[0], many[2]);
    }
}
