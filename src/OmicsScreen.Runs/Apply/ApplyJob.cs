using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Reporting.Manifests;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Runs.Output;
using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// `apply`: reads a locked panel and a new cohort, scores the cohort, evaluates the panel when the
/// outcome is known, and writes the results folder (the tables, the page, then the manifest). One
/// procedure for every outcome kind; what differs by kind is an <see cref="ApplyKind{TModel, TKnown, TScores, TPerformance}"/>.
/// Every refusal comes before the folder's earlier outputs are removed. Prints nothing.
/// </summary>
public static class ApplyJob
{
    /// <param name="notes">Where the results folder's lock reports waiting for another run.</param>
    public static AppliedPanel Run(ApplyRequest request, TextWriter notes)
    {
        request.Validate();
        InputPathGuard.Check(request.ModelPath, "locked panel");
        InputPathGuard.Check(request.MatrixPath, "matrix");
        InputPathGuard.Check(request.SampleSheetPath, "sample sheet");
        // The folder is checked and locked before any work; a refused run leaves it as it was.
        using var folder = ResultsFolder.Open(request.OutputFolder, request.Force, ResultsKind.Apply,
            [request.ModelPath, request.MatrixPath, request.SampleSheetPath], notes);
        var started = DateTimeOffset.UtcNow;
        var stored = LockedPanelFile.ReadAny(request.ModelPath);
        CheckOptionsFit(stored.Kind, request);
        return stored.Kind switch
        {
            OutcomeKind.Measured => Apply(new MeasuredApplyKind(stored.Measured!), request, stored, folder, started),
            OutcomeKind.TimeToEvent => Apply(new FollowUpApplyKind(stored.FollowUp!), request, stored, folder, started),
            _ => Apply(new ClassesApplyKind(stored.Classes!), request, stored, folder, started),
        };
    }

    private static AppliedPanel Apply<TModel, TKnown, TScores, TPerformance>(ApplyKind<TModel, TKnown, TScores, TPerformance> kind,
        ApplyRequest request, LoadedLockedPanel stored, ResultsFolder folder, DateTimeOffset started)
        where TKnown : class
        where TPerformance : class
    {
        var (matrix, known, inputs) = LoadCohort(kind, request);
        if (known is not null) kind.CheckKnown(request, known);
        var overlap = DiscoveryOverlap.Warnings(kind.Provenance, stored.DiscoverySampleIdHashes, inputs, matrix.SampleIds);
        TScores scores;
        try
        {
            scores = kind.Score(matrix);
        }
        catch (MissingMarkersException e)
        {
            throw new RunRefusedException($"{Path.GetFileName(request.MatrixPath)}: {e.Message}", RunRefusal.Input);
        }
        var performance = known is null ? null : kind.Evaluate(request, scores, known);

        folder.ClearEarlierOutputs();
        kind.WriteTables(folder, scores, known, performance, overlap);
        folder.WriteText(ApplyResultFiles.Report, w => w.Write(kind.Report(request, scores, performance, overlap, stored.DisplayNames)));
        WriteManifest(folder, request, stored, inputs, started);
        return kind.Result(folder.Path, overlap, stored.DisplayNames, scores, performance);
    }

    /// <summary>The cohort's matrix, its known outcome (null when none was named) and the files read.</summary>
    private static (FeatureMatrix Matrix, TKnown? Known, IReadOnlyList<InputFileRecord> Inputs) LoadCohort<TModel, TKnown, TScores, TPerformance>(
        ApplyKind<TModel, TKnown, TScores, TPerformance> kind, ApplyRequest request)
        where TKnown : class
        where TPerformance : class
    {
        if (!request.OutcomeKnown)
        {
            var (matrix, input) = MatrixLoader.Load(request.MatrixPath, request.Layout, request.SampleIdColumn, request.AnnotationColumns,
                longColumns: request.MatrixColumns());
            return (matrix, null, [input]);
        }
        // A panel of one kind evaluates only that kind: another is refused before anything is written.
        var loaded = PanelLoader.Load(kind.LoadOptions(request));
        EnsureKind(loaded, kind.Kind, request);
        return (loaded.Panel.Matrix, kind.Known(loaded.Panel), loaded.Inputs);
    }

