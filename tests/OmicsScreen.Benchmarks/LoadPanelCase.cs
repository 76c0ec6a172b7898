using System.Diagnostics;
using System.Globalization;
using System.IO.Compression;
using System.Text;
using OmicsScreen.Data.Text;
using OmicsScreen.Data;
using OmicsScreen.Data.Writing;

namespace OmicsScreen.Benchmarks;

/// <summary>
/// Loads a synthetic samples-in-rows panel (sample id, outcome, then features) from CSV, Parquet
/// or Arrow IPC through <see cref="PanelLoader"/>, the path the CLI takes. The files are
/// generated once, deterministically, and cached in the work folder. Each run loads the file
/// twice: `mb_per_s` is the first load of the process (compiling the parser included, what a
/// command-line user waits for), `warm_mb_per_s` the second (the parser itself); the harness's
/// `median_s` covers both.
/// </summary>
public sealed class LoadPanelCase : IBenchmarkCase
{
    /// <summary>Text layouts pipelines write besides the plain CSV, each made from the same panel.</summary>
    public enum TextVariant
    {
        Plain,
        /// <summary>The samples-in-rows CSV, gzip-compressed.</summary>
        Gzip,
        /// <summary>Features in rows (TSV) with two describing columns before the samples.</summary>
        FeaturesDescribed,
        /// <summary>A long CSV: sample, feature, value, group, one row per cell.</summary>
        Long,
        /// <summary>The long CSV, gzip-compressed.</summary>
        LongGzip,
    }

    private readonly int _sampleCount;
    private readonly int _featureCount;
    private readonly MatrixFileFormat _format;
    private readonly PanelLayout _layout;
    private readonly TextVariant _variant;

    /// <param name="layout">The orientation of the Parquet/Arrow copy; the CSV always has samples in rows.</param>
    /// <param name="variant">For text: the layout written (the plain CSV by default).</param>
    public LoadPanelCase(int sampleCount, int featureCount, MatrixFileFormat format,
        PanelLayout layout = PanelLayout.SamplesInRows, TextVariant variant = TextVariant.Plain)
    {
        _sampleCount = sampleCount;
        _featureCount = featureCount;
        _format = format;
        _layout = variant switch
        {
            TextVariant.FeaturesDescribed => PanelLayout.FeaturesInRows,
            TextVariant.Long or TextVariant.LongGzip => PanelLayout.Long,
            _ => layout,
        };
        _variant = variant;
    }

    public string Name => _variant switch
    {
        TextVariant.Gzip => $"load-csv-gzip-{_sampleCount}x{_featureCount}",
        TextVariant.FeaturesDescribed => $"load-tsv-features-described-{_sampleCount}x{_featureCount}",
        TextVariant.Long => $"load-long-{_sampleCount}x{_featureCount}",
        TextVariant.LongGzip => $"load-long-gzip-{_sampleCount}x{_featureCount}",
        _ => $"load-{FormatWord}{(_layout == PanelLayout.FeaturesInRows ? "-features" : "")}-{_sampleCount}x{_featureCount}",
    };

    private string Suffix => _layout == PanelLayout.FeaturesInRows ? "-features" : "";

    private string FormatWord => _format switch
    {
        MatrixFileFormat.DelimitedText => "csv",
        MatrixFileFormat.Parquet => "parquet",
        MatrixFileFormat.ArrowFile => "arrow",
        _ => "arrow-stream",
    };

