using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Turns a read matrix and optional sample sheet into a <see cref="Panel"/>: joins samples,
/// builds the outcome (trimmed labels, classes sorted ordinally), cohort, subject and the other
/// sample attributes.
/// </summary>
internal sealed class PanelAssembler
{
    private readonly RawMatrix _raw;
    private readonly SampleSheet? _sheet;
    private readonly PanelLoadOptions _options;
    private readonly SampleJoin _join;

    private PanelAssembler(RawMatrix raw, SampleSheet? sheet, PanelLoadOptions options, SampleJoin join)
    {
        _raw = raw;
        _sheet = sheet;
        _options = options;
        _join = join;
    }

    public static (Panel Panel, IReadOnlyList<string> DroppedSamples) Assemble(RawMatrix raw, SampleSheet? sheet,
        PanelLoadOptions options, List<InspectionFinding> findings)
    {
        var join = sheet is null
            ? SampleJoin.WithoutSheet(raw.Matrix.SampleCount)
            : SampleJoin.Match(raw.Matrix.SampleIds, raw.Matrix.FeatureNames, raw.Source.Path, sheet, options, findings);
        var assembler = new PanelAssembler(raw, sheet, options, join);
        return (assembler.Build(findings), join.DroppedSamples);
    }

    private Panel Build(List<InspectionFinding> findings)
    {
        var kept = _join.KeptSamples;
        var matrix = kept.Length == _raw.Matrix.SampleCount ? _raw.Matrix : _raw.Matrix.SelectSamples(kept);
        object outcome = BuildAnyOutcome(matrix.SampleIds, findings);
        var cohort = _options.CohortColumn is { } cohortName ? Grouping(Require(cohortName, "cohort", findings), findings) : null;
        var subject = _options.SubjectColumn is { } subjectName ? Grouping(Require(subjectName, "subject", findings), findings) : null;

        var extra = new Dictionary<string, string[]>(StringComparer.Ordinal);
        foreach (var name in _options.AnnotationColumns) extra[name] = Require(name, "annotation", findings).Values;
        if (_sheet is not null)
        {
            var used = _options.SampleAttributeNames();
            for (int c = 0; c < _sheet.ColumnNames.Length; c++)
            {
                string name = _sheet.ColumnNames[c];
                if (c == SheetIdColumn() || used.Contains(name) || name.Length == 0) continue;
                extra.TryAdd(name, Find(name)!.Values);
            }
        }

        var panel = outcome switch
        {
            FollowUpOutcome followUp => new Panel(matrix, followUp, cohort, subject, extra),
            MeasuredOutcome measured => new Panel(matrix, measured, cohort, subject, extra),
            _ => new Panel(matrix, (ClassOutcome)outcome, cohort, subject, extra),
        };
        return _options.CovariateColumns.Count == 0 ? panel : panel.WithCovariates(BuildCovariates(matrix, findings));
    }

    /// <summary>
    /// The covariates named by the options, in their order. A covariate that is also a feature
    /// column is refused: the panel would be compared with itself, and the covariate would be
    /// screened as a marker.
    /// </summary>
    private Covariate[] BuildCovariates(FeatureMatrix matrix, List<InspectionFinding> findings)
    {
        var covariates = new Covariate[_options.CovariateColumns.Count];
        for (int c = 0; c < covariates.Length; c++)
        {
            string name = _options.CovariateColumns[c];
            foreach (var feature in _raw.Matrix.FeatureNames)
                if (string.Equals(feature, name, StringComparison.Ordinal))
                    throw PanelInputException.At(_raw.Source.Path, null, name,
                        $"the covariate '{Display.Name(name)}' is a feature column of the matrix, so it would be screened as a marker and compared with itself.",
                        "Move the column to the sample sheet (and out of the matrix), or leave it out of --covariates.");
            var column = Require(name, "covariate", findings);
            covariates[c] = CovariateValues.Read(column, matrix.SampleIds, IsTableRow(column), findings);
        }
        return covariates;
    }

    /// <summary>
    /// The outcome of the kind the options ask for: a time to an event when follow-up and event
    /// columns are named; otherwise the outcome column as classes or as a measured quantity,
    /// forced by --outcome-kind or, by default, decided from its values.
    /// </summary>
    private object BuildAnyOutcome(IReadOnlyList<string> sampleIds, List<InspectionFinding> findings)
    {
        if (_options.FollowUpColumn is { } timeName && _options.EventColumn is { } eventName)
        {
            var timeColumn = Require(timeName, "follow-up time", findings);
            var eventColumn = Require(eventName, "event", findings);
            var times = OutcomeValues.Times(timeColumn, sampleIds, IsTableRow(timeColumn), findings);
            var events = OutcomeValues.Events(eventColumn, sampleIds, IsTableRow(eventColumn));
            return new FollowUpOutcome(timeName, eventName, times, events);
        }
        var outcomeName = _options.OutcomeColumn
            ?? throw new InvalidOperationException("The load options name neither an outcome column nor follow-up and event columns.");
        var column = Require(outcomeName, "outcome", findings);
        bool measured = _options.OutcomeKind == OutcomeKindChoice.Measured
            || (_options.OutcomeKind == OutcomeKindChoice.Auto && OutcomeValues.LooksLikeMeasurement(column.Values));
        if (measured) return new MeasuredOutcome(outcomeName, OutcomeValues.Measured(column, sampleIds, IsTableRow(column)));
        return BuildOutcome(column);
    }

