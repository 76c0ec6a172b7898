using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Issues 17 and 18's benchmark: the default screen (every option at its default, all cores) of a
/// measured or a time-to-event outcome, beside the class screen of the `screen` suite at the same
/// shapes. Panels come from the calibration suite's planted designs at the benchmark's size:
/// log-normal features in correlated blocks of 5 (rho 0.6); a measured outcome rising with three
/// blocks and stepping with one threshold marker, or a Cox model in four markers and a threshold
/// marker with about 30% censored. Generation is not timed; the whole screen is.
/// </summary>
public sealed class OutcomeKindScreenCase(string name, OutcomeKind kind, int sampleCount, int featureCount) : IBenchmarkCase
{
    public string Name => name;

    public void Prepare(string workDirectory)
    {
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var background = new BackgroundDesign { FeatureCount = featureCount, BlockSize = 5, BlockCorrelation = 0.6 };
        CalibrationModel model = kind switch
        {
            OutcomeKind.Measured => new MeasuredPlantedModel(name, 42, sampleCount, background,
                MeasuredPlantedModel.DefaultBlockEffects, MeasuredPlantedModel.DefaultThresholdEffect),
            OutcomeKind.TimeToEvent => new FollowUpPlantedModel(name, 42, sampleCount, background, FollowUpDesign.WithCensoredShare(0.3),
                FollowUpPlantedModel.DefaultLogHazardRatios, FollowUpPlantedModel.DefaultThresholdLogHazardRatio),
            _ => throw new ArgumentException("The class screen is the `screen` suite's."),
        };
        var panel = model.Discovery();
        var processorStart = Process.GetCurrentProcess().TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        var result = ScreenRunner.Run(panel, new ScreenOptions());
        double seconds = watch.Elapsed.TotalSeconds;
        // Processor seconds too: the wall time of a shared machine follows its load.
        double processorSeconds = (Process.GetCurrentProcess().TotalProcessorTime - processorStart).TotalSeconds;
        int found = result.Shortlist.Count(e => model.Truth[e.Forest.FeatureIndex]);
        var figures = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture, $"screen_s={seconds:F1}"),
            string.Create(CultureInfo.InvariantCulture, $"screen_cpu_s={processorSeconds:F1}"),
            $"shortlist={result.Shortlist.Count}",
            $"true_found={found}/{model.RelatedCount}",
            string.Create(CultureInfo.InvariantCulture, $"decoys={result.Settings.DecoyCount}"),
            $"recommended_size={result.PanelSize?.RecommendedSize}",
        };
        foreach (var (stage, stageSeconds) in result.StageSeconds)
            figures.Add(string.Create(CultureInfo.InvariantCulture, $"{stage}_s={stageSeconds:F1}"));
        return figures;
    }
}
