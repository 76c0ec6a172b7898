using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>Issue 14's extra figures: samples on two principal components, screen order against single-marker AUC, importances against decoys.</summary>
public sealed class StatisticianFigureTests
{
    [Fact]
    public void Principal_components_recover_the_direction_of_two_planted_groups()
    {
        // Two groups 6 SD apart in the first three features, noise elsewhere: the first component
        // must separate them (the largest variance lies along the shift), the second must not.
        const int samples = 40, features = 12;
        var columns = new float[features][];
        var generator = new Random(5);
        for (int f = 0; f < features; f++)
        {
            columns[f] = new float[samples];
            for (int s = 0; s < samples; s++)
                columns[f][s] = (float)((f < 3 && s >= samples / 2 ? 6 : 0) + Gaussian(generator));
        }
        var matrix = new FeatureMatrix(Enumerable.Range(0, features).Select(f => "f" + f).ToArray(),
            Enumerable.Range(0, samples).Select(s => "s" + s).ToArray(), columns, new CellState[]?[features]);
        var components = SamplePrincipalComponents.Of(matrix)!;

        var low = components.First.Take(samples / 2).ToArray();
        var high = components.First.Skip(samples / 2).ToArray();
        double pooledSd = Math.Sqrt((Variance(low) + Variance(high)) / 2);
        Assert.True(Math.Abs(high.Average() - low.Average()) > 3 * pooledSd, $"{low.Average()} vs {high.Average()}, SD {pooledSd}");
        Assert.True(components.FirstShare > components.SecondShare);
        Assert.InRange(components.FirstShare + components.SecondShare, 0, 1);
        // Scores on different components are uncorrelated.
        double dot = components.First.Zip(components.Second, (a, b) => a * b).Sum();
        Assert.True(Math.Abs(dot) < 1e-6 * components.First.Sum(v => v * v), dot.ToString(System.Globalization.CultureInfo.InvariantCulture));
    }

    private static double Variance(double[] values)
    {
        double mean = values.Average();
        return values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1);
    }

    private static double Gaussian(Random generator) =>
        Math.Sqrt(-2 * Math.Log(1 - generator.NextDouble())) * Math.Cos(2 * Math.PI * generator.NextDouble());

    [Fact]
    public void The_report_shows_the_sample_maps_the_rank_against_AUC_and_the_decoys()
    {
        string html = ScreenReport.Render(ScreenReportSample.Input());
        var document = Markup.Parse(html);
        var titles = Markup.Texts(document, "title");
        Assert.Contains("Samples by class", titles);
        Assert.Contains("Samples by cohort", titles);
        Assert.Contains(titles, t => t.StartsWith("Screen order against single-marker AUC", StringComparison.Ordinal));
        if (ScreenReportSample.Result.Repeats.DecoyCount > 0)
            Assert.Contains("Observed importances against the decoys", titles);
        // The class and cohort names are data: they appear as escaped legend text.
        Assert.Contains(ScreenReportSample.CaseClass, Markup.Texts(document, "text"));
    }
}
