using System.Security.Cryptography;
using OmicsScreen.Data.Assembly;
using OmicsScreen.Data.Columnar;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Data.Text;

namespace OmicsScreen.Data;

/// <summary>
/// Loads a panel from a matrix file (CSV, TSV, Parquet, Arrow IPC file or stream; format from
/// its first bytes) and an optional sample sheet: read, join, build outcome and groupings,
/// inspect.
/// </summary>
/// <remarks>
/// Structural problems that prevent building a panel throw <see cref="PanelInputException"/>.
/// Problems a user should see together (constant features, heavy missingness, tiny classes)
/// become findings of the inspection; <see cref="LoadedPanel.EnsureScreenable"/> turns its
/// Error findings into an exception.
/// </remarks>
public static class PanelLoader
{
    public static LoadedPanel Load(PanelLoadOptions options, CancellationToken ct = default)
    {
        ArgumentNullException.ThrowIfNull(options);
        InputFilePath.EnsureFile(options.MatrixPath, "matrix");
        if (options.SampleSheetPath is { } sheetFile) InputFilePath.EnsureFile(sheetFile, "sample sheet");
        if (options.Layout != PanelLayout.SamplesInRows && (options.FeatureBlock is not null || options.KeepFeatures is not null))
            throw PanelInputException.At(options.MatrixPath, null, null,
                "is read with features in rows, where feature blocks and feature lists do not apply.",
                "Each run of rows of such a file is a panel of its own: split it by rows, repeating the header line "
                + "(for example with `split`), and screen the pieces; select rows by name with `grep -F -w -f` likewise.");
        if (options.FeatureSheetPath is { } featureFile) InputFilePath.EnsureFile(featureFile, "feature sheet");
        var format = MatrixFormatDetector.Detect(options.MatrixPath);
        // The feature sheet comes first: its detection limits are applied as the readers build each column.
        var featureSheet = options.FeatureSheetPath is { } featurePath ? SampleSheetReader.Read(featurePath, "feature sheet", "feature") : null;
        if (featureSheet is not null) options = options with { FeatureLimits = FeatureSheetJoin.ReadLimits(featureSheet, options) };
        // Hashing is independent of parsing, so it runs on another core meanwhile, on a thread of its
        // own: queued on the thread pool it could wait behind a host's pool work while this thread
        // blocks on it at the end.
        var matrixRecord = Task.Factory.StartNew(() => Record(options.MatrixPath), ct, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        RawMatrix raw;
        try
        {
            raw = ReadMatrix(options, format, ct);
        }
        catch
        {
            // The read error is the one to report; observe a hashing failure so it is not rethrown later.
            _ = matrixRecord.ContinueWith(static t => _ = t.Exception, CancellationToken.None,
                TaskContinuationOptions.OnlyOnFaulted, TaskScheduler.Default);
            throw;
        }
        var sheet = options.SampleSheetPath is { } sheetPath ? SampleSheetReader.Read(sheetPath) : null;
        ct.ThrowIfCancellationRequested();

        var findings = new List<InspectionFinding>();
        var (descriptions, featureColumns) = FeatureDescriber.FromMatrix(raw, options);
        FeatureSheetFound? featureSheetFound = null;
        if (featureSheet is not null)
        {
            var (kept, joined, found) = FeatureSheetJoin.Join(raw, descriptions, featureSheet, options, findings);
            if (kept.Length != raw.Matrix.FeatureCount) raw = raw.WithFeatures(kept);
            descriptions = joined;
            featureSheetFound = found with { Compression = featureSheet.Gzip ? "gzip" : null, CommentLineCount = featureSheet.CommentLineCount };
        }
        else if (options.DisplayNameColumn is { } displayName && descriptions.DisplayNames is null)
            throw PanelInputException.At(options.MatrixPath, null, null,
                $"has no describing column '{Display.Name(displayName)}' (named by --display-name).",
                "Give the display names in a feature sheet (--feature-sheet) or name a describing column of the matrix file.");
        var (panel, dropped) = PanelAssembler.Assemble(raw, sheet, options, findings);
        var inspection = PanelInspector.Inspect(panel, raw.Source, options.SampleSheetPath, dropped, options, findings)
            with
            {
                FeatureColumns = featureColumns,
                FeatureSheet = featureSheetFound,
                SampleSheetCompression = sheet is { Gzip: true } ? "gzip" : null,
                SampleSheetCommentLineCount = sheet?.CommentLineCount ?? 0,
            };
        var inputs = new List<InputFileRecord> { matrixRecord.GetAwaiter().GetResult() };
        if (options.SampleSheetPath is { } path) inputs.Add(Record(path));
        if (options.FeatureSheetPath is { } featureSheetPath) inputs.Add(Record(featureSheetPath));
        return new LoadedPanel(panel, inspection, inputs, descriptions);
    }

    private static RawMatrix ReadMatrix(PanelLoadOptions options, MatrixFileFormat format, CancellationToken ct)
    {
        switch (format)
        {
            case MatrixFileFormat.DelimitedText when options.Layout == PanelLayout.Long:
                return LongTableReader.Read(options.MatrixPath, options, ct);
            case MatrixFileFormat.DelimitedText:
                return DelimitedMatrixReader.Read(options.MatrixPath, options, ct);
            case var _ when options.Layout == PanelLayout.Long:
                throw PanelInputException.At(options.MatrixPath, null, null, "is read as a long table, which is read from CSV/TSV text (plain or gzip) only.",
                    "Export the long table as CSV or TSV, or pivot it to one column per feature before writing Parquet or Arrow.");
            // Describing columns are found in text files only; ignoring the option would load the
            // describing columns as samples or drop the names the user asked for without a word.
            case var _ when options.FeatureColumns is { Count: > 0 }:
                throw PanelInputException.At(options.MatrixPath, null, null,
                    "is Parquet or Arrow, where --feature-columns does not apply: describing columns are read from CSV/TSV features-in-rows files.",
                    "Give the names and annotations in a feature sheet (--feature-sheet) and leave out --feature-columns, or export the matrix as CSV/TSV.");
            case MatrixFileFormat.Parquet:
                using (var table = ParquetTable.Open(options.MatrixPath))
                    return ColumnarMatrixReader.Read(table, options, ct);
            default:
                using (var table = ArrowTable.Open(options.MatrixPath, format, ct))
                    return ColumnarMatrixReader.Read(table, options, ct);
        }
    }

    private static InputFileRecord Record(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16, FileOptions.SequentialScan);
        var hash = SHA256.HashData(stream);
        return new InputFileRecord(path, stream.Length, Convert.ToHexStringLower(hash));
    }
}