    private string CsvPath(string work) => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}.csv");

    private string FilePath(string work) => _variant switch
    {
        TextVariant.Gzip => CsvPath(work) + ".gz",
        TextVariant.FeaturesDescribed => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}-features-described.tsv"),
        TextVariant.Long => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}-long.csv"),
        TextVariant.LongGzip => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}-long.csv.gz"),
        _ => WideFilePath(work),
    };

    private string WideFilePath(string work) => _format switch
    {
        MatrixFileFormat.DelimitedText => CsvPath(work),
        MatrixFileFormat.Parquet => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}{Suffix}.parquet"),
        MatrixFileFormat.ArrowFile => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}{Suffix}.arrow"),
        _ => Path.Combine(work, $"panel-{_sampleCount}x{_featureCount}{Suffix}.arrows"),
    };

    private static PanelLoadOptions Options(string path, PanelLayout layout = PanelLayout.SamplesInRows) =>
        new() { MatrixPath = path, OutcomeColumn = "group", Layout = layout };

    public void Prepare(string workDirectory)
    {
        string csv = CsvPath(workDirectory);
        if (!File.Exists(csv)) WriteCsv(csv);
        string path = FilePath(workDirectory);
        if (File.Exists(path)) return;
        var panel = PanelLoader.Load(Options(csv)).Panel;
        if (_variant != TextVariant.Plain)
        {
            WriteVariant(panel, path, workDirectory);
            return;
        }
        // Features in rows are written without the outcome row, so that sample columns stay numeric;
        // the loader then needs a sample sheet, written beside the file.
        bool withAttributes = _layout == PanelLayout.SamplesInRows;
        if (!withAttributes) WriteSheet(panel, SheetPath(workDirectory));
        if (_format == MatrixFileFormat.Parquet)
            ParquetPanelWriter.Write(panel, path, _layout, includeSampleAttributes: withAttributes);
        else
            ArrowPanelWriter.Write(panel, path, _layout, asStream: _format == MatrixFileFormat.ArrowStream,
                includeSampleAttributes: withAttributes);
    }

    /// <summary>Writes the gzip, described features-in-rows or long copy of the panel (cells as the loader reads them back).</summary>
    private void WriteVariant(Engine.Panels.Panel panel, string path, string work)
    {
        var matrix = panel.Matrix;
        string temporary = path + ".tmp";
        using (var file = File.Create(temporary))
        using (Stream stream = _variant is TextVariant.Gzip or TextVariant.LongGzip ? new GZipStream(file, CompressionLevel.Fastest) : file)
        using (var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 20))
        {
            switch (_variant)
            {
                case TextVariant.Gzip:
                    using (var plain = File.OpenRead(CsvPath(work))) { writer.Flush(); plain.CopyTo(stream); }
                    break;
                case TextVariant.FeaturesDescribed:
                    WriteSheet(panel, SheetPath(work));
                    var line = new StringBuilder("feature\tsymbol\tdescription");
                    foreach (var id in matrix.SampleIds) line.Append('\t').Append(id);
                    writer.Write(line.Append('\n'));
                    for (int f = 0; f < matrix.FeatureCount; f++)
                    {
                        line.Clear().Append(matrix.FeatureNames[f]).Append(CultureInfo.InvariantCulture, $"\tSYM{f}\tinvented marker {f}");
                        for (int s = 0; s < matrix.SampleCount; s++) line.Append('\t').Append(CellText.Format(matrix.State(f, s), matrix.Value(f, s)));
                        writer.Write(line.Append('\n'));
                    }
                    break;
                default:
                    writer.Write("sample,feature,value,group\n");
                    for (int s = 0; s < matrix.SampleCount; s++)
                    {
                        string group = panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]];
                        for (int f = 0; f < matrix.FeatureCount; f++)
                            writer.Write($"{matrix.SampleIds[s]},{matrix.FeatureNames[f]},{CellText.Format(matrix.State(f, s), matrix.Value(f, s))},{group}\n");
                    }
                    break;
            }
        }
        File.Move(temporary, path, overwrite: true);
    }

    private string SheetPath(string work) => Path.Combine(work, $"sheet-{_sampleCount}.csv");

    private static void WriteSheet(Engine.Panels.Panel panel, string path)
    {
        var text = new StringBuilder("sample_id,group\n");
        for (int s = 0; s < panel.SampleCount; s++)
            text.Append(panel.Matrix.SampleIds[s]).Append(',')
                .Append(panel.Outcome.ClassNames[panel.Outcome.SampleClasses[s]]).Append('\n');
        File.WriteAllText(path, text.ToString());
    }

    /// <summary>Log-normal-like intensities with 7 significant digits and 1% missing cells; fixed seed.</summary>
    private void WriteCsv(string path)
    {
        var random = new Random(12345);
        string temporary = path + ".tmp";
        using (var writer = new StreamWriter(temporary, false, new UTF8Encoding(false), 1 << 20))
        {
            var line = new StringBuilder("sample_id,group");
            for (int f = 0; f < _featureCount; f++) line.Append(CultureInfo.InvariantCulture, $",F{f + 1:00000}");
            writer.WriteLine(line);
            for (int s = 0; s < _sampleCount; s++)
            {
                line.Clear().Append(CultureInfo.InvariantCulture, $"S{s + 1:00000},{(s % 2 == 0 ? "case" : "control")}");
                for (int f = 0; f < _featureCount; f++)
                {
                    line.Append(',');
                    if (random.Next(100) == 0) line.Append("NA");
                    else line.Append(Math.Exp(random.NextDouble() * 8 - 2).ToString("G7", CultureInfo.InvariantCulture));
                }
                writer.WriteLine(line);
            }
        }
        File.Move(temporary, path, overwrite: true);
    }

    public IReadOnlyList<string> Run(string workDirectory)
    {
        string path = FilePath(workDirectory);
        var options = Options(path, _layout);
        if (_layout == PanelLayout.FeaturesInRows) options = options with { SampleSheetPath = SheetPath(workDirectory) };
        if (_variant == TextVariant.FeaturesDescribed) options = options with { FeatureColumns = ["feature", "symbol", "description"] };
        var processorStart = Process.GetCurrentProcess().TotalProcessorTime;
        var watch = Stopwatch.StartNew();
        var loaded = PanelLoader.Load(options);
        watch.Stop();
        double processorSeconds = (Process.GetCurrentProcess().TotalProcessorTime - processorStart).TotalSeconds;
        double megabytes = new FileInfo(path).Length / 1048576.0;
        double matrixMegabytes = 4.0 * loaded.Panel.SampleCount * loaded.Panel.FeatureCount / 1048576.0;
        double missing = loaded.Inspection.MissingFraction;
        double coldSeconds = watch.Elapsed.TotalSeconds;

        // The first load of a process pays for compiling the parser; a second load of the same
        // file measures the parser itself. The first panel is released first so the peak memory
        // printed still belongs to one panel.
        loaded = null!;
        GC.Collect();
        GC.WaitForPendingFinalizers();
        watch.Restart();
        var warm = PanelLoader.Load(options);
        watch.Stop();
        GC.KeepAlive(warm);
        double warmSeconds = watch.Elapsed.TotalSeconds;
        return
        [
            string.Create(CultureInfo.InvariantCulture, $"file_mb={megabytes:F1}"),
            string.Create(CultureInfo.InvariantCulture, $"mb_per_s={megabytes / coldSeconds:F0}"),
            string.Create(CultureInfo.InvariantCulture, $"warm_s={warmSeconds:F3}"),
            string.Create(CultureInfo.InvariantCulture, $"warm_mb_per_s={megabytes / warmSeconds:F0}"),
            // On a shared machine wall time swings with load; processor time does not.
            string.Create(CultureInfo.InvariantCulture, $"cpu_s={processorSeconds:F3}"),
            string.Create(CultureInfo.InvariantCulture, $"matrix_mb={matrixMegabytes:F1}"),
            string.Create(CultureInfo.InvariantCulture, $"missing={missing:F4}"),
        ];
    }
}
