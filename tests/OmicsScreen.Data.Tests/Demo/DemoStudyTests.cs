using OmicsScreen.Data.Demo;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Demo;

public sealed class DemoStudyTests : IDisposable
{
    private readonly string _root = Path.Combine(Path.GetTempPath(), "omicsscreen-demo-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_root)) Directory.Delete(_root, recursive: true);
    }

    [Fact]
    public void The_same_seed_writes_byte_identical_files()
    {
        var first = DemoStudyWriter.Write(DemoStudyGenerator.Generate(new DemoStudyOptions { Seed = 7 }), Path.Combine(_root, "a"));
        var second = DemoStudyWriter.Write(DemoStudyGenerator.Generate(new DemoStudyOptions { Seed = 7 }), Path.Combine(_root, "b"));

        Assert.Equal(File.ReadAllBytes(first.Panel), File.ReadAllBytes(second.Panel));
        Assert.Equal(File.ReadAllBytes(first.SampleSheet), File.ReadAllBytes(second.SampleSheet));
        Assert.Equal(File.ReadAllBytes(first.Truth), File.ReadAllBytes(second.Truth));
        Assert.Equal(File.ReadAllBytes(first.Readme), File.ReadAllBytes(second.Readme));
        Assert.Equal(File.ReadAllBytes(first.FeatureSheet), File.ReadAllBytes(second.FeatureSheet));
        Assert.Empty(Directory.GetFiles(Path.Combine(_root, "a"), "*.partial"));
    }

    [Fact]
    public void The_feature_sheet_names_every_analyte_and_gives_the_limits_the_generator_censored_at()
    {
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions());
        var files = DemoStudyWriter.Write(study, Path.Combine(_root, "a"));