    private int SheetIdColumn() =>
        _options.SampleIdColumn is { } name && _sheet!.IndexOf(name) >= 0 ? _sheet.IndexOf(name) : 0;

    /// <summary>A sample attribute in panel order: from the sheet when it has the column, else from the matrix file.</summary>
    private SampleAttribute? Find(string name)
    {
        var kept = _join.KeptSamples;
        if (_sheet?.Column(name) is { } sheetValues)
        {
            var values = new string[kept.Length];
            var lines = new long[kept.Length];
            for (int i = 0; i < kept.Length; i++)
            {
                values[i] = sheetValues[_join.SheetRows[i]];
                lines[i] = _sheet.Lines[_join.SheetRows[i]];
            }
            return new SampleAttribute(name, values, _sheet.Path, lines);
        }
        if (_raw.Annotations.TryGetValue(name, out var matrixValues))
        {
            var values = new string[kept.Length];
            var lines = new long[kept.Length];
            for (int i = 0; i < kept.Length; i++)
            {
                values[i] = matrixValues[kept[i]];
                lines[i] = _raw.SampleLines[kept[i]];
            }
            return new SampleAttribute(name, values, _raw.Source.Path, lines);
        }
        return null;
    }

    private SampleAttribute Require(string name, string role, List<InspectionFinding> findings)
    {
        if (Find(name) is { } found)
        {
            RefuseConflictingCopies(found, role, findings);
            return found;
        }
        var available = new List<string>();
        if (_sheet is not null) available.AddRange(_sheet.ColumnNames);
        foreach (var column in _raw.OtherColumns)
            if (!available.Contains(column, StringComparer.Ordinal)) available.Add(column);
        string where = _sheet is null
            ? $"the matrix {Path.GetFileName(_raw.Source.Path)}"
            : $"the sample sheet {Path.GetFileName(_sheet.Path)} or the matrix {Path.GetFileName(_raw.Source.Path)}";
        string hint = "";
        foreach (var column in available)
            if (string.Equals(column, name, StringComparison.OrdinalIgnoreCase)) hint = $" Did you mean '{column}'?";
        foreach (var feature in _raw.Matrix.FeatureNames)
            if (string.Equals(feature, name, StringComparison.OrdinalIgnoreCase))
                hint += $" The matrix has a feature column '{feature}'; if it holds the {role}, name it exactly (names are case-sensitive).";
        foreach (var sample in _raw.Matrix.SampleIds)
            if (string.Equals(sample, name, StringComparison.OrdinalIgnoreCase))
                hint += _options.Layout == PanelLayout.SamplesInRows
                    ? " It is a row label here, so the file may be oriented the other way: try --features-in-rows."
                    : " It is a column name here, so the file may be oriented the other way: try without --features-in-rows.";
        string columns = available.Count == 0 ? "no text columns" : $"the columns {Display.List(available, 12)}";
        var path = _sheet?.Path ?? _raw.Source.Path;
        return ThrowMissing(path, name, role, where, columns, hint);
    }

