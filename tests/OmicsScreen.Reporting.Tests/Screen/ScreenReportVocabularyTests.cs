using System.Text.RegularExpressions;
using OmicsScreen.Reporting.Screen;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// Issue 14: the report speaks the user's words. No internal enum value or sentinel ("-1" decoys,
/// 0 threads, SamplesInRows) reaches it, and each setting is shown with the option that sets it.
/// </summary>
public sealed partial class ScreenReportVocabularyTests
{
    private static readonly Lazy<string> Report = new(() => ScreenReport.Render(ScreenReportSample.Input()));

    [GeneratedRegex("<[^>]+>")]
    private static partial Regex Tag();

    private static string Text => Tag().Replace(Report.Value, " ");

    [Theory]
    [InlineData("SamplesInRows")]
    [InlineData("FeaturesInRows")]
    [InlineData("BalanceMode")]
    [InlineData("thread_count")]
    [InlineData("decoy_count")]
    [InlineData("q_value_threshold")]
    [InlineData("frequency_threshold")]
    [InlineData("half_sample_pairs")]
    [InlineData("redundancy_correlation")]
    [InlineData("selected_per_repeat")]
    [InlineData("Screen position")]
    public void No_internal_name_reaches_the_report(string name) => Assert.DoesNotContain(name, Text);

    [Fact]
    public void No_setting_is_shown_as_a_sentinel()
    {
        foreach (var parameter in ScreenParameters.All)
        {
            string text = parameter.Text(ScreenReportSample.Result.Settings);
            Assert.False(text.StartsWith('-'), $"{parameter.Option} shows {text}");
            Assert.Contains(parameter.Label + " (" + parameter.Option + ")", Text);
        }
        Assert.DoesNotMatch(@"\(--threads\)\s+0\b", Text);
        // Issue 16: the report names what the wider forests tried, not only the clean forests' value.
        var settings = ScreenReportSample.Result.Settings;
        string featuresPerSplit = ScreenParameters.All.Single(p => p.Option == "--features-per-split").Text(settings);
        Assert.Contains(settings.CorrectedForestFeaturesPerSplit + " in the forests carrying permuted copies and decoys", featuresPerSplit);
        Assert.NotEqual(settings.FeaturesPerSplit, settings.CorrectedForestFeaturesPerSplit);
        Assert.DoesNotMatch(@"\(--per-repeat-cap\)\s+0\b", Text);
    }
}
