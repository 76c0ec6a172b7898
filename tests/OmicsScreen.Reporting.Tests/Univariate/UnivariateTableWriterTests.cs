using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Univariate;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Reporting.Tests.Univariate;

public class UnivariateTableWriterTests
{
    private const float Missing = float.NaN;
    private const float Censored = float.NegativeInfinity; // marker for the builder below only

    // Four cases then four controls; the positive class is case.
    private static Panel HandMadePanel(SampleGrouping? cohort = null) => BuildPanel(
        ["up", "censored", "=HYPERLINK(\"x\")", "centred"],
        [
            [10, 12, 14, 16, 2, 4, 6, 8],                  // every case above every control
            [5, 6, 7, 8, Censored, Censored, Censored, 3], // controls mostly below detection
            [1, Missing, 3, 4, 2, 2, Missing, 5],          // two missing cells
            [-1, 0, 1, 2, -2, -1, 0, 1],                   // medians around zero
        ],
        ["case", "control"], [0, 0, 0, 0, 1, 1, 1, 1], cohort);

    private static Dictionary<string, string>[] Parse(string tsv)
    {
        var lines = tsv.TrimEnd('\n').Split('\n');
        var header = lines[0].Split('\t');
        return lines.Skip(1).Select(line =>
        {
            var cells = line.Split('\t');
            Assert.Equal(header.Length, cells.Length);
            return header.Zip(cells).ToDictionary(pair => pair.First, pair => pair.Second);
        }).ToArray();
    }

    private static string WriteAll(UnivariateTable table)
    {
        var writer = new StringWriter();
        UnivariateTableWriter.WriteAllSamples(writer, table);
        return writer.ToString();
    }

    [Fact]
    public void Two_class_table_names_median_columns_after_the_classes()
    {
        string header = WriteAll(UnivariateScreen.Compute(HandMadePanel())).Split('\n')[0];
        Assert.Equal("feature\tcontrast\treference\tdirection\tcontrast_samples\treference_samples\tmedian_case\tmedian_control\t"
            + "median_note\tlog2_median_ratio\tauc\tauc_se\tauc_low95\tauc_high95\trank_test_u\trank_test_p\trank_test_q\t"
            + "missing_pct\tbelow_detection_pct", header);
    }

    [Fact]
    public void Rows_carry_the_hand_worked_statistics()
    {
        var rows = Parse(WriteAll(UnivariateScreen.Compute(HandMadePanel())));
        Assert.Equal(4, rows.Length);
        var up = rows[0];
        // Worked by hand: case median (12 + 14) / 2 = 13, control median (4 + 6) / 2 = 5, every case above every control.
        Assert.Equal(("up", "case", "control", "higher"), (up["feature"], up["contrast"], up["reference"], up["direction"]));
        Assert.Equal(("13", "5", ""), (up["median_case"], up["median_control"], up["median_note"]));
        Assert.Equal("1.3785", up["log2_median_ratio"]); // log2(13 / 5) = 1.37851
        Assert.Equal(("1.0000", "16", "0.00"), (up["auc"], up["rank_test_u"], up["missing_pct"]));
        Assert.Equal(("4", "4"), (up["contrast_samples"], up["reference_samples"]));

        var censored = rows[1];
        Assert.Equal(("NA", "reference_median_below_detection", "NA"), (censored["median_control"], censored["median_note"], censored["log2_median_ratio"]));
        Assert.Equal("37.50", censored["below_detection_pct"]); // 3 of 8 samples

        var formula = rows[2];
        Assert.Equal("'=HYPERLINK(\"x\")", formula["feature"]); // OWASP CSV injection guidance
        Assert.Equal(("lower", "25.00"), (formula["direction"], formula["missing_pct"]));
        Assert.Equal("0.4444", formula["auc"]); // 4 of 9 pairs won, worked by hand

        var centred = rows[3];
        Assert.Equal(("0.5", "-0.5", "non_positive_median", "NA"),
            (centred["median_case"], centred["median_control"], centred["median_note"], centred["log2_median_ratio"]));
    }

    [Fact]
    public void Per_cohort_rows_add_a_cohort_column()
    {
        var cohort = SampleGrouping.FromLabels("site", ["A", "A", "B", "B", "A", "A", "B", "B"]);
        var writer = new StringWriter();
        int count = UnivariateTableWriter.WritePerCohort(writer, UnivariateScreen.Compute(HandMadePanel(cohort)));
        var rows = Parse(writer.ToString());
        Assert.Equal(8, count);
        Assert.Equal(["A", "A", "A", "A", "B", "B", "B", "B"], rows.Select(row => row["cohort"]));
        Assert.Equal("feature\tcohort\tcontrast", string.Join('\t', writer.ToString().Split('\n')[0].Split('\t').Take(3)));
    }

    [Fact]
    public void Multi_class_table_compares_each_class_with_the_rest()
    {
        var panel = BuildPanel(["m"], [[1, 2, 3, 4, 5, 6]], ["a", "b", "c"], [0, 0, 1, 1, 2, 2]);
        var rows = Parse(WriteAll(UnivariateScreen.Compute(panel)));
        Assert.Equal(["a", "b", "c"], rows.Select(row => row["contrast"]));
        Assert.All(rows, row => Assert.Equal("rest", row["reference"]));
        Assert.Equal(("1.5", "4.5"), (rows[0]["median_contrast"], rows[0]["median_rest"])); // {1,2} against {3,4,5,6}
    }

    private static Panel BuildPanel(string[] featureNames, float[][] features, string[] classNames, int[] classes, SampleGrouping? cohort = null)
    {
        var sampleIds = Enumerable.Range(0, classes.Length).Select(sample => "S" + sample.ToString(System.Globalization.CultureInfo.InvariantCulture)).ToArray();
        var builder = new FeatureMatrixBuilder(featureNames, sampleIds);
        for (int feature = 0; feature < featureNames.Length; feature++)
            for (int sample = 0; sample < classes.Length; sample++)
            {
                float value = features[feature][sample];
                if (float.IsNaN(value)) builder.SetMissing(feature, sample);
                else if (float.IsNegativeInfinity(value)) builder.SetBelowDetection(feature, sample, float.NaN);
                else builder.SetMeasured(feature, sample, value);
            }
        return new Panel(builder.Build(), new ClassOutcome("outcome", classNames, classes), cohort);
    }
}
