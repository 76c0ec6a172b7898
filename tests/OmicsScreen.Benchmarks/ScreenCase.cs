using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// The default screen (every option at its default, all cores) on a simulated panel with known
/// causal features. Generation is not timed; the whole screen is, and each stage's time is printed.
/// <paramref name="interactionScan"/> overrides the automatic interaction scan, to price it.
/// </summary>
public sealed class ScreenCase(string name, int sampleCount, int featureCount, InteractionScanMode interactionScan = InteractionScanMode.Auto) : IBenchmarkCase
{
    public string Name => name;

    public void Prepare(string workDirectory)
    {
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var (panel, causal) = CausalBlockPanel.Generate(new CausalBlockPanel.Design
        {
            SampleCount = sampleCount,
            FeatureCount = featureCount,
            Seed = 42,
        });
        var processorStart = Process.GetCurrentProcess().TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        var result = ScreenRunner.Run(panel, new ScreenOptions { InteractionScan = interactionScan });
        double seconds = watch.Elapsed.TotalSeconds;
        // Processor seconds too: the wall time of a shared machine follows its load.
        double processorSeconds = (Process.GetCurrentProcess().TotalProcessorTime - processorStart).TotalSeconds;
        int truePositives = result.Shortlist.Count(e => causal[e.Forest.FeatureIndex]);
        var figures = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture, $"screen_s={seconds:F1}"),
            string.Create(CultureInfo.InvariantCulture, $"screen_cpu_s={processorSeconds:F1}"),
            $"shortlist={result.Shortlist.Count}",
            $"causal_found={truePositives}/{causal.Count(c => c)}",
            string.Create(CultureInfo.InvariantCulture, $"decoys={result.Settings.DecoyCount}"),
            $"interaction_scan={(result.Settings.InteractionScan ? "on" : "off")}",
            $"recommended_size={result.PanelSize?.RecommendedSize}",
        };
        foreach (var (stage, stageSeconds) in result.StageSeconds)
            figures.Add(string.Create(CultureInfo.InvariantCulture, $"{stage}_s={stageSeconds:F1}"));
        return figures;
    }
}
