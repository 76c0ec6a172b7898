using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Tests.Support;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Tests.Univariate;

public class UnivariateScreenTests
{
    private const float Missing = float.NaN;
    private const float Censored = float.NegativeInfinity; // marker for the test builder only

    // Four cases then four controls. Class codes: case = 0, control = 1; the positive class is case.
    private static Panel HandMadePanel(SampleGrouping? cohort = null)
    {
        float[][] features =
        [
            [10, 12, 14, 16, 2, 4, 6, 8],                              // up: every case above every control
            [5, 6, 7, 8, Censored, Censored, Censored, 3],             // censored: controls mostly below detection
            [1, Missing, 3, 4, 2, 2, Missing, 5],                      // missing: two missing cells
            [-1, 0, 1, 2, -2, -1, 0, 1],                               // centred: medians around zero
        ];
        return BuildPanel(["up", "censored", "missing", "centred"], features, ["case", "control"], [0, 0, 0, 0, 1, 1, 1, 1], cohort);
    }

    [Fact]
    public void Hand_made_panel_gives_direction_medians_and_auc_worked_by_hand()
    {
        var table = UnivariateScreen.Compute(HandMadePanel());
        Assert.Equal(["case"], table.Contrasts);
        Assert.Equal(4, table.AllSamples.Count);

        var up = table.Row(0, 0);
        Assert.Equal(("case", "control", (string?)null), (up.ContrastClass, up.ReferenceGroup, up.Cohort));
        Assert.Equal(EffectDirection.Higher, up.Direction);
        Assert.Equal(1.0, up.Auc);
        Assert.Equal(13, up.ClassMedian);   // (12 + 14) / 2
        Assert.Equal(5, up.RestMedian);     // (4 + 6) / 2
        Assert.Equal(Math.Log2(13.0 / 5), up.Log2MedianRatio, 14);
        Assert.Equal(RatioUnavailableReason.None, up.RatioUnavailable);
        Assert.Equal(0, up.MissingPercent);
        Assert.Equal(16, up.U);

        var missing = table.Row(2, 0);
        // Cases {1, 3, 4} against controls {2, 2, 5}: wins 0 + 2 + 2 = 4 of 9 pairs.
        Assert.Equal(4.0 / 9, missing.Auc, 14);
        Assert.Equal(EffectDirection.Lower, missing.Direction);
        Assert.Equal((3, 3), (missing.ClassSampleCount, missing.RestSampleCount));
        Assert.Equal(3, missing.ClassMedian);
        Assert.Equal(2, missing.RestMedian);
        Assert.Equal(25, missing.MissingPercent);

        var centred = table.Row(3, 0);
        Assert.Equal(0.5, centred.ClassMedian);
        Assert.Equal(-0.5, centred.RestMedian);
        Assert.True(double.IsNaN(centred.Log2MedianRatio));
        Assert.Equal(RatioUnavailableReason.NonPositiveMedian, centred.RatioUnavailable);
    }

    [Fact]
    public void Below_detection_cells_tie_below_every_measured_value()
    {
        var censored = UnivariateScreen.Compute(HandMadePanel()).Row(1, 0);
        // Controls: three below detection and 3; all four cases (5..8) beat all of them: AUC 1.
        Assert.Equal(1.0, censored.Auc);
        Assert.Equal(37.5, censored.BelowDetectionPercent);
        Assert.Equal(0, censored.MissingPercent);
        Assert.Equal(4, censored.RestSampleCount);
        // The control median sits among the censored cells, so it is only known to be under the limit.
        Assert.True(censored.RestMedianBelowDetection);
        Assert.True(double.IsNaN(censored.RestMedian));
        Assert.Equal(6.5, censored.ClassMedian);
        Assert.Equal(RatioUnavailableReason.MedianBelowDetection, censored.RatioUnavailable);
        // The rank test sees the censored cells as one tie at the bottom: same as MannWhitney with -infinity.
        var reference = MannWhitney.Test([5.0, 6, 7, 8], [double.NegativeInfinity, double.NegativeInfinity, double.NegativeInfinity, 3]);
        Assert.Equal(reference.PValue, censored.PValue, 14);
    }

    [Fact]
    public void Censored_cells_lower_the_auc_of_a_class_they_belong_to()
    {
        // Cases: 4, below detection, below detection; controls: 1, 2, 3. The censored cases lose
        // to every control: wins 3 + 0 + 0 of 9 pairs.
        var panel = BuildPanel(["f"], [[4, Censored, Censored, 1, 2, 3]], ["case", "control"], [0, 0, 0, 1, 1, 1]);
        var row = UnivariateScreen.Compute(panel).Row(0, 0);
        Assert.Equal(3.0 / 9, row.Auc, 14);
        Assert.True(row.ClassMedianBelowDetection);
    }

