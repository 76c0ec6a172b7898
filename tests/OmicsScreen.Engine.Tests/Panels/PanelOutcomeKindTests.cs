using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Engine.Tests.Panels;

public class PanelOutcomeKindTests
{
    private static FeatureMatrix Matrix()
    {
        var builder = new FeatureMatrixBuilder(["f1", "f2"], ["a", "b", "c"]);
        for (int s = 0; s < 3; s++)
        {
            builder.SetMeasured(0, s, s);
            builder.SetMeasured(1, s, 10 + s);
        }
        return builder.Build();
    }

    [Fact]
    public void A_class_panel_keeps_its_class_outcome()
    {
        var panel = new Panel(Matrix(), new ClassOutcome("group", ["case", "control"], [0, 1, 1]));

        Assert.Equal(OutcomeKind.Classes, panel.Kind);
        Assert.Equal("group", panel.Outcome.ColumnName);
        Assert.Null(panel.Measured);
        Assert.Null(panel.FollowUp);
        Assert.Equal(OutcomeKind.Classes, panel.SelectSamples([2, 0]).Kind);
    }

    [Fact]
    public void A_measured_panel_refuses_class_code_and_keeps_values_through_selection()
    {
        var panel = new Panel(Matrix(), new MeasuredOutcome("egfr", [61.5, 48.0, 90.25]));

        Assert.Equal(OutcomeKind.Measured, panel.Kind);
        var error = Assert.Throws<InvalidOperationException>(() => panel.Outcome);
        Assert.Contains("measured quantity", error.Message);
        Assert.Equal("egfr", panel.OutcomeColumn);

        var picked = panel.SelectSamples([2, 0]).SelectFeatures([1]);
        Assert.Equal(OutcomeKind.Measured, picked.Kind);
        Assert.Equal([90.25, 61.5], picked.Measured!.Values.ToArray());
        Assert.Equal(["f2"], picked.Matrix.FeatureNames);
    }

    [Fact]
    public void A_follow_up_panel_keeps_times_and_events_parallel_through_selection()
    {
        var panel = new Panel(Matrix(), new FollowUpOutcome("months", "relapse", [12.0, 3.5, 40.0], [true, false, true]));

        Assert.Equal(OutcomeKind.TimeToEvent, panel.Kind);
        Assert.Throws<InvalidOperationException>(() => panel.Outcome);
        Assert.Equal(2, panel.FollowUp!.EventCount);

        var picked = panel.SelectSamples([1, 2]);
        Assert.Equal([3.5, 40.0], picked.FollowUp!.Times.ToArray());
        Assert.Equal([false, true], picked.FollowUp.Events.ToArray());
        Assert.Equal("relapse", picked.FollowUp.EventColumn);
        Assert.Equal([40.0], picked.FollowUp.FollowUp.EventTimes.ToArray());
    }

    [Fact]
    public void A_measured_outcome_must_be_finite_and_one_per_sample()
    {
        Assert.Throws<ArgumentException>(() => new MeasuredOutcome("x", [1.0, double.NaN]));
        Assert.Throws<ArgumentException>(() => new Panel(Matrix(), new MeasuredOutcome("x", [1.0, 2.0])));
    }
}
