using System.Globalization;
using System.Text;
using OmicsScreen.Data.Output;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Demo;

/// <summary>
/// Writes the demo study as a user would receive it: a samples-in-rows CSV of abundances, a
/// tab-separated sample sheet, and beside them the truth table and a README.
/// </summary>
public static class DemoStudyWriter
{
    public const string PanelFileName = "marrowfen_plasma.csv";
    public const string SampleSheetFileName = "marrowfen_samples.tsv";
    public const string TruthFileName = "marrowfen_truth.tsv";
    public const string FeatureSheetFileName = "marrowfen_features.csv";
    public const string ReadmeFileName = "README.md";

    /// <summary>The file names written, each with the text its every version begins with (how an earlier demo file is recognised).</summary>
    public static IReadOnlyList<(string FileName, string Start)> FileStarts { get; } =
    [
        (PanelFileName, "sample_id,"),
        (SampleSheetFileName, $"sample_id\t{DemoStudy.OutcomeColumn}\t{DemoStudy.CentreColumn}\t"),
        (TruthFileName, "feature\trole\t"),
        (FeatureSheetFileName, "feature,display_name,assay_panel,detection_limit\n"),
        (ReadmeFileName, ReadmeHeading),
    ];

    private const string ReadmeHeading = "# Demo panel: the Marrowfen plasma study (invented)";

    /// <summary>Writes every file atomically and returns their paths.</summary>
    public static DemoStudyFiles Write(DemoStudy study, string folder)
    {
        Directory.CreateDirectory(folder);
        var files = new DemoStudyFiles(
            Path.Combine(folder, PanelFileName),
            Path.Combine(folder, SampleSheetFileName),
            Path.Combine(folder, TruthFileName),
            Path.Combine(folder, ReadmeFileName),
            Path.Combine(folder, FeatureSheetFileName));
        AtomicFile.WriteText(files.Panel, writer => WritePanel(study.Matrix, writer));
        AtomicFile.WriteText(files.SampleSheet, writer => WriteSampleSheet(study, writer));
        AtomicFile.WriteText(files.Truth, writer => WriteTruth(study, writer));
        AtomicFile.WriteText(files.FeatureSheet, writer => WriteFeatureSheet(study, writer));
        AtomicFile.WriteAllText(files.Readme, Readme(study));
        return files;
    }

    private static void WritePanel(FeatureMatrix matrix, TextWriter writer)
    {
        var line = new StringBuilder(matrix.FeatureCount * 10);
        line.Append("sample_id");
        for (int f = 0; f < matrix.FeatureCount; f++) line.Append(',').Append(matrix.FeatureNames[f]);
        writer.Write(line.Append('\n'));
        for (int s = 0; s < matrix.SampleCount; s++)
        {
            line.Clear().Append(matrix.SampleIds[s]);
            for (int f = 0; f < matrix.FeatureCount; f++)
            {
                line.Append(',');
                float value = matrix.Value(f, s);
                switch (matrix.State(f, s))
                {
                    case CellState.Missing:
                        line.Append("NA");
                        break;
                    case CellState.BelowDetection:
                        if (float.IsNaN(value)) line.Append("<LOD");
                        else line.Append('<').Append(value.ToString("G6", CultureInfo.InvariantCulture));
                        break;
                    default:
                        line.Append(value.ToString("G6", CultureInfo.InvariantCulture));
                        break;
                }
            }
            writer.Write(line.Append('\n'));
        }
    }

    private static void WriteSampleSheet(DemoStudy study, TextWriter writer)
    {
        writer.Write($"sample_id\t{DemoStudy.OutcomeColumn}\t{DemoStudy.CentreColumn}\tage_years\tsex\t{DemoStudy.ActivityColumn}\t{DemoStudy.FollowUpColumn}\t{DemoStudy.EventColumn}\n");
        var o = study.Outcomes;
        for (int s = 0; s < study.Matrix.SampleCount; s++)
            writer.Write(string.Create(CultureInfo.InvariantCulture,
                $"{study.Matrix.SampleIds[s]}\t{study.Status[s]}\t{study.Centre[s]}\t{study.AgeYears[s]}\t{study.Sex[s]}\t{o.ActivityScore[s]:0.0}\t{o.MonthsFollowed[s]:0.0}\t{(o.Flare[s] ? "yes" : "no")}\n"));
    }

    /// <summary>Invented syllables for the analytes' lab-facing names; no real protein or metabolite is named so.</summary>
    private static readonly string[] NameStems = ["Fennorin", "Marlase", "Quillectin", "Brackulin", "Sedgomer", "Tarnase", "Woldin", "Heathectin"];

    /// <summary>
    /// The feature sheet a lab would keep beside the matrix: an invented display name per analyte,
    /// the assay panel it was measured on, and its detection limit when it has one.
    /// </summary>
    private static void WriteFeatureSheet(DemoStudy study, TextWriter writer)
    {
        writer.Write("feature,display_name,assay_panel,detection_limit\n");
        for (int f = 0; f < study.Truth.Count; f++)
        {
            var t = study.Truth[f];
            string name = string.Create(CultureInfo.InvariantCulture, $"{NameStems[f % NameStems.Length]}-{f / NameStems.Length + 1}");
            string limit = float.IsNaN(t.DetectionLimit) ? "" : t.DetectionLimit.ToString("G6", CultureInfo.InvariantCulture);
            writer.Write(string.Create(CultureInfo.InvariantCulture, $"{t.Feature},{name},panel {(char)('A' + f % 3)},{limit}\n"));
        }
    }