        var loaded = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = files.Panel, SampleSheetPath = files.SampleSheet, FeatureSheetPath = files.FeatureSheet, OutcomeColumn = DemoStudy.OutcomeColumn,
        });

        Assert.All(loaded.Features.DisplayNames!, name => Assert.False(string.IsNullOrEmpty(name)));
        Assert.Equal(study.Truth.Count(t => t.HasDetectionLimit), loaded.Inspection.FeatureSheet!.FeaturesWithLimit);
        // The generator censors every value under a feature's limit itself, so the sheet's limits censor nothing more.
        Assert.Equal(0, loaded.Inspection.FeatureSheet.CensoredCellTotal);
        // A below-detection cell written without its value (<LOD) now holds its feature's limit.
        var matrix = loaded.Panel.Matrix;
        for (int f = 0; f < matrix.FeatureCount; f++)
            for (int s = 0; s < matrix.SampleCount; s++)
                if (matrix.State(f, s) == CellState.BelowDetection) Assert.Equal(study.Truth[f].DetectionLimit, matrix.Value(f, s));
    }

    [Fact]
    public void The_sample_sheet_carries_a_measured_and_a_time_to_event_outcome_planted_in_five_noise_analytes()
    {
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions());
        var files = DemoStudyWriter.Write(study, Path.Combine(_root, "a"));

        // Read as the README's commands read them: the score by automatic detection, the follow-up by its two columns.
        var measured = PanelLoader.Load(new PanelLoadOptions { MatrixPath = files.Panel, SampleSheetPath = files.SampleSheet, OutcomeColumn = DemoStudy.ActivityColumn });
        Assert.Equal(OutcomeKind.Measured, measured.Panel.Kind);
        var timed = PanelLoader.Load(new PanelLoadOptions
        {
            MatrixPath = files.Panel, SampleSheetPath = files.SampleSheet, FollowUpColumn = DemoStudy.FollowUpColumn, EventColumn = DemoStudy.EventColumn,
        });
        Assert.Equal(OutcomeKind.TimeToEvent, timed.Panel.Kind);
        int events = timed.Panel.FollowUp!.EventCount;
        // Baseline median 30 months, follow-up to 60: most samples flare, many are censored (by construction).
        Assert.InRange((double)events / study.Matrix.SampleCount, 0.4, 0.9);

        // Known by construction: the score rises with its two linear carriers, and flares come sooner
        // (more of them) in the upper half of each hazard carrier; the carriers are noise for the class.
        var activity = study.Truth.Select((t, f) => (t, f)).Where(x => x.t.ActivityEffect.Length > 0).ToArray();
        var hazard = study.Truth.Select((t, f) => (t, f)).Where(x => x.t.LogHazardPerSd != 0).ToArray();
        Assert.Equal(3, activity.Length);
        Assert.Equal(2, hazard.Length);
        Assert.All(activity.Concat(hazard), x => Assert.Equal(DemoFeatureRole.Noise, x.t.Role));
        foreach (var (t, f) in activity.Where(x => x.t.ActivityEffect.EndsWith("per SD", StringComparison.Ordinal)))
            Assert.True(Correlation(Log2Values(study, f), study.Outcomes.ActivityScore) > 0.25, $"{t.Feature} should rise with the score");
        foreach (var (t, f) in hazard)
        {
            var values = Log2Values(study, f);
            double median = values.Where(double.IsFinite).Order().ElementAt(values.Count(double.IsFinite) / 2);
            double upper = FlareShare(study, values, v => v >= median), lower = FlareShare(study, values, v => v < median);
            Assert.True(upper > lower + 0.05, $"{t.Feature}: flare share {upper:0.00} above its median, {lower:0.00} below");
        }
    }

    private static double[] Log2Values(DemoStudy study, int feature) =>
        Enumerable.Range(0, study.Matrix.SampleCount)
            .Select(s => study.Matrix.State(feature, s) == CellState.Measured ? Math.Log2(study.Matrix.Value(feature, s)) : double.NaN).ToArray();

    private static double FlareShare(DemoStudy study, double[] values, Func<double, bool> side)
    {
        var rows = Enumerable.Range(0, values.Length).Where(s => double.IsFinite(values[s]) && side(values[s])).ToArray();
        return (double)rows.Count(s => study.Outcomes.Flare[s]) / rows.Length;
    }

    /// <summary>Pearson correlation over the samples where the marker was measured (textbook formula).</summary>
    private static double Correlation(double[] x, double[] y)
    {
        var rows = Enumerable.Range(0, x.Length).Where(s => double.IsFinite(x[s])).ToArray();
        double mx = rows.Average(s => x[s]), my = rows.Average(s => y[s]);
        double sxy = rows.Sum(s => (x[s] - mx) * (y[s] - my)), sxx = rows.Sum(s => (x[s] - mx) * (x[s] - mx)), syy = rows.Sum(s => (y[s] - my) * (y[s] - my));
        return sxy / Math.Sqrt(sxx * syy);
    }

    [Fact]
    public void A_different_seed_gives_a_different_panel()
    {
        var first = DemoStudyWriter.Write(DemoStudyGenerator.Generate(new DemoStudyOptions { Seed = 7 }), Path.Combine(_root, "a"));
        var second = DemoStudyWriter.Write(DemoStudyGenerator.Generate(new DemoStudyOptions { Seed = 8 }), Path.Combine(_root, "b"));
        Assert.NotEqual(File.ReadAllBytes(first.Panel), File.ReadAllBytes(second.Panel));
    }

    [Fact]
    public void The_study_has_the_promised_design()
    {
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions());

        Assert.Equal(360, study.Matrix.SampleCount);
        Assert.Equal(2000, study.Matrix.FeatureCount);
        Assert.Equal(113, study.Status.Count(s => s == DemoStudy.CaseLabel));
        Assert.Equal(247, study.Status.Count(s => s == DemoStudy.ControlLabel));
        Assert.Equal(3, study.Centre.Distinct().Count());
        Assert.Equal(6, study.Truth.Count(t => t.Role == DemoFeatureRole.Marker));
        Assert.Equal(10, study.Truth.Count(t => t.Role == DemoFeatureRole.ModuleMarker));
        Assert.Single(study.Truth, t => t.Role == DemoFeatureRole.CensoredMarker);
        Assert.Single(study.Truth, t => t.Role == DemoFeatureRole.BatchArtefact);
        Assert.Equal(study.Matrix.SampleCount, study.Matrix.SampleIds.Distinct().Count());
        Assert.All(study.Matrix.SampleIds, id => Assert.StartsWith("mf-", id));
    }

    [Fact]
    public void The_censored_marker_is_below_detection_mostly_in_controls()
    {
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions());
        int feature = study.Truth.ToList().FindIndex(t => t.Role == DemoFeatureRole.CensoredMarker);
        int censoredControls = 0, censoredCases = 0;
        for (int s = 0; s < study.Matrix.SampleCount; s++)
        {
            if (study.Matrix.State(feature, s) != CellState.BelowDetection) continue;
            if (study.Status[s] == DemoStudy.CaseLabel) censoredCases++; else censoredControls++;
        }
        double controlRate = censoredControls / 247.0, caseRate = censoredCases / 113.0;
        // Planted: limit 0.25 SD below the control mean, cases shifted up 1.1 SD, so about 40% of
        // controls and about 8% of cases fall below it (normal tail areas).
        Assert.InRange(controlRate, 0.28, 0.52);
        Assert.InRange(caseRate, 0.0, 0.18);
    }

    [Fact]
    public void The_batch_artefact_differs_between_centres_but_not_within_them()
    {
        var study = DemoStudyGenerator.Generate(new DemoStudyOptions());
        int feature = study.Truth.ToList().FindIndex(t => t.Role == DemoFeatureRole.BatchArtefact);
        double MeanLog2(Func<int, bool> pick)
        {
            double sum = 0; int count = 0;
            for (int s = 0; s < study.Matrix.SampleCount; s++)
                if (pick(s) && study.Matrix.State(feature, s) == CellState.Measured) { sum += Math.Log2(study.Matrix.Value(feature, s)); count++; }
            return sum / count;
        }
        double sd = study.Truth[feature].Log2Sd;
        string affected = study.BatchAffectedCentre;
        double betweenCentres = MeanLog2(s => study.Centre[s] == affected) - MeanLog2(s => study.Centre[s] != affected);
        double withinAffected = MeanLog2(s => study.Centre[s] == affected && study.Status[s] == DemoStudy.CaseLabel)
            - MeanLog2(s => study.Centre[s] == affected && study.Status[s] == DemoStudy.ControlLabel);
        Assert.InRange(betweenCentres / sd, 1.6, 2.4);
        Assert.InRange(withinAffected / sd, -0.5, 0.5);
    }
}
