using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Data.Writing;

namespace OmicsScreen.Data.Tests.Inspection;

public sealed class PanelInspectionTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Sample_ids_that_differ_only_by_case_are_kept_apart_and_pointed_out()
    {
        var path = _folder.File("cased.csv");
        File.WriteAllText(path, "sample_id,status,M1,m1,M2\nP001,case,1,2,3\np001,control,2,3,4\nP002,case,3,1,5\nP003,control,4,2,6\n");
        var loaded = PanelLoader.Load(new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "status" });

        Assert.Equal(4, loaded.Panel.SampleCount);
        Assert.Equal(3, loaded.Panel.FeatureCount);
        var findings = loaded.Inspection.Findings.Where(f => f.Code == "names-differ-only-by-case").ToList();
        Assert.Equal(2, findings.Count);
        Assert.Contains(findings, f => f.Message.Contains("sample ids") && f.Message.Contains("'P001' and 'p001'"));
        Assert.Contains(findings, f => f.Message.Contains("feature names") && f.Message.Contains("'M1' and 'm1'"));
        Assert.All(findings, f => Assert.Equal(FindingSeverity.Warning, f.Severity));
        Assert.True(loaded.Inspection.CanScreen);
    }

    [Fact]
    public void A_cohort_column_with_more_levels_than_the_cohort_check_takes_is_an_error_with_the_fix()
    {
        // Common practice of this project: the cohort check seeds each cohort's screens from a family
        // of at most 999; a thousand cohorts is almost always a sample id named as the cohort.
        var path = _folder.File("many-cohorts.csv");
        var rows = Enumerable.Range(0, 1000).Select(i => $"S{i},{(i % 2 == 0 ? "case" : "control")},C{i},{i % 7},{i % 5}");
        File.WriteAllText(path, "sample_id,status,centre,M1,M2\n" + string.Join("\n", rows) + "\n");
        var loaded = PanelLoader.Load(new PanelLoadOptions { MatrixPath = path, OutcomeColumn = "status", CohortColumn = "centre" });
        var finding = Assert.Single(loaded.Inspection.Findings, f => f.Code == "too-many-cohorts");
        Assert.Equal(FindingSeverity.Error, finding.Severity);
        Assert.Contains("1000 different values", finding.Message);
        Assert.Contains("--cohort", finding.Message);
        Assert.False(loaded.Inspection.CanScreen);
    }

    [Fact]
    public void Inspection_counts_classes_cohorts_and_the_class_by_cohort_table()
    {
        var path = _folder.File("panel.parquet");
        ParquetPanelWriter.Write(SyntheticPanels.Mixed(), path, PanelLayout.SamplesInRows);
        var inspection = PanelLoader.Load(SyntheticPanels.MixedOptions(path, PanelLayout.SamplesInRows)).Inspection;

        Assert.Equal(MatrixFileFormat.Parquet, inspection.FileFormat);
        Assert.Null(inspection.Delimiter);
        Assert.Equal(12, inspection.SampleCount);
        Assert.Equal(6, inspection.FeatureCount);
        // Samples 0, 3, 6, 9 are cases (s % 3 == 0); 0-5 are Leeds, 6-11 Oslo.
        Assert.Equal([new LevelCount("case", 4), new LevelCount("control", 8)], inspection.Classes);
        Assert.Equal("case", inspection.PositiveClass);
        Assert.Equal([new LevelCount("Leeds", 6), new LevelCount("Oslo", 6)], inspection.Cohorts);
        Assert.Equal(
            [new ClassCohortCount("case", "Leeds", 2), new ClassCohortCount("case", "Oslo", 2),
             new ClassCohortCount("control", "Leeds", 4), new ClassCohortCount("control", "Oslo", 4)],
            inspection.ClassesByCohort);
        Assert.Equal(6, inspection.SubjectCount);
        Assert.Equal(4.0 / 72.0, inspection.MissingFraction, 12);
        Assert.Equal([new FeatureFraction("CRP", 2.0 / 12.0), new FeatureFraction("ALB", 1.0 / 12.0), new FeatureFraction("TNF alpha", 1.0 / 12.0)],
            inspection.MostMissingFeatures);
        Assert.Contains(inspection.Findings, f => f.Code == "small-class" && f.Message.Contains("'case'"));
        Assert.Contains(inspection.Findings, f => f.Code == "below-detection" && f.Severity == FindingSeverity.Note);
        Assert.DoesNotContain(inspection.Findings, f => f.Code == "names-differ-only-by-case");
        Assert.True(inspection.CanScreen);
    }

    [Fact]
    public void Constant_all_missing_and_mostly_missing_features_are_warnings_not_errors()
    {
        var loaded = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = _folder.File("flags.csv",
                "id,group,flat,empty,holey,good,censored\n" +
                "s1,x,5,NA,1,1,<LOD\n" +
                "s2,x,5,,NA,2,<LOD\n" +
                "s3,y,NA,NA,NA,3,<LOD\n" +
                "s4,y,5,NA,,4,1\n" +
                "s5,y,5,NA,2,5,1\n"),
            OutcomeColumn = "group",
        });
        var inspection = loaded.Inspection;

        Assert.Equal(["flat"], inspection.ConstantFeatures);
        Assert.Equal(["empty"], inspection.AllMissingFeatures);
        Assert.Equal(new FeatureFraction("empty", 1.0), inspection.MostMissingFeatures[0]);
        Assert.Equal(new FeatureFraction("holey", 0.6), inspection.MostMissingFeatures[1]);
        Assert.Equal(FindingSeverity.Warning, Assert.Single(inspection.Findings, f => f.Code == "constant-features").Severity);
        Assert.Contains("'flat'", Assert.Single(inspection.Findings, f => f.Code == "constant-features").Message);
        Assert.Single(inspection.Findings, f => f.Code == "all-missing-features");
        Assert.Contains("'holey'", Assert.Single(inspection.Findings, f => f.Code == "high-missingness").Message);
        Assert.Equal(3, inspection.BelowDetectionCellCount);
        Assert.Equal(1, inspection.BelowDetectionFeatureCount);
        Assert.True(inspection.CanScreen);
        Assert.Contains(inspection.Findings, f => f.Code == "positive-class-default");
    }

    [Fact]
    public void Far_more_samples_than_features_warns_about_orientation_with_the_fix()
    {
        var text = new System.Text.StringBuilder("id,group,a,b\n");
        for (int s = 0; s < 1200; s++) text.Append($"s{s},{(s % 2 == 0 ? "x" : "y")},{s},{s % 7}\n");
        var inspection = PanelLoader.Load(new PanelLoadOptions { MatrixPath = _folder.File("tall.csv", text.ToString()), OutcomeColumn = "group" }).Inspection;

        var finding = Assert.Single(inspection.Findings, f => f.Code == "orientation-suspect");
        Assert.Equal(FindingSeverity.Warning, finding.Severity);
        Assert.Contains("1200 samples but only 2 features", finding.Message);
        Assert.Contains("--features-in-rows", finding.Message);
        Assert.True(inspection.CanScreen);
    }

    [Fact]
    public void Error_findings_make_the_panel_unscreenable_but_still_inspectable()
    {
        var loaded = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = _folder.File("one.csv", "id,group,a\ns1,x,1\ns2,x,2\n"),
            OutcomeColumn = "group",
        });
        Assert.False(loaded.Inspection.CanScreen);
        Assert.Equal(FindingSeverity.Error, Assert.Single(loaded.Inspection.Findings, f => f.Code == "single-class").Severity);
        Assert.Throws<PanelNotScreenableException>(() => loaded.EnsureScreenable());
    }
}