    [Fact]
    public void Auc_standard_error_and_p_value_equal_the_toolkit_functions_on_random_tied_censored_data()
    {
        var random = new Random(31);
        int sampleCount = 90;
        var classes = Enumerable.Range(0, sampleCount).Select(_ => random.Next(2)).ToArray();
        var features = new float[25][];
        for (int f = 0; f < features.Length; f++)
            features[f] = Enumerable.Range(0, sampleCount).Select(s =>
                random.Next(10) == 0 ? Censored : random.Next(15) == 0 ? Missing : (float)(random.Next(8) + classes[s] * (f % 3))).ToArray();
        var panel = BuildPanel(Enumerable.Range(0, features.Length).Select(f => $"f{f}").ToArray(), features, ["a", "b"], classes);
        var table = UnivariateScreen.Compute(panel);
        int positive = panel.Outcome.PositiveClass;

        var pValues = new double[features.Length];
        for (int f = 0; f < features.Length; f++)
        {
            var usable = Enumerable.Range(0, sampleCount).Where(s => !float.IsNaN(features[f][s])).ToArray();
            var inClass = usable.Where(s => classes[s] == positive).Select(s => (double)features[f][s]).ToArray();
            var rest = usable.Where(s => classes[s] != positive).Select(s => (double)features[f][s]).ToArray();
            var row = table.Row(f, 0);
            var test = MannWhitney.Test(inClass, rest);
            var delong = DeLong.EstimateByPairs(inClass, rest);
            Assert.Equal(test.Auc, row.Auc, 12);
            Assert.Equal(test.PValue, row.PValue, 12);
            Assert.Equal(delong.StandardError, row.AucStandardError, 12);
            var interval = AucInterval.Compute(delong.Auc, delong.StandardError);
            Assert.Equal(interval.Lower, row.AucInterval.Lower, 12);
            Assert.Equal(interval.Upper, row.AucInterval.Upper, 12);
            pValues[f] = test.PValue;
        }
        var q = BenjaminiHochberg.Adjust(pValues);
        for (int f = 0; f < features.Length; f++) Assert.Equal(q[f], table.Row(f, 0).QValue, 12);
    }

    [Fact]
    public void Negative_zero_subnormal_and_extreme_values_rank_as_their_numeric_order()
    {
        // -0 and +0 are equal and must tie; negatives, subnormals and the float extremes must keep
        // their numeric order, as the doubles given to MannWhitney.Test do.
        float[] values = [-3.5f, -0.0f, 0.0f, 2f, -1e-30f, float.MaxValue, -float.MaxValue, 1e-45f, -1e-45f, 0.0f, -2f, 7f];
        int[] classes = [0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1];
        var row = UnivariateScreen.Compute(BuildPanel(["f"], [values], ["a", "b"], classes, positiveClass: 0)).Row(0, 0);
        var inClass = Enumerable.Range(0, values.Length).Where(s => classes[s] == 0).Select(s => (double)values[s]).ToArray();
        var rest = Enumerable.Range(0, values.Length).Where(s => classes[s] == 1).Select(s => (double)values[s]).ToArray();
        var expected = MannWhitney.Test(inClass, rest);
        Assert.Equal(expected.U, row.U);
        Assert.Equal(expected.PValue, row.PValue, 14);
        Assert.Equal(Quantile.MedianOfSorted(inClass.Order().ToArray()), row.ClassMedian);
        Assert.Equal(Quantile.MedianOfSorted(rest.Order().ToArray()), row.RestMedian);
    }

    [Fact]
    public void Wdbc_table_matches_the_scipy_reference_statistics()
    {
        // Source: reference/wdbc/feature_stats.csv (scipy.stats.mannwhitneyu, numpy median, BH).
        // The panel stores float32, which keeps the order of these values, so rank statistics stay
        // exact; medians carry float32 rounding (about 1e-7 relative).
        var data = WdbcFeatureStatistics.Instance;
        var features = data.Columns.Select(c => c.Select(v => (float)v).ToArray()).ToArray();
        var classes = data.Diagnosis.Select(d => d == "benign" ? 0 : 1).ToArray();
        var panel = BuildPanel(data.FeatureNames, features, ["benign", "malignant"], classes, positiveClass: 1);
        var table = UnivariateScreen.Compute(panel);
        for (int f = 0; f < data.FeatureNames.Length; f++)
        {
            var expected = data.FeatureStats[data.FeatureNames[f]];
            var row = table.Row(f, 0);
            Assert.Equal(("malignant", "benign"), (row.ContrastClass, row.ReferenceGroup));
            Tolerance.Relative(expected["auc_malignant"], row.Auc, 1e-9, row.Feature + " AUC");
            Tolerance.Relative(expected["mw_u_malignant"], row.U, 1e-9, row.Feature + " U");
            Tolerance.Relative(expected["mw_p"], row.PValue, 1e-6, row.Feature + " p");
            Tolerance.Relative(expected["mw_p_bh"], row.QValue, 1e-6, row.Feature + " q");
            Tolerance.Relative(expected["median_malignant"], row.ClassMedian, 1e-6, row.Feature + " median");
            Tolerance.Relative(expected["median_benign"], row.RestMedian, 1e-6, row.Feature + " median");
            Assert.Equal(expected["auc_malignant"] > 0.5 ? EffectDirection.Higher : EffectDirection.Lower, row.Direction);
        }
    }