    /// <summary>
    /// Refuses options that belong to another outcome kind than the locked panel's, before the
    /// cohort is read: a usage error naming the options the panel needs.
    /// </summary>
    private static void CheckOptionsFit(OutcomeKind kind, ApplyRequest request)
    {
        string model = Path.GetFileName(request.ModelPath);
        switch (kind)
        {
            case OutcomeKind.Classes when request.FollowUpColumn is not null:
                throw new RunRefusedException($"{model} is a panel locked on classes, so it calls classes; --follow-up, --event and --horizon are for a panel locked on a time to an event. Name the known class with --outcome.");
            case OutcomeKind.Measured when request.FollowUpColumn is not null:
                throw new RunRefusedException($"{model} is a panel locked on a measured outcome, so it predicts that quantity; --follow-up, --event and --horizon are for a panel locked on a time to an event. Name the known value with --outcome.");
            case OutcomeKind.TimeToEvent when request.OutcomeColumn is not null:
                throw new RunRefusedException($"{model} is a panel locked on a time to an event, so it scores risk; name the cohort's follow-up with --follow-up and --event instead of --outcome.");
        }
    }

    /// <summary>Refuses a cohort whose outcome, as read, is of another kind than the locked panel's (read, but not usable as it is).</summary>
    private static void EnsureKind(LoadedPanel loaded, OutcomeKind expected, ApplyRequest request)
    {
        if (loaded.Panel.Kind == expected) return;
        string found = loaded.Panel.Kind switch
        {
            OutcomeKind.Measured => $"the outcome '{loaded.Panel.OutcomeColumn}' is a measured quantity",
            OutcomeKind.TimeToEvent => "the outcome is a time to an event",
            _ => $"the outcome '{loaded.Panel.OutcomeColumn}' reads as classes",
        };
        throw new PanelNotScreenableException(
            $"{Path.GetFileName(request.MatrixPath)}: {found}, but {Path.GetFileName(request.ModelPath)} is a panel locked on {LockedPanelJson.KindText(expected)}. "
            + $"Apply a panel locked on {LockedPanelJson.KindText(loaded.Panel.Kind)} (a screen of this outcome writes one), or name a column of {OutcomeText(expected)}; "
            + "`omicsscreen check` on the same files describes the outcome.",
            request.MatrixPath);
    }

    private static string OutcomeText(OutcomeKind kind) => kind == OutcomeKind.Classes ? "classes" : "the quantity the panel predicts";

    /// <summary>The manifest, written last; a class panel's names no outcome kind, so its manifests read as before.</summary>
    private static void WriteManifest(ResultsFolder folder, ApplyRequest request, LoadedLockedPanel stored, IReadOnlyList<InputFileRecord> inputs,
        DateTimeOffset started)
    {
        var manifest = new ApplyManifest
        {
            Version = ToolVersion.Current,
            CommandLine = ShellWords.Join(request.CommandLine),
            StartedUtc = started.ToString("O"),
            FinishedUtc = DateTimeOffset.UtcNow.ToString("O"),
            Model = new ManifestLockedPanel
            {
                Path = request.ModelPath,
                Sha256 = LockedPanelFile.FileSha256(request.ModelPath),
                Markers = stored.MarkerNames,
                MarkerDisplayNames = stored.DisplayNames,
                DiscoveryInputsSha256 = stored.Provenance.InputSha256,
                OutcomeKind = stored.Kind switch
                {
                    OutcomeKind.Measured => LockedPanelJson.MeasuredKind,
                    OutcomeKind.TimeToEvent => LockedPanelJson.TimeToEventKind,
                    _ => null,
                },
            },
            Inputs = inputs.Select(i => new ManifestInput(i.Path, i.ByteCount, i.Sha256)).ToArray(),
            Outputs = folder.WrittenFiles.ToArray(),
        };
        folder.WriteText(ResultsFolder.ManifestFileName, w => ManifestJson.Write(w, manifest));
    }
}
