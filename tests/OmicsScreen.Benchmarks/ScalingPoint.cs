namespace OmicsScreen.Benchmarks;

/// <summary>
/// The medians over runs of one scaling point. Times are for the point's own tree count;
/// memory figures are MiB (2^20 bytes) of resident memory.
/// </summary>
/// <param name="PeakMegabytes">High-water mark from after binning to the end of training: runtime, data held, forest and scratch.</param>
/// <param name="StartMegabytes">Resident size when the case began (runtime and compiled code only).</param>
/// <param name="DataMegabytes">Resident size with the raw and binned panel held, before training.</param>
public sealed record ScalingPoint(
    ScalingCase Case,
    double TrainSeconds,
    double TrainCpuSeconds,
    double PermutationSeconds,
    double PermutationCpuSeconds,
    double CopyCpuSeconds,
    double BinSeconds,
    double BinCpuSeconds,
    double PeakMegabytes,
    double StartMegabytes,
    double DataMegabytes,
    double MeanNodes)
{
    public static ScalingPoint From(ScalingCase point, BenchmarkMeasurement measurement) => new(
        point,
        measurement.MedianFigure("train_s"),
        measurement.MedianFigure("train_cpu_s"),
        measurement.MedianFigure("perm_s"),
        measurement.MedianFigure("perm_cpu_s"),
        measurement.MedianFigure("copy_cpu_s"),
        measurement.MedianFigure("bin_s"),
        measurement.MedianFigure("bin_cpu_s"),
        measurement.MedianFigure("train_peak_mb"),
        measurement.MedianFigure("start_mb"),
        measurement.MedianFigure("data_mb"),
        measurement.MedianFigure("mean_nodes"));

    public int SampleCount => Case.SampleCount;
    public int FeatureCount => Case.FeatureCount;
    public int TreeCount => Case.TreeCount;

    /// <summary>A time of this point scaled linearly to the screen's tree count.</summary>
    public double AtScreenTrees(double seconds) => seconds * ScalingPlan.ScreenTrees / TreeCount;

    /// <summary>
    /// Peak memory had the point grown the screen's tree count: the measured peak plus (or minus)
    /// the missing trees at the measured cost of one stored tree.
    /// </summary>
    public double PeakAtScreenTrees(double megabytesPerTreeNode) =>
        PeakMegabytes + (ScalingPlan.ScreenTrees - TreeCount) * MeanNodes * megabytesPerTreeNode;
}
