using nietras.SeparatedValues;
using OmicsScreen.Data.Assembly;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Text;

/// <summary>
/// Reads a long table (one row per sample and feature; CSV/TSV, plain or gzip) and pivots it
/// into feature-major columns as it streams: each row writes its one cell straight into its
/// feature's column, so no dense text table is ever held and a file of 10^8 rows needs memory
/// for the matrix (plus one state byte per cell while reading), not for the file.
/// </summary>
/// <remarks>
/// Samples and features are numbered in order of first appearance. A feature's column grows by
/// doubling as new samples appear; cells no row mentions are missing. A cell written twice is a
/// duplicate (sample, feature) pair, refused with both lines (the first is found by reading the
/// file again, which only this error costs). Per-row rules: a value below the row's detection
/// limit becomes below detection at the limit (as a feature sheet's limit does); a set
/// below-detection flag makes the cell below detection (its value the row's limit, or NaN); a set
/// quality flag makes it missing, whatever the value.
/// </remarks>
internal static class LongTableReader
{
    /// <summary>Marks a cell no row has written yet; never left in a loaded matrix.</summary>
    private const CellState Unwritten = (CellState)255;

    private const int CancellationCheckRows = 4096;

    public static RawMatrix Read(string path, PanelLoadOptions options, CancellationToken ct)
    {
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        using var reader = Open(text, delimiter);
        var header = DelimitedMatrixReader.ReadHeader(reader, path, out int commentLines);
        var source = new MatrixSource(path, MatrixFileFormat.DelimitedText, delimiter, PanelLayout.Long)
        {
            Gzip = TextInput.IsGzip(path),
            CommentLineCount = commentLines,
        };
        var columns = LongTableColumns.Resolve(header, options, path);
        var pivot = new Pivot(columns, header.Length, path);
        long rowCount = 0;
        while (reader.MoveNext())
        {
            if ((++rowCount & (CancellationCheckRows - 1)) == 0) ct.ThrowIfCancellationRequested();
            pivot.Add(reader.Current);
        }
        if (pivot.SampleIds.Count == 0)
            throw PanelInputException.At(path, null, null, "has a header row but no data rows.",
                "Export the table again with its data; check that the export did not stop early.");
        return pivot.ToRawMatrix(source, options);
    }

    /// <summary>Samples x features of a long table, by reading it once and counting distinct ids.</summary>
    public static (int Samples, int Features) CountDimensions(string path, PanelLoadOptions options)
    {
        char delimiter = DelimiterDetector.Detect(path);
        using var text = DelimiterDetector.OpenText(path);
        using var reader = Open(text, delimiter);
        var header = DelimitedMatrixReader.ReadHeader(reader, path, out _);
        var columns = LongTableColumns.Resolve(header, options, path);
        var samples = new HashSet<string>(StringComparer.Ordinal);
        var features = new HashSet<string>(StringComparer.Ordinal);
        var sampleLookup = samples.GetAlternateLookup<ReadOnlySpan<char>>();
        var featureLookup = features.GetAlternateLookup<ReadOnlySpan<char>>();
        while (reader.MoveNext())
        {
            var row = reader.Current;
            if (row.ColCount != header.Length) continue;
            sampleLookup.Add(row[columns.Sample].Span.Trim());
            featureLookup.Add(row[columns.Feature].Span.Trim());
        }
        return (samples.Count, features.Count);
    }

    private static SepReader Open(TextReader text, char delimiter) =>
        Sep.New(delimiter)
            .Reader(o => o with { HasHeader = false, Unescape = true, DisableColCountCheck = true })
            .From(text);

    /// <summary>The growing pivot: ids in first-appearance order, one growable column per feature.</summary>
    private sealed class Pivot
    {
        private readonly LongTableColumns _columns;
        private readonly int _fieldCount;
        private readonly string _path;
        private readonly Dictionary<string, int> _sampleIndex = new(StringComparer.Ordinal);
        private readonly Dictionary<string, int> _featureIndex = new(StringComparer.Ordinal);
        private readonly Dictionary<string, int>.AlternateLookup<ReadOnlySpan<char>> _sampleLookup;
        private readonly Dictionary<string, int>.AlternateLookup<ReadOnlySpan<char>> _featureLookup;
        private readonly List<float[]> _values = [];
        private readonly List<CellState[]> _states = [];
        private readonly List<string[]> _sampleAttributes = [];
        private readonly List<string[]> _featureAnnotations = [];
        private readonly List<long> _sampleLines = [];
        private readonly List<long> _featureLines = [];
        private int _capacity = 16;
        private long _rows, _belowRowLimit, _flaggedBelow, _failingQuality, _withoutRow;

        public Pivot(LongTableColumns columns, int fieldCount, string path)
        {
            _columns = columns;
            _fieldCount = fieldCount;
            _path = path;
            _sampleLookup = _sampleIndex.GetAlternateLookup<ReadOnlySpan<char>>();
            _featureLookup = _featureIndex.GetAlternateLookup<ReadOnlySpan<char>>();
        }

        public List<string> SampleIds { get; } = [];
        public List<string> FeatureIds { get; } = [];

