using OmicsScreen.Reporting.Charts;

namespace OmicsScreen.Reporting.Tests.Charts;

public class ChartPaletteTests
{
    [Fact]
    public void Series_colours_are_the_okabe_ito_palette_and_cycle()
    {
        // Okabe & Ito (2008), Color Universal Design: the eight colours of the palette.
        string[] okabeIto = ["#000000", "#E69F00", "#56B4E9", "#009E73", "#F0E442", "#0072B2", "#D55E00", "#CC79A7"];
        var used = Enumerable.Range(0, 8).Select(ChartPalette.SeriesColour).ToList();
        Assert.Equal(okabeIto.Order(), used.Order());
        Assert.Equal(ChartPalette.SeriesColour(0), ChartPalette.SeriesColour(8));
    }

    [Fact]
    public void Diverging_scale_runs_blue_to_neutral_to_vermillion_and_clamps()
    {
        Assert.Equal(ChartPalette.Blue, ChartPalette.Diverging(-1));
        Assert.Equal(ChartPalette.Neutral, ChartPalette.Diverging(0));
        Assert.Equal(ChartPalette.Vermillion, ChartPalette.Diverging(1));
        Assert.Equal(ChartPalette.Vermillion, ChartPalette.Diverging(7));
        Assert.Equal(ChartPalette.NoValue, ChartPalette.Diverging(double.NaN));
        // Halfway: each channel is the mean of #F7F7F7 and #D55E00, rounded half away from zero.
        Assert.Equal("#E6AB7C", ChartPalette.Diverging(0.5));
    }

    [Fact]
    public void Dark_text_is_chosen_on_light_cells_and_white_on_dark_ones()
    {
        Assert.True(ChartPalette.PrefersDarkText(ChartPalette.Neutral));
        Assert.False(ChartPalette.PrefersDarkText(ChartPalette.Blue));
    }
}