    /// <summary>
    /// The outcome, cohort or subject column must say one thing: a second sheet column of the same
    /// name, or a matrix column of that name beside the sheet's, with a different value for some
    /// sample leaves no way to know which is right, so the load stops at the first disagreement.
    /// Copies that agree give the same panel, but a later edit of one copy would go unnoticed, so
    /// they are named in a warning.
    /// </summary>
    private void RefuseConflictingCopies(SampleAttribute used, string role, List<InspectionFinding> findings)
    {
        if (_sheet is null) return;
        var kept = _join.KeptSamples;
        int first = _sheet.IndexOf(used.Name);
        for (int c = first + 1; c < _sheet.ColumnNames.Length; c++)
        {
            if (!string.Equals(_sheet.ColumnNames[c], used.Name, StringComparison.Ordinal)) continue;
            for (int i = 0; i < kept.Length; i++)
            {
                int row = _join.SheetRows[i];
                string other = _sheet.Columns[c][row];
                if (!string.Equals(used.Values[i].Trim(), other.Trim(), StringComparison.Ordinal))
                    throw PanelInputException.At(_sheet.Path, _sheet.Lines[row], used.Name, FormattableString.Invariant(
                        $"the {role} column '{Display.Name(used.Name)}' appears twice in the sample sheet (columns {first + 1} and {c + 1}), and they disagree for sample '{Display.Name(_raw.Matrix.SampleIds[kept[i]])}' ('{Display.Name(used.Values[i])}' against '{Display.Name(other)}')."),
                        "Keep one of the two columns, or rename the other.");
            }
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "duplicate-column", FormattableString.Invariant(
                $"the {role} column '{Display.Name(used.Name)}' appears twice in the sample sheet {Path.GetFileName(_sheet.Path)} (columns {first + 1} and {c + 1}); their values agree, and column {first + 1} is used. Keep one of the two so that an edit of one cannot go unnoticed.")));
        }
        // A column the sheet lacks was taken from the matrix: there is no second copy.
        if (first < 0 || !_raw.Annotations.TryGetValue(used.Name, out var matrixValues)) return;
        for (int i = 0; i < kept.Length; i++)
            if (!string.Equals(used.Values[i].Trim(), matrixValues[kept[i]].Trim(), StringComparison.Ordinal))
                throw PanelInputException.At(_sheet.Path, _sheet.Lines[_join.SheetRows[i]], used.Name, FormattableString.Invariant(
                    $"the {role} column '{Display.Name(used.Name)}' is both in the sample sheet and in the matrix {Path.GetFileName(_raw.Source.Path)}, and they disagree for sample '{Display.Name(_raw.Matrix.SampleIds[kept[i]])}' ('{Display.Name(used.Values[i])}' in the sheet, '{Display.Name(matrixValues[kept[i]])}' in the matrix)."),
                    "Remove the column from one of the files, or rename one of them.");
        findings.Add(new InspectionFinding(FindingSeverity.Warning, "duplicate-column", FormattableString.Invariant(
            $"the {role} column '{Display.Name(used.Name)}' is both in the sample sheet {Path.GetFileName(_sheet.Path)} and in the matrix {Path.GetFileName(_raw.Source.Path)}; their values agree, and the sheet's is used. Remove it from one of the files so that an edit of one cannot go unnoticed.")));
    }

    private static SampleAttribute ThrowMissing(string path, string name, string role, string where, string columns,
        string hint) =>
        throw PanelInputException.At(path, null, name,
            $"the {role} column '{Display.Name(name)}' is not in {where}, which have {columns}.",
            $"Name one of the available columns as the {role} column.{hint}");

    private ClassOutcome BuildOutcome(SampleAttribute column)
    {
        var labels = column.Values;
        for (int i = 0; i < labels.Length; i++)
        {
            // The missing-value tokens of feature cells (empty, NA, NaN, N/A, null) never name a class.
            if (CellText.Classify(labels[i], out _) == CellKind.Missing)
                throw PanelInputException.At(column.FilePath, Line(column, i), column.Name,
                    $"sample '{Display.Name(_raw.Matrix.SampleIds[_join.KeptSamples[i]])}' has no outcome value ('{Display.Name(labels[i])}').",
                    "Fill in its class, or remove the sample from the matrix and the sample sheet.",
                    isTableRow: IsTableRow(column));
        }
        var names = labels.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        var byCaseless = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var name in names)
        {
            if (byCaseless.TryGetValue(name, out var other))
                throw PanelInputException.At(column.FilePath, null, column.Name,
                    $"the class labels '{Display.Name(other)}' and '{Display.Name(name)}' differ only by case.",
                    "Spell each class the same way in every row (they would otherwise be two classes).");
            byCaseless[name] = name;
        }
        var code = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int c = 0; c < names.Length; c++) code[names[c]] = c;
        var classes = new int[labels.Length];
        for (int i = 0; i < labels.Length; i++) classes[i] = code[labels[i]];

        int positive = -1;
        if (_options.PositiveClass is { } positiveName)
        {
            if (!code.TryGetValue(positiveName.Trim(), out positive))
                throw PanelInputException.At(column.FilePath, null, column.Name,
                    $"the positive class '{Display.Name(positiveName)}' is not one of the classes {Display.List(names, 12)}.",
                    "Name one of these classes as the positive class (labels are case-sensitive).");
        }
        return new ClassOutcome(column.Name, names, classes, positive);
    }

    private static SampleGrouping Grouping(SampleAttribute column, List<InspectionFinding> findings)
    {
        int empty = 0;
        foreach (var value in column.Values)
            if (value.Length == 0) empty++;
        if (empty > 0)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "empty-group-labels",
                FormattableString.Invariant($"{empty} samples have an empty '{column.Name}' value; they form one group named ''. Fill the values in if they belong to known groups.")));
        return SampleGrouping.FromLabels(column.Name, column.Values);
    }

    /// <summary>Positions in Parquet and Arrow matrices are table rows, not text lines.</summary>
    private bool IsTableRow(SampleAttribute column) =>
        column.FilePath == _raw.Source.Path && _raw.Source.Format != MatrixFileFormat.DelimitedText;

    private static long? Line(SampleAttribute column, int sample) =>
        column.Lines[sample] > 0 ? column.Lines[sample] : null;
}