        public void Add(SepReader.Row row)
        {
            if (row.ColCount == 1 && row[0].Span.Trim().IsEmpty) return;
            long line = row.LineNumberFrom;
            if (DelimiterDetector.IsComment(row[0].Span)) throw DelimiterDetector.CommentInsideData(_path, line);
            if (row.ColCount != _fieldCount)
                throw PanelInputException.At(_path, line, null,
                    FormattableString.Invariant($"the row has {row.ColCount} fields but the header has {_fieldCount}."),
                    "Fix the row (a stray delimiter, or an unquoted text field containing one); every row needs one field per header column.");
            int sample = SampleOf(row, line);
            int feature = FeatureOf(row, line);

            var kind = CellText.Classify(row[_columns.Value].Span, out float value);
            if (kind is CellKind.NotANumber or CellKind.Infinite)
                throw CellErrors.NotAMeasurement(_path, line, _columns.Header[_columns.Value], FeatureIds[feature],
                    row[_columns.Value].Span, kind);
            float limit = float.NaN;
            if (_columns.Limit >= 0)
            {
                var limitText = row[_columns.Limit].Span;
                var limitKind = CellText.Classify(limitText, out limit);
                if (limitKind is not (CellKind.Measured or CellKind.Missing))
                    throw PanelInputException.At(_path, line, _columns.Header[_columns.Limit],
                        $"the detection limit '{Display.Name(limitText)}' is not a number.",
                        "Give the row's limit as a plain number (a point as decimal separator), or leave it empty or NA for none.");
            }
            var state = kind switch { CellKind.Missing => CellState.Missing, CellKind.BelowDetection => CellState.BelowDetection, _ => CellState.Measured };
            if (state == CellState.Missing) value = float.NaN;
            if (!float.IsNaN(limit))
            {
                if (state == CellState.Measured && value < limit)
                {
                    (state, value) = (CellState.BelowDetection, limit);
                    _belowRowLimit++;
                }
                else if (state == CellState.BelowDetection && float.IsNaN(value)) value = limit;
            }
            if (_columns.BelowFlag >= 0 && Flag(row, _columns.BelowFlag, line))
            {
                (state, value) = (CellState.BelowDetection, limit);
                _flaggedBelow++;
            }
            if (_columns.QualityFlag >= 0 && Flag(row, _columns.QualityFlag, line))
            {
                (state, value) = (CellState.Missing, float.NaN);
                _failingQuality++;
            }
            _rows++;

            var states = _states[feature];
            if (sample >= states.Length) states = Grow(feature, sample);
            if (states[sample] != Unwritten) throw Duplicate(sample, feature, line);
            states[sample] = state;
            _values[feature][sample] = value;
        }

        private bool Flag(SepReader.Row row, int column, long line)
        {
            var text = row[column].Span;
            return FlagText.Read(text) ?? throw PanelInputException.At(_path, line, _columns.Header[column],
                $"the flag '{Display.Name(text)}' is neither set nor clear.",
                $"Write the flag as one of {FlagText.Accepted}.");
        }

        private int SampleOf(SepReader.Row row, long line)
        {
            var id = row[_columns.Sample].Span.Trim();
            if (_sampleLookup.TryGetValue(id, out int sample))
            {
                CheckSame(row, _columns.SampleAttributes, _sampleAttributes[sample], line, "sample", SampleIds[sample], _sampleLines[sample]);
                return sample;
            }
            string name = id.ToString();
            NameRules.Check(name, "sample id", _path, line, _columns.Header[_columns.Sample]);
            sample = SampleIds.Count;
            _sampleIndex.Add(name, sample);
            SampleIds.Add(name);
            _sampleLines.Add(line);
            _sampleAttributes.Add(Texts(row, _columns.SampleAttributes));
            return sample;
        }

        private int FeatureOf(SepReader.Row row, long line)
        {
            var id = row[_columns.Feature].Span.Trim();
            if (_featureLookup.TryGetValue(id, out int feature))
            {
                CheckSame(row, _columns.FeatureAnnotations, _featureAnnotations[feature], line, "feature", FeatureIds[feature], _featureLines[feature]);
                return feature;
            }
            string name = id.ToString();
            NameRules.Check(name, "feature name", _path, line, _columns.Header[_columns.Feature]);
            feature = FeatureIds.Count;
            _featureIndex.Add(name, feature);
            FeatureIds.Add(name);
            _featureLines.Add(line);
            _featureAnnotations.Add(Texts(row, _columns.FeatureAnnotations));
            var states = new CellState[_capacity];
            Array.Fill(states, Unwritten);
            _states.Add(states);
            _values.Add(new float[_capacity]);
            return feature;
        }

        private static string[] Texts(SepReader.Row row, int[] columns)
        {
            var texts = new string[columns.Length];
            for (int a = 0; a < texts.Length; a++) texts[a] = row[columns[a]].Span.Trim().ToString();
            return texts;
        }

