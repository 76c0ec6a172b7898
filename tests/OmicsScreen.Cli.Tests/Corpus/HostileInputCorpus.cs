using System.IO.Compression;
using System.Text;
using Apache.Arrow;
using Apache.Arrow.Ipc;
using OmicsScreen.Data;
using OmicsScreen.Data.Writing;

namespace OmicsScreen.Cli.Tests.Corpus;

/// <summary>
/// The corpus of hostile and broken inputs: encodings, delimiters, quotes, locale-formatted and
/// out-of-range numbers, broken sample sheets, damaged binary files and paths that are not files.
/// Every message must name the place and the fix; the few inputs that are valid must load.
/// </summary>
internal static class HostileInputCorpus
{
    public const string Sheet = "sample_id,status\ns1,case\ns2,case\ns3,case\ns4,control\ns5,control\ns6,control\n";

    private const string Header = "sample_id,f1,f2\n";

    /// <summary>A valid six-sample comma-separated panel whose third line (sample s2) holds <paramref name="s2Row"/>.</summary>
    private static string WithSecondSample(string s2Row) =>
        Header + "s1,1,2\n" + s2Row + "\ns3,5,6\ns4,7,8\ns5,9,10\ns6,11,13\n";

    private const string Valid = "sample_id,f1,f2\ns1,1,2\ns2,3,4\ns3,5,6\ns4,7,8\ns5,9,10\ns6,11,13\n";

    /// <summary>The valid six-sample panel as a long table: one row per sample and feature.</summary>
    private const string LongValid = "sample,feature,value\ns1,f1,1\ns1,f2,2\ns2,f1,3\ns2,f2,4\ns3,f1,5\ns3,f2,6\ns4,f1,7\ns4,f2,8\ns5,f1,9\ns5,f2,10\ns6,f1,11\ns6,f2,13\n";

    /// <summary>A long table with a quality-flag column "qc" holding "ok" on every row.</summary>
    private static string WithQualityColumn(string longTable) =>
        string.Join('\n', longTable.TrimEnd('\n').Split('\n').Select((line, i) => line + (i == 0 ? ",qc" : ",ok"))) + "\n";

    private static Func<string, byte[]> Text(string contents) => _ => Encoding.UTF8.GetBytes(contents);

    private static Func<string, byte[]> Bytes(byte[] contents) => _ => contents;

    private static readonly Encoding Latin1 = Encoding.Latin1;

    public static IEnumerable<CorpusCase> Cases()
    {
        // Encodings.
        yield return new("UTF-16 file with BOM", "m.csv", Bytes([.. Encoding.Unicode.GetPreamble(), .. Encoding.Unicode.GetBytes(Valid)]), Sheet,
            ExitCode.InputError, ["m.csv", "UTF-16", "UTF-8"]);
        yield return new("Latin-1 accent in a cell", "m.csv", Bytes(Latin1.GetBytes(WithSecondSample("s2,3,\u00e94"))), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "'f2'", "save the file again as UTF-8"]);
        yield return new("Latin-1 accent in a feature name", "m.csv", Bytes(Latin1.GetBytes(Valid.Replace("f1", "caf\u00e9"))), Sheet,
            ExitCode.InputError, ["m.csv", "line 1", "not valid UTF-8", "save the file again as UTF-8"]);
        yield return new("Latin-1 accent in a sample id", "m.csv", Bytes(Latin1.GetBytes(Valid.Replace("s2,", "s\u00e92,"))), Sheet.Replace("s2,", "s\u00e92,"),
            ExitCode.InputError, ["m.csv", "line 3", "not valid UTF-8"]);
        yield return new("BOM in the middle of the file", "m.csv", Text(Header + "s1,1,2\ns2,3,4\n\ufeffs3,5,6\ns4,7,8\ns5,9,10\ns6,11,13\n"), Sheet,
            ExitCode.InputError, ["m.csv", "line 4", "byte-order mark", "without BOM"]);
        // gzip is told by its magic bytes 1F 8B (RFC 1952, 2.3.1), whatever the name, and read directly.
        yield return new("gzip file renamed .csv loads", "m.csv", Bytes(Gzip(Valid)), Sheet, ExitCode.Success, ["samples", "gzip-compressed"]);
        yield return new("a truncated gzip matrix", "m.csv.gz", _ => Gzip(Valid + Valid[16..] .Replace("s", "t"))[..^5], Sheet,
            ExitCode.InputError, ["m.csv.gz", "truncated", "gzip -t"]);