    [Fact]
    public void Multi_class_outcome_gives_one_row_per_class_against_the_rest()
    {
        var random = new Random(4);
        var classes = Enumerable.Range(0, 60).Select(s => s % 3).ToArray();
        float[][] features = [classes.Select(c => (float)(c * 2 + random.Next(3))).ToArray()];
        var panel = BuildPanel(["f"], features, ["x", "y", "z"], classes);
        var table = UnivariateScreen.Compute(panel);
        Assert.Equal(["x", "y", "z"], table.Contrasts);
        Assert.Equal(3, table.AllSamples.Count);
        for (int c = 0; c < 3; c++)
        {
            var row = table.Row(0, c);
            Assert.Equal(UnivariateScreen.RestGroupName, row.ReferenceGroup);
            var inClass = Enumerable.Range(0, 60).Where(s => classes[s] == c).Select(s => (double)features[0][s]).ToArray();
            var rest = Enumerable.Range(0, 60).Where(s => classes[s] != c).Select(s => (double)features[0][s]).ToArray();
            Assert.Equal(MannWhitney.Test(inClass, rest).Auc, row.Auc, 14);
            Assert.Equal((20, 40), (row.ClassSampleCount, row.RestSampleCount));
        }
        Assert.Equal(EffectDirection.Lower, table.Row(0, 0).Direction);
        Assert.Equal(EffectDirection.Higher, table.Row(0, 2).Direction);
    }

    [Fact]
    public void Cohort_rows_equal_the_table_of_each_cohort_alone()
    {
        var cohort = SampleGrouping.FromLabels("site", ["A", "B", "A", "B", "B", "A", "A", "B"]);
        var panel = HandMadePanel(cohort);
        var table = UnivariateScreen.Compute(panel);
        Assert.Equal(2 * panel.FeatureCount, table.PerCohort.Count);
        for (int level = 0; level < 2; level++)
        {
            var members = Enumerable.Range(0, 8).Where(s => cohort.SampleLevels[s] == level).ToArray();
            var alone = UnivariateScreen.Compute(panel.SelectSamples(members), new UnivariateOptions(PerCohort: false));
            for (int f = 0; f < panel.FeatureCount; f++)
                Assert.Equal(alone.AllSamples[f] with { Cohort = cohort.LevelNames[level] }, table.PerCohort[level * panel.FeatureCount + f]);
        }
        Assert.Empty(UnivariateScreen.Compute(panel, new UnivariateOptions(PerCohort: false)).PerCohort);
    }

    [Fact]
    public void One_thread_and_many_threads_give_identical_tables()
    {
        var random = new Random(12);
        var classes = Enumerable.Range(0, 200).Select(_ => random.Next(3)).ToArray();
        var features = new float[300][];
        for (int f = 0; f < features.Length; f++)
            features[f] = Enumerable.Range(0, 200).Select(s => random.Next(20) == 0 ? Missing : (float)(random.NextDouble() + 0.1 * classes[s])).ToArray();
        var cohort = new SampleGrouping("batch", ["b1", "b2"], classes.Select(_ => random.Next(2)).ToArray());
        var panel = BuildPanel(Enumerable.Range(0, 300).Select(f => $"f{f}").ToArray(), features, ["a", "b", "c"], classes, cohort: cohort);
        var single = UnivariateScreen.Compute(panel, new UnivariateOptions(MaxDegreeOfParallelism: 1));
        var many = UnivariateScreen.Compute(panel, new UnivariateOptions(MaxDegreeOfParallelism: 4));
        Assert.Equal(single.AllSamples, many.AllSamples);
        Assert.Equal(single.PerCohort, many.PerCohort);
    }

    [Fact]
    public void A_class_absent_from_the_scope_gives_undetermined_rows()
    {
        var panel = BuildPanel(["f"], [[1, 2, 3]], ["case", "control"], [1, 1, 1], positiveClass: 0);
        var row = UnivariateScreen.Compute(panel).Row(0, 0);
        Assert.Equal(EffectDirection.Undetermined, row.Direction);
        Assert.True(double.IsNaN(row.Auc) && double.IsNaN(row.PValue) && double.IsNaN(row.QValue));
        Assert.Equal(RatioUnavailableReason.NoValues, row.RatioUnavailable);
    }

    /// <summary>Builds a panel; NaN marks a missing cell and negative infinity a below-detection cell without a limit.</summary>
    private static Panel BuildPanel(string[] featureNames, float[][] features, string[] classNames, int[] classes,
        SampleGrouping? cohort = null, int positiveClass = -1)
    {
        var sampleIds = Enumerable.Range(0, classes.Length).Select(s => $"S{s}").ToArray();
        var builder = new FeatureMatrixBuilder(featureNames, sampleIds);
        for (int f = 0; f < featureNames.Length; f++)
            for (int s = 0; s < classes.Length; s++)
            {
                float value = features[f][s];
                if (float.IsNaN(value)) builder.SetMissing(f, s);
                else if (float.IsNegativeInfinity(value)) builder.SetBelowDetection(f, s, float.NaN);
                else builder.SetMeasured(f, s, value);
            }
        return new Panel(builder.Build(), new ClassOutcome("outcome", classNames, classes, positiveClass), cohort);
    }
}