        /// <summary>A sample's attributes (a feature's annotations) are repeated on each of its rows and must agree.</summary>
        private void CheckSame(SepReader.Row row, int[] columns, string[] first, long line, string kind, string id, long firstLine)
        {
            for (int a = 0; a < columns.Length; a++)
            {
                var text = row[columns[a]].Span.Trim();
                if (text.SequenceEqual(first[a])) continue;
                throw PanelInputException.At(_path, line, _columns.Header[columns[a]],
                    FormattableString.Invariant($"{kind} '{Display.Name(id)}' has '{Display.Name(text)}' here but '{Display.Name(first[a])}' on line {firstLine}."),
                    $"A {kind}'s column must hold one value on all of its rows: correct the rows that disagree.");
            }
        }

        private CellState[] Grow(int feature, int sample)
        {
            while (_capacity <= sample) _capacity = checked(_capacity * 2);
            var states = _states[feature];
            int old = states.Length;
            Array.Resize(ref states, _capacity);
            states.AsSpan(old).Fill(Unwritten);
            _states[feature] = states;
            var values = _values[feature];
            Array.Resize(ref values, _capacity);
            _values[feature] = values;
            return states;
        }

        private PanelInputException Duplicate(int sample, int feature, long line)
        {
            long first = FirstLineOf(SampleIds[sample], FeatureIds[feature]);
            return PanelInputException.At(_path, line, null,
                FormattableString.Invariant($"sample '{Display.Name(SampleIds[sample])}' and feature '{Display.Name(FeatureIds[feature])}' occur again (first on line {first}); a long table holds one row per sample and feature."),
                "Remove the repeated row, or summarise replicate measurements into one value before loading (replicates of one sample that are separate samples need their own sample ids).");
        }

        /// <summary>Reads the file again for the first row of a pair: only a duplicate's error pays for it.</summary>
        private long FirstLineOf(string sampleId, string featureId)
        {
            using var text = DelimiterDetector.OpenText(_path);
            using var reader = Open(text, DelimiterDetector.Detect(_path));
            DelimitedMatrixReader.ReadHeader(reader, _path, out _);
            while (reader.MoveNext())
            {
                var row = reader.Current;
                if (row.ColCount == _fieldCount && row[_columns.Sample].Span.Trim().SequenceEqual(sampleId)
                    && row[_columns.Feature].Span.Trim().SequenceEqual(featureId))
                    return row.LineNumberFrom;
            }
            return 0;
        }

        public RawMatrix ToRawMatrix(MatrixSource source, PanelLoadOptions options)
        {
            int sampleCount = SampleIds.Count;
            var columns = new float[FeatureIds.Count][];
            var states = new CellState[]?[FeatureIds.Count];
            for (int f = 0; f < columns.Length; f++)
            {
                var values = _values[f];
                var cellStates = _states[f];
                if (values.Length != sampleCount)
                {
                    Array.Resize(ref values, sampleCount);
                    if (cellStates.Length < sampleCount) Grow(f, sampleCount - 1);
                    cellStates = _states[f];
                    Array.Resize(ref cellStates, sampleCount);
                }
                bool unmeasured = false;
                for (int s = 0; s < sampleCount; s++)
                {
                    if (cellStates[s] == Unwritten)
                    {
                        _withoutRow++;
                        cellStates[s] = CellState.Missing;
                        values[s] = float.NaN;
                    }
                    unmeasured |= cellStates[s] != CellState.Measured;
                }
                columns[f] = values;
                states[f] = unmeasured ? cellStates : null;
                options.FeatureLimits?.Apply(FeatureIds[f], columns[f], ref states[f]);
                _values[f] = [];
                _states[f] = [];
            }
            var matrix = new FeatureMatrix(FeatureIds, SampleIds, columns, states);
            var attributes = new Dictionary<string, string[]>(StringComparer.Ordinal);
            for (int a = 0; a < _columns.SampleAttributes.Length; a++)
            {
                var values = new string[sampleCount];
                for (int s = 0; s < sampleCount; s++) values[s] = _sampleAttributes[s][a];
                attributes[_columns.Header[_columns.SampleAttributes[a]]] = values;
            }
            var annotations = new List<(string, string[])>();
            for (int a = 0; a < _columns.FeatureAnnotations.Length; a++)
            {
                var values = new string[FeatureIds.Count];
                for (int f = 0; f < values.Length; f++) values[f] = _featureAnnotations[f][a];
                annotations.Add((_columns.Header[_columns.FeatureAnnotations[a]], values));
            }
            var other = new List<string> { _columns.Header[_columns.Sample] };
            foreach (int c in _columns.SampleAttributes) other.Add(_columns.Header[c]);
            string? Name(int column) => column >= 0 ? _columns.Header[column] : null;
            var found = new Inspection.LongTableFound(_columns.Header[_columns.Sample], _columns.Header[_columns.Feature], _columns.Header[_columns.Value],
                Name(_columns.Limit), Name(_columns.BelowFlag), Name(_columns.QualityFlag), _rows, _belowRowLimit, _flaggedBelow, _failingQuality, _withoutRow);
            return new RawMatrix(source with { LongTable = found }, matrix, attributes, _sampleLines.ToArray(), other)
            {
                FeatureIdColumn = _columns.Header[_columns.Feature],
                FeatureAnnotations = annotations,
            };
        }
    }
}
