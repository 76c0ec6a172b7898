using System.Globalization;
using System.Text;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// The text seeds of the fuzz corpus: 30 samples x 12 features with two outcome classes, as a
/// samples-in-rows CSV holding the outcome column, and as a features-in-rows TSV with a separate
/// comma-separated sample sheet holding outcome and cohort.
/// </summary>
/// <remarks>
/// The values span eight orders of magnitude and need up to nine significant digits, and a few
/// cells are missing or below detection, so that a damaged digit or token has something to hit.
/// </remarks>
internal static class TextSeedPanels
{
    public const int SampleCount = 30;
    public const string OutcomeColumn = "status";
    public const string CohortColumn = "centre";

    private static readonly string[] FeatureNames =
        ["IL6", "CRP", "TNF", "IL1B", "CXCL8", "MMP9", "ALB", "LEP", "ADIPOQ", "VEGFA", "SAA1", "HP"];

    public static IReadOnlyList<FuzzSeedPanel> All() => [SamplesInRowsCsv(), FeaturesInRowsTsv()];

    public static FuzzSeedPanel SamplesInRowsCsv()
    {
        var panel = Panel(withCohort: false);
        var text = new StringBuilder("sample_id,").Append(OutcomeColumn);
        foreach (var name in FeatureNames) text.Append(',').Append(name);
        text.Append('\n');
        for (int s = 0; s < panel.SampleCount; s++)
        {
            text.Append(panel.Matrix.SampleIds[s]).Append(',').Append(panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]]);
            for (int f = 0; f < panel.FeatureCount; f++) text.Append(',').Append(Cell(panel.Matrix, f, s));
            text.Append('\n');
        }
        return new FuzzSeedPanel("samples-in-rows CSV", "panel.csv", Encoding.UTF8.GetBytes(text.ToString()), IsText: true,
            ',', PanelLayout.SamplesInRows, panel, OutcomeColumn);
    }

    public static FuzzSeedPanel FeaturesInRowsTsv()
    {
        var panel = Panel(withCohort: true);
        var text = new StringBuilder("feature");
        foreach (var id in panel.Matrix.SampleIds) text.Append('\t').Append(id);
        text.Append('\n');
        for (int f = 0; f < panel.FeatureCount; f++)
        {
            text.Append(panel.Matrix.FeatureNames[f]);
            for (int s = 0; s < panel.SampleCount; s++) text.Append('\t').Append(Cell(panel.Matrix, f, s));
            text.Append('\n');
        }
        var sheet = new StringBuilder("sample_id,").Append(OutcomeColumn).Append(',').Append(CohortColumn).Append('\n');
        var cohort = panel.Cohort!;
        for (int s = 0; s < panel.SampleCount; s++)
            sheet.Append(panel.Matrix.SampleIds[s]).Append(',')
                .Append(panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]]).Append(',')
                .Append(cohort.LevelNames[cohort.SampleLevels[s]]).Append('\n');
        return new FuzzSeedPanel("features-in-rows TSV with sample sheet", "panel.tsv", Encoding.UTF8.GetBytes(text.ToString()),
            IsText: true, '\t', PanelLayout.FeaturesInRows, panel, OutcomeColumn, CohortColumn,
            "samples.csv", Encoding.UTF8.GetBytes(sheet.ToString()));
    }

    /// <summary>The panel both text seeds hold; also written as Parquet and Arrow for the binary seeds.</summary>
    public static Panel Panel(bool withCohort)
    {
        var sampleIds = new string[SampleCount];
        for (int s = 0; s < SampleCount; s++) sampleIds[s] = string.Create(CultureInfo.InvariantCulture, $"S{s + 1:00}");
        var builder = new FeatureMatrixBuilder(FeatureNames, sampleIds);
        var random = new Xoshiro256StarStar(20261202);
        for (int f = 0; f < FeatureNames.Length; f++)
        {
            double scale = Math.Pow(10, f % 9 - 4);
            for (int s = 0; s < SampleCount; s++)
                builder.SetMeasured(f, s, (float)((0.05 + random.NextDouble()) * scale));
        }
        builder.SetMissing(1, 4);
        builder.SetMissing(7, 19);
        builder.SetBelowDetection(3, 2, 0.0125f);
        builder.SetBelowDetection(3, 11, float.NaN);
        var classes = new int[SampleCount];
        var centres = new int[SampleCount];
        for (int s = 0; s < SampleCount; s++)
        {
            classes[s] = s % 3 == 0 ? 0 : 1;
            centres[s] = s < SampleCount / 2 ? 0 : 1;
        }
        // Class and level names in ordinal order, as the loader codes them.
        var outcome = new ClassOutcome(OutcomeColumn, ["case", "control"], classes);
        var cohort = withCohort ? new SampleGrouping(CohortColumn, ["Leeds", "Oslo"], centres) : null;
        return new Panel(builder.Build(), outcome, cohort);
    }

    /// <summary>A cell in the loader's token forms: shortest round-trip number, NA, &lt;limit or &lt;LOD.</summary>
    private static string Cell(FeatureMatrix matrix, int feature, int sample)
    {
        float value = matrix.Value(feature, sample);
        return matrix.State(feature, sample) switch
        {
            CellState.Missing => "NA",
            CellState.BelowDetection => float.IsNaN(value) ? "<LOD" : "<" + value.ToString("R", CultureInfo.InvariantCulture),
            _ => value.ToString("R", CultureInfo.InvariantCulture),
        };
    }
}
