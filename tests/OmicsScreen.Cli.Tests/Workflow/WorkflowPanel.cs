using System.Text;
using OmicsScreen.Data;
using OmicsScreen.Data.Writing;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>
/// A small two-cohort case/control panel for running whole workflows quickly: 80 samples by 60
/// features, the first four shifted in one class, written as a Parquet matrix plus a sample sheet.
/// </summary>
internal sealed record WorkflowPanel(string Matrix, string SampleSheet)
{
    public const string OutcomeColumn = "outcome";
    public const string CohortColumn = "cohort";

    public static WorkflowPanel Write(string folder)
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec
        {
            SampleCount = 80, FeatureCount = 60, InformativeCount = 4, EffectSize = 1.5, Seed = 8,
        });
        string matrix = Path.Combine(folder, "panel.parquet");
        ParquetPanelWriter.Write(panel, matrix, PanelLayout.SamplesInRows, includeSampleAttributes: false);

        // Cohorts alternate so that both hold cases and controls.
        var sheet = new StringBuilder("sample_id\t" + OutcomeColumn + "\t" + CohortColumn + "\n");
        var classes = panel.Outcome.SampleClasses;
        for (int s = 0; s < panel.Matrix.SampleCount; s++)
            sheet.Append(panel.Matrix.SampleIds[s]).Append('\t')
                .Append(panel.Outcome.ClassNames[classes[s]]).Append('\t')
                .Append(s % 2 == 0 ? "north" : "south").Append('\n');
        string sampleSheet = Path.Combine(folder, "samples.tsv");
        File.WriteAllText(sampleSheet, sheet.ToString(), new UTF8Encoding(false));
        return new WorkflowPanel(matrix, sampleSheet);
    }
}
