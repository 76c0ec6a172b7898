using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Reads a covariate column: numeric when every value parses as a number, categorical (its
/// distinct values as levels, in ordinal order) otherwise, said in a note so a stray text cell in
/// a numeric column is seen. Missing values stop the load with the column and their count: a
/// screen that silently dropped samples for one analysis would compare different samples.
/// </summary>
internal static class CovariateValues
{
    /// <summary>A categorical covariate with more levels than this is likely an identifier or a mistyped numeric column.</summary>
    private const int ManyLevels = 10;

    public static Covariate Read(SampleAttribute column, IReadOnlyList<string> sampleIds, bool isTableRow,
        List<InspectionFinding> findings)
    {
        int missing = 0, firstMissing = -1;
        for (int i = 0; i < column.Values.Length; i++)
            if (CellText.Classify(column.Values[i], out _) == CellKind.Missing)
            {
                if (missing++ == 0) firstMissing = i;
            }
        if (missing > 0)
            throw PanelInputException.At(column.FilePath, column.Lines[firstMissing] > 0 ? column.Lines[firstMissing] : null, column.Name,
                FormattableString.Invariant($"the covariate '{Display.Name(column.Name)}' has no value for {missing} of {column.Values.Length} samples (the first is sample '{Display.Name(sampleIds[firstMissing])}', '{Display.Name(column.Values[firstMissing])}')."),
                "Fill the values in, remove those samples from the matrix and the sample sheet, or leave the column out of --covariates.",
                isTableRow: isTableRow);

        var numbers = new double[column.Values.Length];
        int firstText = -1;
        for (int i = 0; i < numbers.Length && firstText < 0; i++)
            if (!OutcomeValues.TryNumber(column.Values[i], out numbers[i])) firstText = i;
        if (firstText < 0) return Covariate.Numeric(column.Name, numbers);

        var labels = new string[column.Values.Length];
        for (int i = 0; i < labels.Length; i++) labels[i] = column.Values[i].Trim();
        var levels = labels.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        var code = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int l = 0; l < levels.Length; l++) code[levels[l]] = l;
        var sampleLevels = new int[labels.Length];
        for (int i = 0; i < labels.Length; i++) sampleLevels[i] = code[labels[i]];
        findings.Add(new InspectionFinding(FindingSeverity.Note, "categorical-covariate", FormattableString.Invariant(
            $"the covariate '{Display.Name(column.Name)}' is read as categorical because not every value is a number (the first is '{Display.Name(column.Values[firstText].Trim())}', sample '{Display.Name(sampleIds[firstText])}'); its {levels.Length} levels: {Display.List(levels, 12)}.")));
        if (levels.Length == 1)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "constant-covariate", FormattableString.Invariant(
                $"the covariate '{Display.Name(column.Name)}' has one level for every sample, so it cannot explain anything; leave it out of --covariates.")));
        else if (levels.Length > ManyLevels)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "many-level-covariate", FormattableString.Invariant(
                $"the categorical covariate '{Display.Name(column.Name)}' has {levels.Length} levels; if it is a number with a typing slip, correct the cell named in the note above.")));
        return Covariate.Categorical(column.Name, levels, sampleLevels);
    }
}
