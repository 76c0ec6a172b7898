using System.Globalization;
using System.Text;
using OmicsScreen.Data;
using OmicsScreen.Data.Sizing;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Peak memory of a real screen against the estimate made before loading: the panel is written
/// once as CSV, then each run sizes the file without parsing it, estimates the screen's peak,
/// loads the file through <see cref="PanelLoader"/> and screens it, as `omicsscreen screen` does.
/// Fewer pairs, trees and curve folds than the defaults keep it quick; the estimate is made for
/// exactly these settings.
/// </summary>
public sealed class MemoryCase(string name, int sampleCount, int featureCount) : IBenchmarkCase
{
    private static readonly ScreenOptions Settings = new()
    {
        HalfSamplePairs = 3,
        TreesPerForest = 100,
        CurveFolds = 2,
        CurveInnerPairs = 1,
        CurveMaxPanelSize = 20,
    };

    public string Name => name;

    private string CsvPath(string work) => Path.Combine(work, $"memory-{sampleCount}x{featureCount}.csv");

    private static PanelLoadOptions LoadOptions(string path) => new() { MatrixPath = path, OutcomeColumn = "status" };

    public void Prepare(string workDirectory)
    {
        string path = CsvPath(workDirectory);
        if (File.Exists(path)) return;
        var (panel, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design
        {
            SampleCount = sampleCount,
            FeatureCount = featureCount,
            Seed = 42,
        });
        string temporary = path + ".tmp";
        using (var writer = new StreamWriter(temporary, false, new UTF8Encoding(false), 1 << 20))
        {
            var line = new StringBuilder("sample_id,status");
            foreach (var feature in panel.Matrix.FeatureNames) line.Append(',').Append(feature);
            writer.WriteLine(line);
            for (int s = 0; s < panel.SampleCount; s++)
            {
                line.Clear().Append(panel.Matrix.SampleIds[s]).Append(',')
                    .Append(panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]]);
                for (int f = 0; f < panel.FeatureCount; f++)
                    line.Append(',').Append(panel.Matrix.Value(f, s).ToString("R", CultureInfo.InvariantCulture));
                writer.WriteLine(line);
            }
        }
        File.Move(temporary, path, overwrite: true);
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        var options = LoadOptions(CsvPath(workDirectory));
        var dimensions = PanelDimensionReader.TryRead(options)
            ?? throw new InvalidOperationException("The benchmark panel could not be sized.");
        var estimate = MemoryEstimate.ForScreen(dimensions.SampleCount, dimensions.FeatureCount, Settings, Environment.ProcessorCount);
        var loaded = PanelLoader.Load(options);
        long loadPeak = Program.PeakResidentBytes();
        var stagePeaks = new StagePeaks();
        var result = ScreenRunner.Run(loaded.Panel, Settings, stagePeaks);
        GC.KeepAlive(result);
        long peak = Program.PeakResidentBytes();
        var figures = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture, $"estimate_mb={estimate.TotalBytes / 1048576.0:F0}"),
            string.Create(CultureInfo.InvariantCulture, $"estimate_over_peak={(double)estimate.TotalBytes / peak:F2}"),
            $"decoys={result.Settings.DecoyCount}",
            string.Create(CultureInfo.InvariantCulture, $"load_peak_mb={loadPeak / 1048576.0:F0}"),
        };
        figures.AddRange(stagePeaks.Figures);
        foreach (var term in estimate.Terms)
            figures.Add(string.Create(CultureInfo.InvariantCulture, $"{term.Component}_mb={term.Bytes / 1048576.0:F1}"));
        return figures;
    }

    /// <summary>The peak resident set when each stage starts: where in the screen the peak is reached.</summary>
    private sealed class StagePeaks : IProgress<ScreenProgress>
    {
        private ScreenStage? _stage;

        public List<string> Figures { get; } = [];

        public void Report(ScreenProgress value)
        {
            if (_stage == value.Stage) return;
            _stage = value.Stage;
            Figures.Add(string.Create(CultureInfo.InvariantCulture, $"before_{value.Stage}_mb={Program.PeakResidentBytes() / 1048576.0:F0}"));
        }
    }
}
