using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Sampling;

namespace OmicsScreen.Engine.Tests.Sampling;

public class SamplingPlanTests
{
    private static int[] Draw(SamplingOptions options, int[] eligible, int[] classes, int classCount, int sampleCount, ulong tree)
    {
        var plan = new SamplingPlan(options, eligible, classes, classCount);
        var counts = new int[sampleCount];
        var scratch = new int[plan.ScratchLength];
        var generator = SeedSchedule.Generator(3, 0, (int)tree, SeedPurpose.Sampling);
        plan.Draw(ref generator, counts, scratch);
        return counts;
    }

    [Fact]
    public void Bootstrap_leaves_out_a_share_close_to_one_minus_one_over_n_to_the_n()
    {
        const int sampleCount = 100, trees = 4000;
        var all = Enumerable.Range(0, sampleCount).ToArray();
        var classes = new int[sampleCount];
        double leftOut = 0;
        for (ulong t = 0; t < trees; t++)
        {
            var counts = Draw(SamplingOptions.Default, all, classes, 1, sampleCount, t);
            Assert.Equal(sampleCount, counts.Sum());
            leftOut += counts.Count(c => c == 0) / (double)sampleCount;
        }
        // Probability fact: a sample escapes n draws with replacement with probability (1 - 1/n)^n.
        double expected = Math.Pow(1 - 1.0 / sampleCount, sampleCount);
        Assert.InRange(leftOut / trees, expected - 0.003, expected + 0.003);
    }

    [Fact]
    public void Subsampling_draws_the_fraction_once_each()
    {
        var all = Enumerable.Range(0, 50).ToArray();
        var counts = Draw(new SamplingOptions { Drawing = SampleDrawing.Subsample, SubsampleFraction = 0.5 }, all, new int[50], 1, 50, 1);
        Assert.Equal(25, counts.Count(c => c == 1));
        Assert.Equal(25, counts.Count(c => c == 0));
    }

    [Fact]
    public void Class_balanced_drawing_takes_the_smallest_class_size_from_each_class()
    {
        var classes = Enumerable.Range(0, 100).Select(s => s < 10 ? 1 : 0).ToArray();
        var all = Enumerable.Range(0, 100).ToArray();
        var counts = Draw(new SamplingOptions { ClassBalanced = true }, all, classes, 2, 100, 1);
        // Balanced random forest (Chen, Liaw & Breiman 2004): a bootstrap of the minority class
        // and as many draws, with replacement, from the majority.
        Assert.Equal(10, Enumerable.Range(0, 100).Where(s => classes[s] == 1).Sum(s => counts[s]));
        Assert.Equal(10, Enumerable.Range(0, 100).Where(s => classes[s] == 0).Sum(s => counts[s]));
    }

    [Fact]
    public void Rows_outside_the_training_subset_are_never_drawn()
    {
        var eligible = Enumerable.Range(0, 60).Where(s => s % 3 != 0).ToArray();
        foreach (var options in new[] { SamplingOptions.Default, new SamplingOptions { Drawing = SampleDrawing.Subsample } })
            for (ulong t = 0; t < 20; t++)
            {
                var counts = Draw(options, eligible, new int[60], 1, 60, t);
                for (int s = 0; s < 60; s += 3) Assert.Equal(0, counts[s]);
            }
    }

    [Theory]
    [InlineData(SampleDrawing.Bootstrap)]
    [InlineData(SampleDrawing.Subsample)]
    public void Replicates_of_one_subject_are_drawn_the_same_number_of_times(SampleDrawing drawing)
    {
        // 30 subjects with 1 to 3 replicates each.
        var labels = new List<string>();
        for (int subject = 0; subject < 30; subject++)
            for (int r = 0; r <= subject % 3; r++) labels.Add($"subject{subject:D2}");
        var groups = SampleGrouping.FromLabels("subject", labels);
        var all = Enumerable.Range(0, labels.Count).ToArray();
        var options = new SamplingOptions { Drawing = drawing, Groups = groups };
        // Grouped resampling (Karpievitch et al. 2009): a subject's replicates share one draw.
        for (ulong t = 0; t < 50; t++)
        {
            var counts = Draw(options, all, new int[labels.Count], 1, labels.Count, t);
            for (int s = 1; s < labels.Count; s++)
                if (groups.SampleLevels[s] == groups.SampleLevels[s - 1]) Assert.Equal(counts[s - 1], counts[s]);
        }
    }
}