    private static void WriteTruth(DemoStudy study, TextWriter writer)
    {
        writer.Write("feature\trole\tcase_shift_sd\tcentre_shift_sd\tmodule\tlog2_mean\tlog2_sd\tmissing_rate\thas_detection_limit\tactivity_effect\tlog_hazard_per_sd\n");
        foreach (var t in study.Truth)
        {
            writer.Write(string.Create(CultureInfo.InvariantCulture,
                $"{t.Feature}\t{RoleName(t.Role)}\t{t.CaseShiftSd:0.###}\t{t.CohortShiftSd:0.###}\t{(t.Module >= 0 ? t.Module.ToString(CultureInfo.InvariantCulture) : "")}\t{t.Log2Mean:0.###}\t{t.Log2Sd:0.###}\t{t.MissingRate:0.###}\t{(t.HasDetectionLimit ? "yes" : "no")}\t{t.ActivityEffect}\t{t.LogHazardPerSd:0.###}\n"));
        }
    }

    private static string ActivityCarriers(DemoStudy study) =>
        string.Join(", ", study.Truth.Where(t => t.ActivityEffect.Length > 0).Select(t => $"{t.Feature} ({t.ActivityEffect})"));

    private static string HazardCarriers(DemoStudy study) =>
        string.Join(", ", study.Truth.Where(t => t.LogHazardPerSd != 0).Select(t => string.Create(CultureInfo.InvariantCulture, $"{t.Feature} (log hazard ratio {t.LogHazardPerSd:0.#} per SD)")));

    public static string RoleName(DemoFeatureRole role) => role switch
    {
        DemoFeatureRole.Noise => "noise",
        DemoFeatureRole.Marker => "marker",
        DemoFeatureRole.ModuleMarker => "module_marker",
        DemoFeatureRole.CensoredMarker => "censored_marker",
        DemoFeatureRole.BatchArtefact => "batch_artefact",
        DemoFeatureRole.BatchShifted => "batch_shifted",
        _ => throw new ArgumentOutOfRangeException(nameof(role)),
    };

    private static string Readme(DemoStudy study)
    {
        var o = study.Options;
        int cases = study.Status.Count(s => s == DemoStudy.CaseLabel);
        var planted = study.Truth.Where(t => t.Role is DemoFeatureRole.Marker or DemoFeatureRole.ModuleMarker or DemoFeatureRole.CensoredMarker)
            .Select(t => t.Feature).ToArray();
        var artefact = study.Truth.Where(t => t.Role == DemoFeatureRole.BatchArtefact).Select(t => t.Feature).ToArray();
        var centres = string.Join(", ", o.Centres.Select(c => $"{c.Centre} ({c.Cases} cases, {c.Controls} controls)"));
        return string.Create(CultureInfo.InvariantCulture, $"""
            {ReadmeHeading}

            Everything here is simulated by `omicsscreen demo` (seed {o.Seed}). Marrowfen syndrome is a
            fictional condition; the centres, analytes (`AN0001` ...) and samples (`mf-n001` ...) are
            invented and match no real accession, assay or person.

            - `{PanelFileName}`: {study.Matrix.SampleCount} samples in rows x {study.Matrix.FeatureCount} analytes, linear abundances.
              `NA` is a missing cell; `<LOD` and `<value` are below the detection limit (the limit kept when given).
            - `{SampleSheetFileName}`: sample sheet with `{DemoStudy.OutcomeColumn}` ({cases} {DemoStudy.CaseLabel}, {study.Matrix.SampleCount - cases} {DemoStudy.ControlLabel}),
              `{DemoStudy.CentreColumn}`: {centres}; plus `age_years` and `sex`, which carry no signal, and two more
              outcomes of the same samples: `{DemoStudy.ActivityColumn}` (an invented disease-activity score, a measured
              quantity) and `{DemoStudy.FollowUpColumn}` with `{DemoStudy.EventColumn}` (months to a flare, censored at 60 months or drop-out).
            - `{TruthFileName}`: what was planted in every analyte, so a screen can be scored.
            - `{FeatureSheetFileName}`: feature sheet with an invented lab-facing `display_name` per analyte (`Fennorin-1` ...),
              the `assay_panel` it was measured on, and the `detection_limit` of the analytes that have one.

            ## What was planted
            - {planted.Length} true markers: six acting alone (shifts of 0.6 to 1.2 SD on the log2 scale),
              a correlated module of six that rises together and one of four that falls together, and one
              low-abundance marker that is below detection in many controls: {string.Join(", ", planted)}.
            - One batch artefact, {string.Join(", ", artefact)}: shifted by 2 SD in the `{study.BatchAffectedCentre}` centre only and
              unrelated to the outcome within every centre. Because `{study.BatchAffectedCentre}` recruited more cases, it looks
              associated with the outcome when the centres are pooled.
            - About 10% of the other analytes shifted by 0.4 SD in `{study.BatchAffectedCentre}` (a processing-batch effect),
              {o.ModuleCount - 2} correlated modules of noise analytes, {o.CellMissingRate:P1} of cells missing at random, and
              a few analytes with 20-40% missing.

            - For the activity score: {ActivityCarriers(study)}. For the flares: {HazardCarriers(study)}.
              These five analytes are noise for `{DemoStudy.OutcomeColumn}`; the other outcomes were drawn apart from the abundances.

            Abundance model: log2 value = mean + SD x (sqrt(loading) x module factor + sqrt(1 - loading) x noise)
            + planted shifts; linear value = 2^(log2 value), written with six significant digits.
            """);
    }
}
