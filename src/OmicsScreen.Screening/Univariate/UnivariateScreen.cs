using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Screening.Univariate;

/// <summary>
/// Per-marker univariate statistics of a panel: for every feature and every contrast (the positive
/// class against the other class of a binary outcome; each class against the rest of a multi-class
/// outcome), medians, log2 ratio of medians, Mann-Whitney AUC with a DeLong interval, the rank-test
/// p-value, Benjamini-Hochberg q-values across features, and the share of missing and
/// below-detection cells, over all samples and optionally within each cohort.
/// </summary>
/// <remarks>
/// Missing cells are left out of every statistic. Below-detection cells count as values tied with
/// each other and below every measured value of the feature: the assay says they are lower than its
/// limit, and treating them as missing would drop exactly the samples where a marker is lowest.
/// A median that falls among them is reported as below detection instead of a number.
/// Features are processed in parallel; every result is stored by feature index, so the table does
/// not depend on the number of threads.
/// </remarks>
public static class UnivariateScreen
{
    /// <summary>The name used for the reference group of a multi-class contrast.</summary>
    public const string RestGroupName = "rest";

    public static UnivariateTable Compute(Panel panel, UnivariateOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(panel);
        options ??= UnivariateOptions.Default;
        var outcome = panel.Outcome;
        if (outcome.ClassCount < 2) throw new ArgumentException("A univariate contrast needs at least two outcome classes.", nameof(panel));
        int[] contrastClasses = outcome.ClassCount == 2 ? [outcome.PositiveClass] : Enumerable.Range(0, outcome.ClassCount).ToArray();
        var contrastNames = new string[contrastClasses.Length];
        var referenceNames = new string[contrastClasses.Length];
        for (int c = 0; c < contrastClasses.Length; c++)
        {
            contrastNames[c] = outcome.ClassNames[contrastClasses[c]];
            referenceNames[c] = outcome.ClassCount == 2 ? outcome.ClassNames[1 - contrastClasses[c]] : RestGroupName;
        }

        var allSamples = new int[panel.SampleCount];
        for (int s = 0; s < allSamples.Length; s++) allSamples[s] = s;
        var overall = ComputeScope(panel, allSamples, null, contrastClasses, contrastNames, referenceNames, options);

        var perCohort = new List<MarkerStatistics>();
        if (options.PerCohort && panel.Cohort is { } cohort)
        {
            for (int level = 0; level < cohort.LevelCount; level++)
            {
                var members = new List<int>();
                var levels = cohort.SampleLevels;
                for (int s = 0; s < levels.Length; s++)
                    if (levels[s] == level) members.Add(s);
                perCohort.AddRange(ComputeScope(panel, members.ToArray(), cohort.LevelNames[level], contrastClasses,
                    contrastNames, referenceNames, options));
            }
        }
        return new UnivariateTable(contrastNames, overall, perCohort);
    }

