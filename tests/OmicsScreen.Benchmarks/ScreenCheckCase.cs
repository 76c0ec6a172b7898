using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// A real default screen (every option at its default, all cores) on a simulated panel, timed
/// in wall and processor seconds per stage, for checking the screen cost model against it.
/// </summary>
public sealed class ScreenCheckCase(int sampleCount, int featureCount) : IBenchmarkCase
{
    public int SampleCount => sampleCount;
    public int FeatureCount => featureCount;

    public string Name => string.Create(CultureInfo.InvariantCulture, $"scaling-screen-{sampleCount}x{featureCount}");

    public void Prepare(string workDirectory)
    {
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design
        {
            SampleCount = sampleCount,
            FeatureCount = featureCount,
            Seed = 42,
        });
        var stages = new StageProcessorTimes();
        var processor = ProcessorClock.Start();
        var watch = Stopwatch.StartNew();
        var result = ScreenRunner.Run(panel, new ScreenOptions(), stages);
        double seconds = watch.Elapsed.TotalSeconds;
        double cpuSeconds = processor.Lap();
        stages.Finish();
        var figures = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture, $"screen_s={seconds:F2}"),
            string.Create(CultureInfo.InvariantCulture, $"screen_cpu_s={cpuSeconds:F2}"),
        };
        foreach (var (stage, stageSeconds) in result.StageSeconds)
            figures.Add(string.Create(CultureInfo.InvariantCulture, $"{stage}_s={stageSeconds:F2}"));
        foreach (var (stage, stageCpu) in stages.Seconds)
            figures.Add(string.Create(CultureInfo.InvariantCulture, $"{stage}_cpu_s={stageCpu:F2}"));
        return figures;
    }
}