        // Delimiters and quotes.
        yield return new("tabs in a row of a comma file", "m.csv", Text(WithSecondSample("s2\t3\t4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "one field per header column"]);
        yield return new("unterminated quote", "m.csv", Text(WithSecondSample("s2,\"3,4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "fix the row"]);

        // Numbers in locale formats.
        yield return new("decimal comma in a comma file is a ragged row", "m.csv", Text(WithSecondSample("s2,1,5,4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "4 fields"]);
        yield return new("decimal comma in a TSV", "m.tsv", Text("sample_id\tf1\tf2\ns1\t1\t2\ns2\t1,5\t4\ns3\t5\t6\ns4\t7\t8\ns5\t9\t10\ns6\t11\t13\n"), Sheet,
            ExitCode.InputError, ["m.tsv", "line 3", "1.5, not 1,5"]);
        yield return new("German thousands and decimal separators", "m.tsv", Text("sample_id\tf1\tf2\ns1\t1\t2\ns2\t1.234,5\t4\ns3\t5\t6\ns4\t7\t8\ns5\t9\t10\ns6\t11\t13\n"), Sheet,
            ExitCode.InputError, ["m.tsv", "line 3", "'f1'", "without thousands separators"]);
        yield return new("quoted thousands separator", "m.csv", Text(WithSecondSample("s2,\"1,234.5\",4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "1,234.5", "without thousands separators"]);

        yield return new("decimal comma in a semicolon file", "m.csv", Text("sample_id;f1;f2\ns1;1;2\ns2;1,5;4\ns3;5;6\ns4;7;8\ns5;9;10\ns6;11;13\n"), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "1.5, not 1,5"]);
        yield return new("a quote inside an unquoted cell", "m.csv", Text(WithSecondSample("s2,3\"4,4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "fix the row"]);
        yield return new("a trailing delimiter on every line", "m.csv", Text(Valid.Replace("\n", ",\n")), Sheet,
            ExitCode.InputError, ["m.csv", "line 1", "column 4", "give every feature column a name"]);
        yield return new("a NUL byte in a text file", "m.csv", Text(WithSecondSample("s2,3,4\0")), Sheet,
            ExitCode.InputError, ["m.csv", "binary", "CSV"]);
        yield return new("Windows line ends load", "m.csv", Text(Valid.Replace("\n", "\r\n")), Sheet, ExitCode.Success, ["samples"]);
        // Comment lines: '#' and '!' above the header are skipped and stated; inside the data they are an error (common practice).
        yield return new("comment lines above the header load and are counted", "m.csv", Text("# exported by X\n!platform Y\n" + Valid), Sheet,
            ExitCode.Success, ["comment lines", "2 above the header"]);
        yield return new("a comment line inside the data", "m.csv", Text(WithSecondSample("# freezer failure, s2 re-run")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "comment line inside the data", "move the line above the header"]);
        yield return new("blank lines between rows load", "m.csv", Text(Valid.Replace("s3,", "\n\ns3,")), Sheet, ExitCode.Success, ["samples"]);

        // Out-of-range and special numbers.
        yield return new("a hexadecimal number", "m.csv", Text(WithSecondSample("s2,0x1A,4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "0x1A", "correct the cell"]);
        yield return new("an exponent with no digits", "m.csv", Text(WithSecondSample("s2,1.5e,4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "1.5e", "correct the cell"]);
        yield return new("spaces around numbers and a plus sign load", "m.csv", Text(WithSecondSample("s2, 3 ,+4")), Sheet, ExitCode.Success, ["samples"]);
        yield return new("a feature entirely below detection is not an error", "m.csv", Text(Header + "s1,1,<LOD\ns2,3,<LOD\ns3,5,<LOD\ns4,7,<LOD\ns5,9,<LOD\ns6,11,<LOD\n"), Sheet,
            ExitCode.Success, ["below"]);
        foreach (string infinite in new[] { "Inf", "-Inf", "1e400", "-1e400", "Infinity", "-infinity" })
            yield return new($"{infinite} in a cell", "m.csv", Text(WithSecondSample($"s2,{infinite},4")), Sheet,
                ExitCode.InputError, ["m.csv", "line 3", "'f1'", "NA when it is missing"]);
        yield return new("NaN is missing and loads", "m.csv", Text(WithSecondSample("s2,NaN,4")), Sheet, ExitCode.Success, ["samples"]);
        yield return new("negative zero loads", "m.csv", Text(WithSecondSample("s2,-0,-0.0")), Sheet, ExitCode.Success, ["samples"]);
        yield return new("a million-digit number is out of range", "m.csv", Text(WithSecondSample("s2," + new string('9', 1_000_000) + ",4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "'f1'"]);
        yield return new("a million-character text cell", "m.csv", Text(WithSecondSample("s2," + new string('x', 1_000_000) + ",4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "'f1'", "correct the cell"]);
        yield return new("100,000 columns with one broken cell at the end", "m.csv", WideWithBrokenLastCell, Sheet,
            ExitCode.InputError, ["m.csv", "line 7", "'f100000'"]);

        // Columns and names.
        yield return new("a feature with every value missing is a warning", "m.csv", Text(Header + "s1,1,\ns2,3,NA\ns3,5,\ns4,7,\ns5,9,NA\ns6,11,\n"), Sheet,
            ExitCode.Success, ["all-missing-features", "'f2'"]);
        yield return new("a feature name with a tab", "m.tsv", Text("sample_id\t\"f\t1\"\tf2\ns1\t1\t2\ns2\t3\t4\ns3\t5\t6\ns4\t7\t8\ns5\t9\t10\ns6\t11\t13\n"), Sheet,
            ExitCode.InputError, ["m.tsv", "line 1", "control character", "printable"]);
        yield return new("a feature name with a control character", "m.csv", Text("sample_id,f\u00011,f2\ns1,1,2\ns2,3,4\ns3,5,6\ns4,7,8\ns5,9,10\ns6,11,13\n"), Sheet,
            ExitCode.InputError, ["m.csv", "line 1", "control character"]);
        yield return new("an empty sample id in the matrix", "m.csv", Text(WithSecondSample(",3,4")), Sheet,
            ExitCode.InputError, ["m.csv", "line 3", "sample id is empty"]);
        yield return new("features in rows without the flag", "m.csv", Text("feature,s1,s2,s3,s4,s5,s6\nf1,1,2,3,4,5,6\nf2,3,4,5,6,7,9\n"), Sheet,
            ExitCode.InputError, ["m.csv", "one row per feature", "with --features-in-rows"]);
        yield return new("samples in rows given with the features-in-rows flag", "m.csv", Text(Valid), Sheet,
            ExitCode.InputError, ["m.csv", "one row per sample", "without --features-in-rows"], ["--features-in-rows"]);
        yield return new("features in rows with the flag loads", "m.csv", Text("feature,s1,s2,s3,s4,s5,s6\nf1,1,2,3,4,5,6\nf2,3,4,5,6,7,9\n"), Sheet,
            ExitCode.Success, ["samples"], ["--features-in-rows"]);

        // Describing columns before the samples, as expression and protein matrices are commonly written (common practice).
        yield return new("features in rows with a symbol column load and the describing columns are stated", "m.tsv",
            Text("gene_id\tsymbol\ts1\ts2\ts3\ts4\ts5\ts6\nf1\tGENE0\t1\t2\t3\t4\t5\t6\nf2\tGENE1\t3\t4\t5\t6\t7\t9\n"), Sheet,
            ExitCode.Success, ["feature columns", "'gene_id' names each feature", "'symbol'", "--feature-columns"], ["--features-in-rows"]);
        yield return new("a describing column named with --feature-columns that is not there", "m.tsv",
            Text("gene_id\tsymbol\ts1\ts2\ts3\ts4\ts5\ts6\nf1\tGENE0\t1\t2\t3\t4\t5\t6\nf2\tGENE1\t3\t4\t5\t6\t7\t9\n"), Sheet,
            ExitCode.InputError, ["m.tsv", "no column 'Symbol'", "--feature-columns"], ["--features-in-rows", "--feature-columns", "gene_id", "--feature-columns", "Symbol"]);
        // Feature sheets, joined on feature id as sample sheets are on sample id.
        yield return new("a feature sheet with display names and detection limits loads and states them", "m.csv", Text(Valid), Sheet,
            ExitCode.Success, ["feature sheet", "display names in 'display_name'", "detection limits", "2 features with a limit", "3 measured cells below"],
            FeatureSheet: "feature,display_name,detection_limit\nf1,Marker one,4\nf2,Marker two,3\n");
        yield return new("a feature sheet missing a matrix feature and naming another", "m.csv", Text(Valid), Sheet,
            ExitCode.InputError, ["f.csv", "features do not match", "1 in m.csv but not in f.csv ('f2')", "1 in f.csv but not in m.csv ('f7')", "--drop-unmatched"],
            FeatureSheet: "feature,display_name\nf1,Marker one\nf7,Marker seven\n");
        yield return new("a feature id twice in the feature sheet", "m.csv", Text(Valid), Sheet,
            ExitCode.InputError, ["f.csv", "line 4", "'f1' occurs more than once", "one feature-sheet row per feature"],
            FeatureSheet: "feature\nf1\nf2\nf1\n");
        yield return new("a detection limit that is not a number", "m.csv", Text(Valid), Sheet,
            ExitCode.InputError, ["f.csv", "line 2", "'detection_limit'", "not a number"],
            FeatureSheet: "feature,detection_limit\nf1,1,5\nf2,2\n".Replace("1,5", "\"1,5\""));
        // Long tables: one row per sample and feature (common practice in targeted proteomics exports).
        yield return new("a long table loads and is stated", "long.csv", Text(LongValid), Sheet, ExitCode.Success,
            ["long table", "12 rows", "sample 'sample', feature 'feature', value 'value'"], ["--long"]);
        yield return new("a long table with a repeated sample and feature", "long.csv", Text(LongValid + "s3,f2,6.5\n"), Sheet,
            ExitCode.InputError, ["long.csv", "line 14", "sample 's3' and feature 'f2' occur again (first on line", "one row per sample and feature"], ["--long"]);
        yield return new("a long table with a feature the feature sheet lacks", "long.csv", Text(LongValid), Sheet,
            ExitCode.InputError, ["f.csv", "features do not match", "1 in long.csv but not in f.csv ('f2')", "--drop-unmatched"], ["--long"],
            FeatureSheet: "feature,display_name\nf1,Marker one\n");
        yield return new("a feature twice in a features-in-rows file with describing columns", "m.tsv",
            Text("gene_id\tsymbol\ts1\ts2\ts3\ts4\ts5\ts6\nf1\tGENE0\t1\t2\t3\t4\t5\t6\nf1\tGENE1\t3\t4\t5\t6\t7\t9\n"), Sheet,
            ExitCode.InputError, ["m.tsv", "'f1'", "more than once"], ["--features-in-rows"]);
        yield return new("a long table without a value column", "long.csv", Text(LongValid.Replace("value", "npx")), Sheet,
            ExitCode.InputError, ["long.csv", "no column 'value'", "--value-column"], ["--long"]);
        yield return new("a long table flag that is neither set nor clear", "long.csv", Text(WithQualityColumn(LongValid).Replace("s4,f1,7,ok", "s4,f1,7,maybe")), Sheet,
            ExitCode.InputError, ["long.csv", "line 8", "'qc'", "neither set nor clear"], ["--long", "--quality-flag", "qc"]);
        yield return new("--long with --features-in-rows", "long.csv", Text(LongValid), Sheet,
            ExitCode.Usage, ["--features-in-rows and --long"], ["--long", "--features-in-rows"]);
        yield return new("an empty feature name in the header", "m.csv", Text(Valid.Replace("sample_id,f1,", "sample_id,,")), Sheet,
            ExitCode.InputError, ["m.csv", "line 1", "column 2", "has no name"]);
        yield return new("feature names equal once trimmed", "m.csv", Text(Valid.Replace("f1,f2", "f1,f1 ")), Sheet,
            ExitCode.InputError, ["m.csv", "'f1'", "more than once", "unique"]);
        yield return new("a matrix with no feature columns", "m.csv", Text("sample_id\ns1\ns2\ns3\ns4\ns5\ns6\n"), Sheet,
            ExitCode.InputError, ["m.csv", "no feature columns", "check the delimiter"]);

        // Sample sheets.
        yield return new("a UTF-16 sample sheet with BOM loads", "m.csv", Text(Valid), null, ExitCode.Success, ["samples"],
            SampleSheetBytes: [.. Encoding.Unicode.GetPreamble(), .. Encoding.Unicode.GetBytes(Sheet)]);
        // Sheets are read like the matrix: gzip told by content, comment lines above the header skipped and counted.
        yield return new("a gzip sample sheet with comment lines loads and is stated", "m.csv", Text(Valid), null, ExitCode.Success,
            ["sample sheet", "gzip-compressed", "2 comment lines above the header, skipped"],
            SampleSheetBytes: Gzip("# exported by an invented LIMS\n! study \"invented\"\n" + Sheet));
        yield return new("a gzip feature sheet with a comment line loads and is stated", "m.csv", Text(Valid), Sheet, ExitCode.Success,
            ["feature sheet", "gzip-compressed; 1 comment line above the header, skipped", "display names in 'display_name'"],
            FeatureSheetBytes: Gzip("# panel v2\nfeature,display_name\nf1,Marker one\nf2,Marker two\n"));
        yield return new("a comment line inside a feature sheet's data", "m.csv", Text(Valid), Sheet, ExitCode.InputError,
            ["f.csv", "line 3", "comment line inside the data", "above the header"],
            FeatureSheet: "feature,display_name\nf1,Marker one\n# f2 to follow\nf2,Marker two\n");
        yield return new("a truncated gzip sample sheet", "m.csv", Text(Valid), null, ExitCode.InputError, ["s.csv", "truncated", "gzip -t"],
            SampleSheetBytes: Gzip(Sheet)[..^5]);
        yield return new("a Latin-1 accent in a sheet id", "m.csv", Text(Valid), null, ExitCode.InputError, ["s.csv", "line 3", "not valid UTF-8"],
            SampleSheetBytes: Latin1.GetBytes(Sheet.Replace("s2,", "s\u00e92,")));
        yield return new("an empty outcome value", "m.csv", Text(Valid), Sheet.Replace("s1,case", "s1,"),
            ExitCode.InputError, ["s.csv", "line 2", "'s1'", "no outcome value"]);
        yield return new("a sheet without the id column named", "m.csv", Text(Valid), Sheet, ExitCode.InputError, ["patient"],
            ExtraArguments: ["--id-column", "patient"]);
        yield return new("a sample twice in the sheet with different outcomes", "m.csv", Text(Valid), Sheet + "s1,control\n",
            ExitCode.InputError, ["s.csv", "line 8", "s1", "one sample-sheet row per sample"]);
        yield return new("outcome labels differing only by case", "m.csv", Text(Valid), Sheet.Replace("s2,case", "s2,Case"),
            ExitCode.InputError, ["s.csv", "'status'", "differ only by case"]);
        yield return new("outcome labels with surrounding spaces are trimmed", "m.csv", Text(Valid), "sample_id,status\ns1,case \ns2,case\ns3, case\ns4,control  \ns5,control\ns6,control\n",
            ExitCode.Success, ["samples"]);
        yield return new("an empty sample sheet", "m.csv", Text(Valid), "",
            ExitCode.InputError, ["s.csv", "empty", "header row"]);
        yield return new("a header-only sample sheet", "m.csv", Text(Valid), "sample_id,status\n",
            ExitCode.InputError, ["s.csv", "no sample rows"]);
        yield return new("an outcome column with only NA", "m.csv", Text(Valid), "sample_id,status\ns1,NA\ns2,NA\ns3,NA\ns4,NA\ns5,NA\ns6,NA\n",
            ExitCode.InputError, ["s.csv", "line 2", "no outcome value", "fill in its class"]);
        yield return new("sheet ids in a different case from the matrix ids", "m.csv", Text(Valid), Sheet.ToUpperInvariant().Replace("SAMPLE_ID,STATUS", "sample_id,status"),
            ExitCode.InputError, ["s.csv", "'S1'", "'s1'", "spelt the same way"]);
        yield return new("a panel of two samples cannot be screened", "m.csv", Text("sample_id,f1,f2\ns1,1,2\ns4,7,8\n"), "sample_id,status\ns1,case\ns4,control\n",
            ExitCode.NotScreenable, ["cannot be screened"]);
        // Documented behaviour: ids are compared exactly (ordinal), so s1 and S1 are two samples.
        yield return new("sample ids differing only by case are distinct", "m.csv", Text(Valid.Replace("s2,", "S1,")), Sheet.Replace("s2,", "S1,"),
            ExitCode.Success, ["samples"]);

        // Issue 13, finding 2: a row past the fast text reader's 16 Mi-character buffer was an internal error.
        yield return new("2 a samples-in-rows row longer than 16 Mi characters loads", "m.csv", RowPastTheBuffer, Sheet,
            ExitCode.Success, ["samples"], ["--annotation", "note"]);
        yield return new("2 a features-in-rows row longer than 16 Mi characters loads", "m.csv", FeatureRowsPastTheBuffer, null,
            ExitCode.Success, ["samples", "300,000"], ["--features-in-rows"]);
        yield return new("2 a features-in-rows file with rows past 16 Mi characters and --feature-block", "m.csv", FeatureRowsPastTheBuffer, null,
            ExitCode.InputError, ["m.csv", "features in rows", "feature blocks and feature lists do not apply", "split it by rows"],
            ["--features-in-rows", "--feature-block", "1/2"]);

        // Issue 13, finding 11: an outcome given twice, used without a word about the other copy.
        const string WithStatus = "sample_id,status,f1,f2\ns1,case,1,2\ns2,case,3,4\ns3,case,5,6\ns4,control,7,8\ns5,control,9,10\ns6,control,11,13\n";
        yield return new("11 the outcome in both the matrix and the sheet, disagreeing", "m.csv", Text(WithStatus), Sheet.Replace("s4,control", "s4,case"),
            ExitCode.InputError, ["s.csv", "line 5", "'status'", "both in the sample sheet and in the matrix", "'s4'", "Remove the column from one of the files"]);
        yield return new("11 the outcome twice in the sheet, disagreeing", "m.csv", Text(Valid),
            "sample_id,status,status\ns1,case,case\ns2,case,case\ns3,case,control\ns4,control,control\ns5,control,control\ns6,control,control\n",
            ExitCode.InputError, ["s.csv", "line 4", "appears twice", "columns 2 and 3", "Keep one of the two columns"]);
        yield return new("11 the outcome in both the matrix and the sheet, agreeing, loads with a warning", "m.csv", Text(WithStatus), Sheet,
            ExitCode.Success, ["samples", "warning", "'status'", "both in the sample sheet s.csv and in the matrix m.csv", "their values agree"]);
        yield return new("11 the outcome twice in the sheet, agreeing, loads with a warning naming both columns", "m.csv", Text(Valid),
            "sample_id,status,status\ns1,case,case\ns2,case,case\ns3,case,case\ns4,control,control\ns5,control,control\ns6,control,control\n",
            ExitCode.Success, ["samples", "warning", "'status'", "appears twice", "columns 2 and 3", "their values agree", "Keep one of the two"]);

        // Issue 13, finding 14: messages that named the wrong cause.
        yield return new("14 sample ids composed (NFC) in the matrix and decomposed (NFD) in the sheet", "m.csv",
            Text(Valid.Replace("s1,", "s\u00e91,").Replace("s2,", "s\u00e92,")),
            Sheet.Replace("s1,", "se\u03011,").Replace("s2,", "se\u03012,"),
            ExitCode.InputError, ["s.csv", "encode their accented letters differently", "NFC", "NFD", "same Unicode normalisation"]);
        yield return new("14 a TSV whose feature names hold commas is read as tab-separated", "m.tsv",
            Text("sample_id\tIL-6, serum\tTNF, serum, plasma\ns1\t1\t2\ns2\t3\t4\ns3\t5\t6\ns4\t7\t8\ns5\t9\t10\ns6\t11\t13\n"), Sheet,
            ExitCode.Success, ["samples", "tab"]);
        yield return new("14 distinct integers near 9.2e18 are explained, not only called constant", "m.csv",
            Text(Header + "s1,1,9223372036854775001\ns2,3,9223372036854775002\ns3,5,9223372036854775003\ns4,7,9223372036854775004\ns5,9,9223372036854775005\ns6,11,9223372036854775006\n"), Sheet,
            ExitCode.Success, ["constant-features", "'f2'", "16,777,216 or more", "7 significant digits", "rescale them"]);
        yield return new("14 1,234 in a TSV may be thousands or a decimal comma", "m.tsv",
            Text("sample_id\tf1\tf2\ns1\t1\t2\ns2\t1,234\t4\ns3\t5\t6\ns4\t7\t8\ns5\t9\t10\ns6\t11\t13\n"), Sheet,
            ExitCode.InputError, ["m.tsv", "line 3", "thousands separator or a decimal comma", "(1234)", "(1.234)"]);

        // Binary formats and paths.
        yield return new("a 0-byte Parquet file", "m.parquet", Bytes([]), Sheet,
            ExitCode.InputError, ["m.parquet", "empty", "export the matrix again"]);
        yield return new("a truncated Parquet file", "m.parquet", TruncatedParquet, Sheet,
            ExitCode.InputError, ["m.parquet", "truncated or damaged", "write it again"]);
        yield return new("an Arrow file with a date column", "m.arrow", ArrowWithDateColumn, Sheet,
            ExitCode.InputError, ["m.arrow", "'visit'", "neither a number nor text", "float32 or float64"]);
        yield return new("a path that is a directory", "folder.csv", _ => [], Sheet,
            ExitCode.InputError, ["folder.csv", "is a folder", "file itself"]);
        yield return new("a path that does not exist", "absent.csv", _ => [], Sheet,
            ExitCode.InputError, ["absent.csv", "does not exist", "check the matrix path"]);
    }

    private static byte[] Gzip(string text)
    {
        using var buffer = new MemoryStream();
        using (var zip = new GZipStream(buffer, CompressionLevel.Fastest)) zip.Write(Encoding.UTF8.GetBytes(text));
        return buffer.ToArray();
    }

    private static byte[] WideWithBrokenLastCell(string folder)
    {
        const int featureCount = 100_000;
        var text = new StringBuilder(featureCount * 16);
        text.Append("sample_id");
        for (int feature = 1; feature <= featureCount; feature++) text.Append(",f").Append(feature);
        text.Append('\n');
        for (int sample = 1; sample <= 6; sample++)
        {
            text.Append('s').Append(sample);
            for (int feature = 1; feature <= featureCount; feature++)
                text.Append(',').Append(sample == 6 && feature == featureCount ? "broken" : ((sample * 7 + feature) % 13).ToString(System.Globalization.CultureInfo.InvariantCulture));
            text.Append('\n');
        }
        return Encoding.UTF8.GetBytes(text.ToString());
    }

    /// <summary>The valid panel with a text column whose second cell holds 17 million characters.</summary>
    private static byte[] RowPastTheBuffer(string folder) =>
        Encoding.UTF8.GetBytes(Valid.Replace("sample_id,", "sample_id,note,").Replace("s1,", "s1,n,").Replace("s2,", "s2," + new string('x', 17_000_000) + ",")
            .Replace("s3,", "s3,n,").Replace("s4,", "s4,n,").Replace("s5,", "s5,n,").Replace("s6,", "s6,n,"));

    /// <summary>
    /// A features-in-rows panel of 300,000 samples whose outcome is an attribute row and whose two
    /// feature rows hold numbers of over 55 digits: each feature row is over 17 million characters.
    /// </summary>
    private static byte[] FeatureRowsPastTheBuffer(string folder)
    {
        const int sampleCount = 300_000;
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        var zeros = new string('0', 55);
        var text = new StringBuilder(sampleCount * 140);
        text.Append("feature");
        for (int sample = 0; sample < sampleCount; sample++) text.Append(",s").Append(sample.ToString("D6", inv));
        text.Append("\nstatus");
        for (int sample = 0; sample < sampleCount; sample++) text.Append(sample % 2 == 0 ? ",case" : ",control");
        for (int feature = 1; feature <= 2; feature++)
        {
            text.Append("\nf").Append(feature);
            for (int sample = 0; sample < sampleCount; sample++)
                text.Append(',').Append(((sample * 7 + feature) % 13).ToString(inv)).Append('.').Append(zeros).Append(sample % 2);
        }
        text.Append('\n');
        return Encoding.UTF8.GetBytes(text.ToString());
    }

    /// <summary>A valid Parquet panel cut in half: the footer, which Parquet readers need first, is gone.</summary>
    private static byte[] TruncatedParquet(string folder)
    {
        string csv = Path.Combine(folder, "source.csv");
        File.WriteAllText(csv, Valid);
        string sheet = Path.Combine(folder, "source-sheet.csv");
        File.WriteAllText(sheet, Sheet);
        var loaded = PanelLoader.Load(new PanelLoadOptions { MatrixPath = csv, SampleSheetPath = sheet, OutcomeColumn = "status" });
        string parquet = Path.Combine(folder, "source.parquet");
        ParquetPanelWriter.Write(loaded.Panel, parquet, PanelLayout.SamplesInRows);
        byte[] bytes = File.ReadAllBytes(parquet);
        return bytes[..(bytes.Length / 2)];
    }

    /// <summary>An Arrow IPC file whose second column is a date, which is not a measurement type.</summary>
    private static byte[] ArrowWithDateColumn(string folder)
    {
        var ids = new StringArray.Builder().AppendRange(["s1", "s2", "s3", "s4", "s5", "s6"]).Build();
        var f1 = new DoubleArray.Builder().AppendRange([1, 3, 5, 7, 9, 11]).Build();
        var visitBuilder = new Date32Array.Builder();
        for (int day = 1; day <= 6; day++) visitBuilder.Append(new DateTime(2024, 1, day));
        var schema = new Schema.Builder()
            .Field(f => f.Name("sample_id").DataType(Apache.Arrow.Types.StringType.Default))
            .Field(f => f.Name("f1").DataType(Apache.Arrow.Types.DoubleType.Default))
            .Field(f => f.Name("visit").DataType(Apache.Arrow.Types.Date32Type.Default))
            .Build();
        var batch = new RecordBatch(schema, [ids, f1, visitBuilder.Build()], 6);
        using var buffer = new MemoryStream();
        using (var writer = new ArrowFileWriter(buffer, schema, leaveOpen: true))
        {
            writer.WriteRecordBatch(batch);
            writer.WriteEnd();
        }
        return buffer.ToArray();
    }
}
