using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// A valid panel file (and sample sheet, when the panel has one) that the fuzz corpus damages,
/// with the panel it must load to while undamaged and the columns that name its outcome.
/// </summary>
/// <param name="Delimiter">The field delimiter of a text matrix; unused for binary files.</param>
/// <param name="CohortColumn">The cohort column of the sample sheet, when there is one.</param>
internal sealed record FuzzSeedPanel(
    string Name,
    string MatrixFileName,
    byte[] MatrixBytes,
    bool IsText,
    char Delimiter,
    PanelLayout Layout,
    Panel Expected,
    string OutcomeColumn,
    string? CohortColumn = null,
    string? SampleSheetFileName = null,
    byte[]? SampleSheetBytes = null)
{
    public PanelLoadOptions Options(string matrixPath, string? sampleSheetPath) => new()
    {
        MatrixPath = matrixPath,
        Layout = Layout,
        SampleSheetPath = sampleSheetPath,
        OutcomeColumn = OutcomeColumn,
        CohortColumn = CohortColumn,
    };

    public override string ToString() => Name;
}
