using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Tests.Panels;

public class FeatureMatrixTests
{
    [Fact]
    public void Builder_keeps_missing_and_below_detection_apart()
    {
        var builder = new FeatureMatrixBuilder(["f1", "f2"], ["s1", "s2", "s3"]);
        builder.SetMeasured(0, 0, 1.5f);
        builder.SetMissing(0, 1);
        builder.SetBelowDetection(0, 2, 0.05f);
        builder.SetMeasured(1, 0, 2f);
        builder.SetMeasured(1, 1, 3f);
        builder.SetMeasured(1, 2, 4f);
        var matrix = builder.Build();

        Assert.Equal(CellState.Measured, matrix.State(0, 0));
        Assert.Equal(CellState.Missing, matrix.State(0, 1));
        Assert.Equal(CellState.BelowDetection, matrix.State(0, 2));
        Assert.Equal(0.05f, matrix.Value(0, 2));
        Assert.True(float.IsNaN(matrix.Value(0, 1)));
        Assert.False(matrix.HasUnmeasuredCells(1));
        Assert.True(matrix.States(1).IsEmpty);
    }

    [Fact]
    public void Selecting_samples_reorders_values_and_states_together()
    {
        var builder = new FeatureMatrixBuilder(["f1"], ["a", "b", "c"]);
        builder.SetMeasured(0, 0, 1f);
        builder.SetMissing(0, 1);
        builder.SetMeasured(0, 2, 3f);
        var picked = builder.Build().SelectSamples([2, 0]);

        Assert.Equal(["c", "a"], picked.SampleIds);
        Assert.Equal([3f, 1f], picked.Column(0).ToArray());
        Assert.False(picked.HasUnmeasuredCells(0));
    }

    [Fact]
    public void Outcome_defaults_the_positive_class_to_the_smallest()
    {
        var outcome = new ClassOutcome("status", ["case", "control"], [1, 1, 0, 1]);
        Assert.Equal(0, outcome.PositiveClass);
        Assert.Equal([1, 3], outcome.ClassCounts.ToArray());
    }
}
