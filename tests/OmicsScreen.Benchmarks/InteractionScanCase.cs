using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// One pairwise interaction scan as a screen runs it (<see cref="PairwiseInteractionScan"/>):
/// every feature and every decoy against every feature, on all samples, all cores. Prints the
/// pair count and nanoseconds per pair, the figures the automatic pair limit is set from. The
/// harness runs each case in a child process, so the panel is generated there, outside the scan's
/// own stopwatch (`scan_s`); `median_s` includes the generation.
/// </summary>
public sealed class InteractionScanCase : IBenchmarkCase
{
    private readonly int _sampleCount;
    private readonly int _featureCount;
    private readonly int _decoyCount;
    private Panel? _panel;
    private FeatureMatrix? _decoys;

    public InteractionScanCase(int sampleCount, int featureCount, int decoyCount)
    {
        _sampleCount = sampleCount;
        _featureCount = featureCount;
        _decoyCount = decoyCount;
    }

    public string Name => $"interaction-scan-{_sampleCount}x{_featureCount}";

    public void Prepare(string workDirectory) => Generate();

    private void Generate()
    {
        _panel = PlantedMarkerPanel.Generate(_sampleCount, _featureCount);
        _decoys = DecoyPlan.For(_featureCount, _decoyCount, 1).Values(_panel.Matrix);
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        if (_panel is null) Generate();
        var panel = _panel!;
        var rows = Enumerable.Range(0, panel.SampleCount).ToArray();
        var watch = Stopwatch.StartNew();
        var (statistics, _) = PairwiseInteractionScan.Scan(panel.Matrix, _decoys, panel.Outcome, rows);
        double seconds = watch.Elapsed.TotalSeconds;
        long pairs = (long)(_featureCount + _decoyCount) * _featureCount;
        return
        [
            string.Create(CultureInfo.InvariantCulture, $"pairs={pairs}"),
            string.Create(CultureInfo.InvariantCulture, $"scan_s={seconds:F2}"),
            string.Create(CultureInfo.InvariantCulture, $"ns_per_pair={1e9 * seconds / pairs:F2}"),
            string.Create(CultureInfo.InvariantCulture, $"largest_chi_square={statistics.Max():F1}"),
        ];
    }
}
