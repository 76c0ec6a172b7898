using MathNet.Numerics.Distributions;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;
using OmicsScreen.Screening.Work;
using OmicsScreen.Engine.Parallelism;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// Checks that top markers hold across cohorts and are not cohort or batch artefacts: each
/// cohort's own screen and their concordance, per-marker heterogeneity, a forest that predicts
/// the cohort, the outcome-cohort association, and leave-one-cohort-out validation.
/// </summary>
internal static class CohortAnalysis
{
    /// <summary>A cohort gets its own screen (and is held out) only with this many samples in every class.</summary>
    public const int MinimumSamplesPerClass = 5;

    /// <summary>One-cohort-against-the-rest AUC from which a marker counts as separating cohorts.</summary>
    private const double StrongCohortSeparation = 0.75;

    /// <summary>
    /// Smallest spread of within-cohort AUCs (largest minus smallest) a heterogeneity flag needs
    /// besides a significant Cochran's Q: with many samples a tiny difference is significant and
    /// of no consequence to a lab (common practice: a test and an effect size together).
    /// </summary>
    private const double HeterogeneityMinimumAucSpread = 0.10;

    private const double ConfoundingCramersV = 0.5;

    /// <summary>The cohort check; progress is reported per cohort screen, and every inner screen honours the context's cancellation.</summary>
    public static CohortResult Run(ScreenContext context, IReadOnlyList<int> order, UnivariateTable univariate, ScreenWork work)
    {
        var (panel, matrix, settings) = (context.Panel, context.Matrix, context.Settings);
        var cohort = panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var outcome = panel.Outcome;
        var options = settings.Options;
        var cancellation = context.Cancellation;
        void Done(int step, int total) => context.Report(ScreenStage.Cohorts, step, total);
        int featureCount = panel.FeatureCount;
        var levels = cohort.SampleLevels.ToArray();
        var rowsOf = RowsOfCohorts(panel);
        var screenable = ScreenableCohorts(panel, rowsOf);
        var heldOutCohorts = HeldOutCohorts(panel, screenable);
        int steps = screenable.Length + heldOutCohorts.Length + 1, done = 0;

        // Each cohort's own screen.
        var cohortOrders = new Dictionary<int, int[]>();
        var cohortImportance = new Dictionary<int, double[]>();
        foreach (int c in screenable)
        {
            cancellation.ThrowIfCancellationRequested();
            var screen = work.CohortScreen(c);
            cohortOrders[c] = screen.Order;
            cohortImportance[c] = screen.MeanCorrected;
            Done(++done, steps);
        }
        var concordance = new List<CohortConcordance>();
        for (int i = 0; i < screenable.Length; i++)
            for (int j = i + 1; j < screenable.Length; j++)
            {
                int a = screenable[i], b = screenable[j];
                concordance.Add(Concord(cohort.LevelNames[a], cohort.LevelNames[b], cohortImportance[a], cohortImportance[b],
                    cohortOrders[a], cohortOrders[b]));
            }

        // How well the features predict the cohort, and each feature's importance for it.
        var cohortOutcome = new ClassOutcome(cohort.ColumnName, cohort.LevelNames, levels);
        var cohortOptions = settings.ForestOptions(panel.Subject, RandomStreams.CohortForest(options.Seed));
        var cohortForest = ForestTrainer.Train(matrix, cohortOutcome, cohortOptions with
        {
            Sampling = cohortOptions.Sampling with { ClassBalanced = false },
        });
        double cohortAccuracy = 1 - new OutOfBagVotes(cohortForest, cohortOutcome).Error;
        var cohortImportanceRank = RankDescending(ImpurityImportance.From(cohortForest).MeanDecrease);
        double largestShare = rowsOf.Max(r => r.Length) / (double)panel.SampleCount;
        Done(++done, steps);

        var (cramersV, associationP) = OutcomeCohortAssociation(outcome, cohort);

        // Per-marker heterogeneity of every feature, in the screen's order; features are
        // independent, so they run in parallel and are gathered by index.
        int positiveContrast = Math.Max(0, univariate.Contrasts.ToList().IndexOf(outcome.ClassNames[outcome.PositiveClass]));
        var markers = new MarkerHeterogeneity[featureCount];
        Parallel.For(0, featureCount, WorkerThreads.Options(context.ThreadCount),
            i => markers[i] = Heterogeneity(panel, univariate, order[i], positiveContrast, cohortImportanceRank[order[i]]));
        FlagHeterogeneity(markers, options.QValueThreshold);

        // Leave one cohort out: screen the others, score the held-out one.
        var heldOut = LeaveOneCohortOut.Validate(context, work, heldOutCohorts, rowsOf, () => Done(++done, steps));

        return new CohortResult(cohort.ColumnName, cohort.LevelNames, screenable.Select(c => cohort.LevelNames[c]).ToArray(),
            concordance, markers, heldOut, cohortAccuracy, largestShare, cramersV, associationP, cramersV >= ConfoundingCramersV);
    }

