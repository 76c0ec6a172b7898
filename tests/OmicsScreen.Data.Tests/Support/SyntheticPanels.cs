using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Support;

/// <summary>Small panels with every kind of cell, for round trips through the file formats.</summary>
internal static class SyntheticPanels
{
    public static readonly string[] AttributeColumns = ["site_note"];

    /// <summary>
    /// 12 samples x 6 features, two classes, two cohorts, subjects, one free-text attribute (with
    /// a comma and a quote in it), missing cells, censored cells with and without a limit, and
    /// values that need all nine float digits to round-trip.
    /// </summary>
    public static Panel Mixed()
    {
        const int sampleCount = 12;
        string[] features = ["IL6", "CRP", "TNF alpha", "glucose", "lactate", "ALB"];
        var sampleIds = new string[sampleCount];
        for (int s = 0; s < sampleCount; s++) sampleIds[s] = $"P{s + 1:00}";
        var builder = new FeatureMatrixBuilder(features, sampleIds);
        var random = new Random(20240611);
        for (int f = 0; f < features.Length; f++)
            for (int s = 0; s < sampleCount; s++)
                builder.SetMeasured(f, s, (float)((random.NextDouble() - 0.3) * Math.Pow(10, f - 2)));
        builder.SetMeasured(0, 0, 0.1f);
        builder.SetMeasured(0, 1, 1.17549435e-38f);
        builder.SetMeasured(0, 2, 3.4028235e38f);
        builder.SetMissing(1, 3);
        builder.SetMissing(1, 4);
        builder.SetBelowDetection(2, 5, 0.05f);
        builder.SetBelowDetection(2, 6, float.NaN);
        builder.SetMissing(2, 7);
        builder.SetBelowDetection(4, 0, 1.25e-3f);
        builder.SetMissing(5, 11);
        var matrix = builder.Build();

        var classes = new int[sampleCount];
        var cohorts = new int[sampleCount];
        var subjects = new int[sampleCount];
        var notes = new string[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            classes[s] = s % 3 == 0 ? 0 : 1;
            cohorts[s] = s < 6 ? 0 : 1;
            subjects[s] = s / 2;
            notes[s] = s == 3 ? "freezer 2, shelf \"B\"" : $"note {s}";
        }
        var outcome = new ClassOutcome("status", ["case", "control"], classes);
        var cohort = new SampleGrouping("centre", ["Leeds", "Oslo"], cohorts);
        var subject = new SampleGrouping("subject", ["A", "B", "C", "D", "E", "F"], subjects);
        return new Panel(matrix, outcome, cohort, subject, new Dictionary<string, string[]> { ["site_note"] = notes });
    }

    /// <summary>The load options that name every attribute column of <see cref="Mixed"/>.</summary>
    public static PanelLoadOptions MixedOptions(string path, PanelLayout layout) => new()
    {
        MatrixPath = path,
        Layout = layout,
        OutcomeColumn = "status",
        CohortColumn = "centre",
        SubjectColumn = "subject",
        AnnotationColumns = AttributeColumns,
    };
}
