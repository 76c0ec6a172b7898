using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Writing;

/// <summary>
/// Lays a panel out as table columns for either orientation, so that the Parquet and Arrow
/// writers only encode columns. Reading the result back with <see cref="PanelLoader"/> gives the
/// same panel.
/// </summary>
/// <remarks>
/// A column stays numeric (nullable float32, null = missing) unless one of its cells is censored
/// or, for features in rows, the sample attributes occupy rows; then it is written as text cells
/// in the token forms the readers accept ("&lt;0.05", "&lt;LOD", "NA").
/// </remarks>
internal static class PanelTableShape
{
    public const string SampleIdColumn = "sample_id";
    public const string FeatureColumn = "feature";

    /// <param name="includeSampleAttributes">False writes the measurements only (the attributes then go in a sample sheet).</param>
    public static List<OutputColumn> Columns(Panel panel, PanelLayout layout, bool includeSampleAttributes = true)
    {
        var attributes = includeSampleAttributes ? Attributes(panel) : [];
        return layout == PanelLayout.SamplesInRows ? SamplesInRows(panel, attributes) : FeaturesInRows(panel, attributes);
    }

    /// <summary>Outcome, cohort, subject and the extra columns, as text in sample order.</summary>
    public static List<(string Name, string[] Values)> Attributes(Panel panel)
    {
        var list = new List<(string, string[])> { (panel.Outcome.ColumnName, Labels(panel.Outcome)) };
        if (panel.Cohort is { } cohort) list.Add((cohort.ColumnName, Labels(cohort)));
        if (panel.Subject is { } subject) list.Add((subject.ColumnName, Labels(subject)));
        foreach (var (name, values) in panel.ExtraColumns) list.Add((name, values));
        return list;
    }

    private static List<OutputColumn> SamplesInRows(Panel panel, List<(string Name, string[] Values)> attributes)
    {
        var matrix = panel.Matrix;
        var columns = new List<OutputColumn> { new(SampleIdColumn, null, matrix.SampleIds.ToArray()) };
        foreach (var (name, values) in attributes) columns.Add(new OutputColumn(name, null, values));
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            var values = matrix.Column(f);
            var states = matrix.States(f);
            if (states.Contains(CellState.BelowDetection))
            {
                var texts = new string?[values.Length];
                for (int s = 0; s < texts.Length; s++) texts[s] = CellText.Format(states[s], values[s]);
                columns.Add(new OutputColumn(matrix.FeatureNames[f], null, texts));
                continue;
            }
            var numbers = new float?[values.Length];
            for (int s = 0; s < numbers.Length; s++)
                numbers[s] = !states.IsEmpty && states[s] == CellState.Missing ? null : values[s];
            columns.Add(new OutputColumn(matrix.FeatureNames[f], numbers, null));
        }
        return columns;
    }

    private static List<OutputColumn> FeaturesInRows(Panel panel, List<(string Name, string[] Values)> attributes)
    {
        var matrix = panel.Matrix;
        int rowCount = attributes.Count + matrix.FeatureCount;
        var labels = new string?[rowCount];
        for (int a = 0; a < attributes.Count; a++) labels[a] = attributes[a].Name;
        for (int f = 0; f < matrix.FeatureCount; f++) labels[attributes.Count + f] = matrix.FeatureNames[f];
        var columns = new List<OutputColumn> { new(FeatureColumn, null, labels) };
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            bool asText = attributes.Count > 0;
            for (int f = 0; f < matrix.FeatureCount && !asText; f++) asText = matrix.State(f, s) == CellState.BelowDetection;
            if (asText)
            {
                var texts = new string?[rowCount];
                for (int a = 0; a < attributes.Count; a++) texts[a] = attributes[a].Values[s];
                for (int f = 0; f < matrix.FeatureCount; f++)
                    texts[attributes.Count + f] = CellText.Format(matrix.State(f, s), matrix.Value(f, s));
                columns.Add(new OutputColumn(matrix.SampleIds[s], null, texts));
                continue;
            }
            var numbers = new float?[rowCount];
            for (int f = 0; f < matrix.FeatureCount; f++)
                numbers[f] = matrix.State(f, s) == CellState.Missing ? null : matrix.Value(f, s);
            columns.Add(new OutputColumn(matrix.SampleIds[s], numbers, null));
        }
        return columns;
    }

    private static string[] Labels(ClassOutcome outcome)
    {
        var labels = new string[outcome.SampleCount];
        for (int s = 0; s < labels.Length; s++) labels[s] = outcome.ClassNames[outcome.SampleClasses[s]];
        return labels;
    }

    private static string[] Labels(SampleGrouping grouping)
    {
        var labels = new string[grouping.SampleLevels.Length];
        for (int s = 0; s < labels.Length; s++) labels[s] = grouping.LevelNames[grouping.SampleLevels[s]];
        return labels;
    }
}