    /// <summary>The samples of each cohort, by cohort level.</summary>
    internal static int[][] RowsOfCohorts(Panel panel)
    {
        var cohort = panel.Cohort ?? throw new ArgumentException("The panel names no cohort.");
        var levels = cohort.SampleLevels;
        var rows = new List<int>[cohort.LevelCount];
        for (int c = 0; c < rows.Length; c++) rows[c] = [];
        for (int s = 0; s < levels.Length; s++) rows[levels[s]].Add(s);
        return rows.Select(r => r.ToArray()).ToArray();
    }

    /// <summary>Cohorts with enough samples of every class for a screen of their own.</summary>
    internal static int[] ScreenableCohorts(Panel panel, int[][] rowsOf) =>
        Enumerable.Range(0, rowsOf.Length).Where(c => HasEnoughOfEachClass(rowsOf[c], panel.Outcome)).ToArray();

    /// <summary>Screenable cohorts whose complement also has enough of every class to be screened and scored on them.</summary>
    internal static int[] HeldOutCohorts(Panel panel, int[] screenable) =>
        screenable.Where(c => HasEnoughOfEachClass(TrainingRowsWithout(panel, c), panel.Outcome)).ToArray();

    /// <summary>All samples outside cohort <paramref name="held"/>.</summary>
    internal static int[] TrainingRowsWithout(Panel panel, int held)
    {
        var levels = panel.Cohort!.SampleLevels;
        var rows = new List<int>(levels.Length);
        for (int s = 0; s < levels.Length; s++) if (levels[s] != held) rows.Add(s);
        return rows.ToArray();
    }

    internal static ulong CohortScreenSeed(ScreenOptions options, int cohort) =>
        RandomStreams.CohortScreenSeed(options.Seed, cohort);

    internal static ulong HeldOutSeed(ScreenOptions options, int cohort) =>
        RandomStreams.HeldOutScreenSeed(options.Seed, cohort);

    private static bool HasEnoughOfEachClass(int[] rows, ClassOutcome outcome)
    {
        var counts = new int[outcome.ClassCount];
        foreach (int row in rows) counts[outcome.SampleClasses[row]]++;
        return counts.All(n => n >= MinimumSamplesPerClass);
    }

    internal static double[] MeanCorrected(RepeatImportances repeats)
    {
        var mean = new double[repeats.FeatureCount];
        for (int r = 0; r < repeats.RepeatCount; r++)
            for (int f = 0; f < repeats.FeatureCount; f++) mean[f] += repeats.Corrected[r * repeats.FeatureCount + f] / repeats.RepeatCount;
        return mean;
    }

    internal static CohortConcordance Concord(string first, string second, double[] importanceA, double[] importanceB, int[] orderA, int[] orderB)
    {
        const int rboDepth = 100;
        double Overlap(int k)
        {
            k = Math.Min(k, orderA.Length);
            return RankBiasedOverlap.TopOverlap<int>(orderA.AsSpan(0, k), orderB.AsSpan(0, k), k);
        }
        int depth = Math.Min(rboDepth, orderA.Length);
        return new CohortConcordance(first, second, Correlation.Spearman(importanceA, importanceB), Overlap(10), Overlap(20), Overlap(50),
            RankBiasedOverlap.Extrapolated<int>(orderA.AsSpan(0, depth), orderB.AsSpan(0, depth), 0.9));
    }

    private static MarkerHeterogeneity Heterogeneity(Panel panel, UnivariateTable univariate, int feature, int contrast, int cohortRank)
    {
        var cohort = panel.Cohort!;
        int perCohort = panel.FeatureCount * univariate.Contrasts.Count;
        var effects = new List<CohortEffect>();
        var estimates = new List<double>();
        var variances = new List<double>();
        for (int c = 0; c < cohort.LevelCount; c++)
        {
            var row = univariate.PerCohort[c * perCohort + feature * univariate.Contrasts.Count + contrast];
            effects.Add(new CohortEffect(cohort.LevelNames[c], row.ClassSampleCount + row.RestSampleCount, row.Log2MedianRatio,
                row.Auc, row.AucStandardError, row.AucInterval));
            if (double.IsFinite(row.Auc) && row.AucStandardError > 0)
            {
                estimates.Add(row.Auc);
                variances.Add(row.AucStandardError * row.AucStandardError);
            }
        }
        var within = estimates.Count >= 2 ? RandomEffectsMetaAnalysis.DerSimonianLaird(estimates.ToArray(), variances.ToArray()) : null;
        var pooled = univariate.Row(feature, contrast);
        var (separation, separated) = CohortSeparation(panel.Matrix, feature, cohort);

        // An artefact: the pooled samples show an effect, the cohorts differ strongly, and within
        // cohorts there is no consistent effect (the pooled within-cohort interval spans 0.5).
        bool pooledEffect = !(pooled.AucInterval.Lower <= 0.5 && pooled.AucInterval.Upper >= 0.5);
        bool noWithinEffect = within is not null && within.RandomInterval.Lower <= 0.5 && within.RandomInterval.Upper >= 0.5;
        // Heterogeneity is flagged afterwards, across all features at once (FlagHeterogeneity).
        var flag = pooledEffect && noWithinEffect && separation >= StrongCohortSeparation ? CohortFlag.CohortArtefact : CohortFlag.None;
        return new MarkerHeterogeneity(feature, panel.Matrix.FeatureNames[feature], effects, within, pooled.Auc, pooled.AucInterval,
            separation, separated, cohortRank, flag);
    }