    /// <summary>
    /// Each feature's rank-test p-value on the given samples, as the screen combines it with the
    /// forest's: the Mann-Whitney test of the positive class against the other (two classes), or
    /// the smallest p over the class-against-rest contrasts times their number (Bonferroni) with
    /// more classes. Missing and below-detection cells are handled as in <see cref="Compute"/>.
    /// </summary>
    public static double[] RankTestPValues(FeatureMatrix matrix, ClassOutcome outcome, int[] samples, int threadCount = 0)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(outcome);
        ArgumentNullException.ThrowIfNull(samples);
        int[] contrastClasses = outcome.ClassCount == 2 ? [outcome.PositiveClass] : Enumerable.Range(0, outcome.ClassCount).ToArray();
        var pValues = new double[matrix.FeatureCount];
        var parallel = WorkerThreads.Options(threadCount);
        Parallel.For(0, matrix.FeatureCount, parallel,
            () => new FeatureRankWorkspace(samples.Length, outcome.ClassCount),
            (feature, _, workspace) =>
            {
                workspace.Load(matrix.Column(feature), matrix.States(feature), outcome.SampleClasses, samples);
                double smallest = double.NaN;
                foreach (int contrast in contrastClasses)
                {
                    var summary = workspace.Contrast(contrast);
                    double p = MannWhitney.FromRankSum(summary.ClassRankSum, summary.ClassCount, summary.RestCount, workspace.TieTerm).PValue;
                    if (!double.IsNaN(p) && !(p >= smallest)) smallest = p;
                }
                pValues[feature] = double.IsNaN(smallest) ? 1 : Math.Min(1, smallest * contrastClasses.Length);
                return workspace;
            },
            _ => { });
        return pValues;
    }

    private static MarkerStatistics[] ComputeScope(Panel panel, int[] scopeSamples, string? cohortName,
        int[] contrastClasses, string[] contrastNames, string[] referenceNames, UnivariateOptions options)
    {
        var matrix = panel.Matrix;
        int featureCount = matrix.FeatureCount, contrastCount = contrastClasses.Length;
        var rows = new MarkerStatistics[featureCount * contrastCount];
        double critical = NormalTail.TwoSidedCritical(options.ConfidenceLevel);
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = options.MaxDegreeOfParallelism };
        Parallel.For(0, featureCount, parallel,
            () => new FeatureRankWorkspace(scopeSamples.Length, panel.Outcome.ClassCount),
            (feature, _, workspace) =>
            {
                workspace.Load(matrix.Column(feature), matrix.States(feature), panel.Outcome.SampleClasses, scopeSamples);
                double scopeCount = scopeSamples.Length;
                double missingPercent = scopeCount > 0 ? 100.0 * workspace.MissingCount / scopeCount : double.NaN;
                double censoredPercent = scopeCount > 0 ? 100.0 * workspace.BelowDetectionCount / scopeCount : double.NaN;
                for (int c = 0; c < contrastCount; c++)
                {
                    var summary = workspace.Contrast(contrastClasses[c]);
                    var test = MannWhitney.FromRankSum(summary.ClassRankSum, summary.ClassCount, summary.RestCount, workspace.TieTerm);
                    double standardError = Math.Sqrt(summary.DeLongVariance);
                    var (ratio, reason) = Log2MedianRatio(summary);
                    rows[feature * contrastCount + c] = new MarkerStatistics(
                        feature, matrix.FeatureNames[feature], contrastNames[c], referenceNames[c], cohortName,
                        summary.ClassCount, summary.RestCount,
                        summary.ClassMedian, summary.ClassMedianBelowDetection,
                        summary.RestMedian, summary.RestMedianBelowDetection,
                        ratio, reason, DirectionOf(test.Auc), test.Auc, standardError,
                        AucInterval.Compute(test.Auc, standardError, options.ConfidenceLevel, critical, options.IntervalScale),
                        test.U, test.PValue, double.NaN, missingPercent, censoredPercent);
                }
                return workspace;
            },
            _ => { });

        // q-values across features, separately for each contrast.
        var pValues = new double[featureCount];
        var qValues = new double[featureCount];
        for (int c = 0; c < contrastCount; c++)
        {
            for (int f = 0; f < featureCount; f++) pValues[f] = rows[f * contrastCount + c].PValue;
            BenjaminiHochberg.Adjust(pValues, qValues);
            for (int f = 0; f < featureCount; f++)
                rows[f * contrastCount + c] = rows[f * contrastCount + c] with { QValue = qValues[f] };
        }
        return rows;
    }

    private static (double Ratio, RatioUnavailableReason Reason) Log2MedianRatio(in ContrastSummary summary)
    {
        if (summary.ClassMedianBelowDetection || summary.RestMedianBelowDetection)
            return (double.NaN, RatioUnavailableReason.MedianBelowDetection);
        if (double.IsNaN(summary.ClassMedian) || double.IsNaN(summary.RestMedian))
            return (double.NaN, RatioUnavailableReason.NoValues);
        if (summary.ClassMedian <= 0 || summary.RestMedian <= 0)
            return (double.NaN, RatioUnavailableReason.NonPositiveMedian);
        return (Math.Log2(summary.ClassMedian / summary.RestMedian), RatioUnavailableReason.None);
    }

    private static EffectDirection DirectionOf(double auc) =>
        double.IsNaN(auc) ? EffectDirection.Undetermined
        : auc > 0.5 ? EffectDirection.Higher
        : auc < 0.5 ? EffectDirection.Lower
        : EffectDirection.NoDifference;
}
