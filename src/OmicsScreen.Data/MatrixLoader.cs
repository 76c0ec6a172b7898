using System.Security.Cryptography;
using OmicsScreen.Data.Assembly;
using OmicsScreen.Data.Columnar;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data;

/// <summary>
/// Reads only the measurement matrix of a panel, for cohorts whose outcome is not known (or not
/// yet known): the same readers and checks as <see cref="PanelLoader"/>, without an outcome,
/// sample sheet or inspection.
/// </summary>
public static class MatrixLoader
{
    /// <summary>
    /// An outcome column name no header can hold (names cannot contain control characters), so
    /// the readers treat every column but the id and the annotations as a feature.
    /// </summary>
    private const string NoOutcome = "\u0001no outcome";

    /// <param name="annotationColumns">Text columns of a samples-in-rows file to skip rather than read as features.</param>
    /// <param name="longColumns">For a long table: its load options (feature, value, limit and flag columns); the path and outcome are set here.</param>
    public static (FeatureMatrix Matrix, InputFileRecord Input) Load(string matrixPath, PanelLayout layout = PanelLayout.SamplesInRows,
        string? sampleIdColumn = null, IReadOnlyList<string>? annotationColumns = null, CancellationToken ct = default,
        PanelLoadOptions? longColumns = null)
    {
        ArgumentNullException.ThrowIfNull(matrixPath);
        InputFilePath.EnsureFile(matrixPath, "matrix");
        var options = (longColumns ?? new PanelLoadOptions { MatrixPath = matrixPath, OutcomeColumn = NoOutcome }) with
        {
            MatrixPath = matrixPath,
            Layout = layout,
            OutcomeColumn = NoOutcome,
            SampleIdColumn = sampleIdColumn,
            AnnotationColumns = annotationColumns ?? [],
            SampleSheetPath = null,
            FeatureSheetPath = null,
        };
        RawMatrix raw;
        switch (MatrixFormatDetector.Detect(matrixPath))
        {
            case MatrixFileFormat.DelimitedText when layout == PanelLayout.Long:
                raw = LongTableReader.Read(matrixPath, options, ct);
                break;
            case MatrixFileFormat.DelimitedText:
                raw = DelimitedMatrixReader.Read(matrixPath, options, ct);
                break;
            case MatrixFileFormat.Parquet:
                using (var table = ParquetTable.Open(matrixPath))
                    raw = ColumnarMatrixReader.Read(table, options, ct);
                break;
            case var format:
                using (var table = ArrowTable.Open(matrixPath, format, ct))
                    raw = ColumnarMatrixReader.Read(table, options, ct);
                break;
        }
        using var stream = new FileStream(matrixPath, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16, FileOptions.SequentialScan);
        var hash = Convert.ToHexStringLower(SHA256.HashData(stream));
        return (raw.Matrix, new InputFileRecord(matrixPath, stream.Length, hash));
    }
}