    /// <summary>The cohort that the feature separates best from the others, by Mann-Whitney AUC folded to at least 0.5.</summary>
    private static (double Auc, string Cohort) CohortSeparation(FeatureMatrix matrix, int feature, SampleGrouping cohort)
    {
        var values = new List<double>[cohort.LevelCount];
        for (int c = 0; c < values.Length; c++) values[c] = [];
        var column = matrix.Column(feature);
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            var state = matrix.State(feature, s);
            if (state == CellState.Missing) continue;
            values[cohort.SampleLevels[s]].Add(state == CellState.BelowDetection ? double.NegativeInfinity : column[s]);
        }
        double best = 0.5;
        string bestCohort = cohort.LevelNames[0];
        for (int c = 0; c < values.Length; c++)
        {
            var rest = values.Where((_, i) => i != c).SelectMany(v => v).ToArray();
            if (values[c].Count == 0 || rest.Length == 0) continue;
            double auc = MannWhitney.Test(values[c].ToArray(), rest).Auc;
            double folded = Math.Max(auc, 1 - auc);
            if (folded > best)
            {
                best = folded;
                bestCohort = cohort.LevelNames[c];
            }
        }
        return (best, bestCohort);
    }

    /// <summary>Cramer's V of the class x cohort table (Cramer 1946) with the chi-square test of independence.</summary>
    internal static (double CramersV, double PValue) OutcomeCohortAssociation(ClassOutcome outcome, SampleGrouping cohort)
    {
        int rows = outcome.ClassCount, columns = cohort.LevelCount, n = outcome.SampleCount;
        var table = new double[rows, columns];
        for (int s = 0; s < n; s++) table[outcome.SampleClasses[s], cohort.SampleLevels[s]]++;
        var rowSums = new double[rows];
        var columnSums = new double[columns];
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                rowSums[r] += table[r, c];
                columnSums[c] += table[r, c];
            }
        double chiSquare = 0;
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                double expected = rowSums[r] * columnSums[c] / n;
                if (expected > 0) chiSquare += (table[r, c] - expected) * (table[r, c] - expected) / expected;
            }
        int usedRows = rowSums.Count(x => x > 0), usedColumns = columnSums.Count(x => x > 0);
        int smaller = Math.Min(usedRows, usedColumns) - 1;
        if (smaller < 1) return (double.NaN, double.NaN);
        double v = Math.Sqrt(chiSquare / (n * smaller));
        int degrees = (usedRows - 1) * (usedColumns - 1);
        return (v, ChiSquared.CDF(degrees, chiSquare) is var cdf ? 1 - cdf : double.NaN);
    }

    /// <summary>
    /// Flags a marker as heterogeneous when Cochran's Q test of its within-cohort AUCs survives
    /// Benjamini-Hochberg (1995) adjustment across all features at the screen's level, and its
    /// within-cohort AUCs spread by at least <see cref="HeterogeneityMinimumAucSpread"/>. An
    /// artefact flag is kept as it is. Every marker gets its Q test's q-value.
    /// </summary>
    internal static void FlagHeterogeneity(MarkerHeterogeneity[] markers, double level)
    {
        var pValues = new double[markers.Length];
        for (int i = 0; i < markers.Length; i++)
        {
            double p = markers[i].WithinCohort?.QPValue ?? double.NaN;
            pValues[i] = double.IsNaN(p) ? 1 : p;
        }
        var qValues = BenjaminiHochberg.Adjust(pValues);
        for (int i = 0; i < markers.Length; i++)
        {
            var marker = markers[i];
            double low = double.PositiveInfinity, high = double.NegativeInfinity;
            foreach (var effect in marker.Effects)
                if (double.IsFinite(effect.Auc))
                {
                    low = Math.Min(low, effect.Auc);
                    high = Math.Max(high, effect.Auc);
                }
            bool heterogeneous = marker.WithinCohort is not null && qValues[i] <= level && high - low >= HeterogeneityMinimumAucSpread;
            markers[i] = marker with
            {
                HeterogeneityQValue = marker.WithinCohort is null ? double.NaN : qValues[i],
                Flag = marker.Flag == CohortFlag.None && heterogeneous ? CohortFlag.Heterogeneous : marker.Flag,
            };
        }
    }

    private static int[] RankDescending(ReadOnlySpan<double> values)
    {
        var copy = values.ToArray();
        var order = Enumerable.Range(0, copy.Length).ToArray();
        Array.Sort(order, (a, b) => copy[a] != copy[b] ? copy[b].CompareTo(copy[a]) : a.CompareTo(b));
        var ranks = new int[copy.Length];
        for (int i = 0; i < order.Length; i++) ranks[order[i]] = i + 1;
        return ranks;
    }
}
