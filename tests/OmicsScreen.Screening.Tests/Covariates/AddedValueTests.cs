using OmicsScreen.Screening.Covariates;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Tests.Covariates;

/// <summary>
/// The panel's added value over covariates on invented panels with known truth
/// (<see cref="CovariatePanels"/>): markers that only proxy age add nothing (the paired interval
/// includes 0), markers independent of age that carry signal add (it excludes 0).
/// </summary>
public class AddedValueTests
{
    private static ScreenOptions Quick(ulong seed) => new()
    {
        Seed = seed, HalfSamplePairs = 5, TreesPerForest = 150, CurveFolds = 5, CurveInnerPairs = 3, CurveMaxPanelSize = 8,
    };

    [Fact]
    public void Markers_that_only_proxy_age_add_nothing_over_age()
    {
        var result = ScreenRunner.Run(CovariatePanels.Proxy(240, 40, 11), Quick(11));

        var added = Assert.IsType<AddedValue>(result.AddedValue);
        Assert.Equal("auc", added.Metric);
        Assert.Equal(["age", "sex"], added.Covariates);
        Assert.Equal("delong", added.IntervalMethod);
        Assert.Equal(240, added.SampleCount);
        // Known truth: the outcome depends on age alone (by construction), so covariates carry it
        // and the proxies beside them cannot add: DeLong et al. (1988) paired interval spans 0.
        Assert.True(added.CovariatesAlone > 0.75, $"covariates alone AUC {added.CovariatesAlone}");
        Assert.True(added.GainInterval.Lower < 0 && added.GainInterval.Upper > 0,
            added.ToString());
        Assert.True(added.GainPValue > 0.05, $"p {added.GainPValue}");
        // The proxies predict the outcome on their own (through age): the panel alone is far from chance.
        Assert.True(added.PanelAlone > 0.7, $"panel alone AUC {added.PanelAlone}");
    }

    [Fact]
    public void Markers_independent_of_age_that_carry_signal_add_to_age()
    {
        var result = ScreenRunner.Run(CovariatePanels.Adds(240, 40, 12), Quick(12));

        var added = Assert.IsType<AddedValue>(result.AddedValue);
        // Known truth: three markers independent of age enter the outcome's logit (by construction),
        // so the DeLong et al. (1988) paired interval of the gain lies above 0.
        Assert.True(added.GainInterval.Lower > 0, added.ToString());
        Assert.True(added.GainPValue < 0.05, $"p {added.GainPValue}");
        Assert.True(added.CovariatesAndPanel > added.CovariatesAlone);
        Assert.Equal(added.CovariatesAndPanel - added.CovariatesAlone, added.Gain, 12);
    }

    [Fact]
    public void Without_covariates_there_is_no_added_value()
    {
        var panel = CovariatePanels.Adds(120, 20, 13);
        var bare = new OmicsScreen.Engine.Panels.Panel(panel.Matrix, panel.Outcome);
        Assert.Null(ScreenRunner.Run(bare, Quick(13) with { HalfSamplePairs = 2, TreesPerForest = 50 }).AddedValue);
    }
}
