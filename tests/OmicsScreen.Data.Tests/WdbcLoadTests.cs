using System.Globalization;
using nietras.SeparatedValues;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Data.Tests;

/// <summary>
/// The Wisconsin Diagnostic Breast Cancer data (UCI, DOI 10.24432/C5DW2B; copy and reference
/// values documented in tests/OmicsScreen.TestSupport/reference/wdbc/README.md).
/// </summary>
public class WdbcLoadTests
{
    private static LoadedPanel LoadWdbc() => PanelLoader.Load(new PanelLoadOptions
    {
        MatrixPath = ReferenceData.Wdbc("wdbc.csv"),
        OutcomeColumn = "diagnosis",
    });

    [Fact]
    public void Wdbc_loads_without_a_sample_sheet_as_569_samples_30_features_212_malignant_357_benign()
    {
        var loaded = LoadWdbc();
        var panel = loaded.Panel;

        // Source: UCI WDBC / README "Class counts (verified): 212 malignant, 357 benign".
        Assert.Equal(569, panel.SampleCount);
        Assert.Equal(30, panel.FeatureCount);
        Assert.Equal(["benign", "malignant"], panel.Outcome.ClassNames);
        Assert.Equal([357, 212], panel.Outcome.ClassCounts.ToArray());
        Assert.Equal("malignant", panel.Outcome.ClassNames[panel.Outcome.PositiveClass]);
        Assert.Equal("S0001", panel.Matrix.SampleIds[0]);
        Assert.Equal("mean_radius", panel.Matrix.FeatureNames[0]);
        Assert.Equal("worst_fractal_dimension", panel.Matrix.FeatureNames[29]);
        // Source: wdbc.csv row S0001, value copied verbatim from the UCI text.
        Assert.Equal(17.99f, panel.Matrix.Value(0, 0));
        Assert.Equal(MatrixFileFormat.DelimitedText, loaded.Inspection.FileFormat);
        Assert.Equal("comma", loaded.Inspection.Delimiter);
        Assert.Equal(0, loaded.Inspection.MissingFraction);
        Assert.True(loaded.Inspection.CanScreen);
        Assert.DoesNotContain(loaded.Inspection.Findings, f => f.Code == "orientation-suspect");
    }

    [Fact]
    public void Wdbc_per_class_feature_means_match_the_reference_statistics_to_1e_6_relative()
    {
        var panel = LoadWdbc().Panel;
        int malignant = panel.Outcome.ClassNames.ToList().IndexOf("malignant");
        var classes = panel.Outcome.SampleClasses.ToArray();
        int checkedFeatures = 0;

        // Source: feature_stats.csv, per-class means computed by pandas from the UCI text values
        // (make_reference.py); float32 storage limits agreement to about 1e-6 relative (README).
        using var reader = Sep.Reader().FromFile(ReferenceData.Wdbc("feature_stats.csv"));
        foreach (var row in reader)
        {
            int feature = panel.Matrix.FeatureNames.ToList().IndexOf(row["feature"].ToString());
            Assert.True(feature >= 0);
            double expectedMalignant = double.Parse(row["mean_malignant"].Span, CultureInfo.InvariantCulture);
            double expectedBenign = double.Parse(row["mean_benign"].Span, CultureInfo.InvariantCulture);
            double sumMalignant = 0, sumBenign = 0;
            int countMalignant = 0, countBenign = 0;
            var values = panel.Matrix.Column(feature);
            for (int s = 0; s < values.Length; s++)
            {
                if (classes[s] == malignant) { sumMalignant += values[s]; countMalignant++; }
                else { sumBenign += values[s]; countBenign++; }
            }
            Assert.Equal(expectedMalignant, sumMalignant / countMalignant, expectedMalignant * 1e-6);
            Assert.Equal(expectedBenign, sumBenign / countBenign, expectedBenign * 1e-6);
            checkedFeatures++;
        }
        Assert.Equal(30, checkedFeatures);
    }

    [Fact]
    public void Wdbc_input_record_gives_the_byte_size_and_sha256_of_the_file()
    {
        var loaded = LoadWdbc();
        var input = Assert.Single(loaded.Inputs);
        // Source: README file table, wdbc.csv is 127,289 B.
        Assert.Equal(127_289, input.ByteCount);
        var expected = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(File.ReadAllBytes(input.Path)));
        Assert.Equal(expected, input.Sha256);
        Assert.Equal(64, input.Sha256.Length);
    }

    [Fact]
    public void Wdbc_converted_to_Parquet_and_Arrow_in_both_layouts_loads_identically()
    {
        var fromText = LoadWdbc().Panel;
        using var folder = new TempFolder();
        foreach (var layout in new[] { PanelLayout.SamplesInRows, PanelLayout.FeaturesInRows })
        {
            var parquet = folder.File($"wdbc-{layout}.parquet");
            var arrow = folder.File($"wdbc-{layout}.arrows");
            ParquetPanelWriter.Write(fromText, parquet, layout);
            ArrowPanelWriter.Write(fromText, arrow, layout, asStream: true);
            foreach (var path in new[] { parquet, arrow })
            {
                var loaded = PanelLoader.Load(new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "diagnosis", Layout = layout });
                PanelAssert.Identical(fromText, loaded.Panel);
            }
        }
    }
}
