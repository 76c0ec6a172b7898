using System.Globalization;
using OmicsScreen.Data.Assembly;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Inspection;

/// <summary>Summarises a loaded panel and raises the findings a user should see before screening.</summary>
internal static class PanelInspector
{
    private const int WorstFeaturesShown = 5;
    /// <summary>Below this many samples a class gives unstable importances (common practice: at least 10 per class).</summary>
    private const int SmallClassSamples = 10;
    /// <summary>Features missing in more than this fraction of samples are flagged.</summary>
    private const double HighMissingFraction = 0.5;
    /// <summary>Samples-to-features ratio (and minimum samples) beyond which the orientation looks swapped.</summary>
    private const int OrientationRatio = 20;
    private const int OrientationMinimumSamples = 1000;
    /// <summary>
    /// Events needed before survival statistics mean much: fewer than 10 is refused, fewer than 50
    /// warned (common practice: about 10 events per candidate predictor for a Cox model, Peduzzi
    /// et al. 1995, and far more for a screen of many markers).
    /// </summary>
    private const int TooFewEvents = 10;
    private const int FewEvents = 50;

    public static PanelInspection Inspect(Panel panel, MatrixSource source, string? sampleSheetPath,
        IReadOnlyList<string> droppedSamples, PanelLoadOptions options, List<InspectionFinding> findings)
    {
        var matrix = panel.Matrix;
        var scan = ScanFeatures(matrix);
        var outcome = panel.Kind == OutcomeKind.Classes ? panel.Outcome : null;
        var classes = new LevelCount[outcome?.ClassCount ?? 0];
        for (int c = 0; c < classes.Length; c++) classes[c] = new LevelCount(outcome!.ClassNames[c], outcome.ClassCounts[c]);

        if (outcome is not null) AddClassFindings(outcome, options, findings);
        if (panel.Measured is { } measured) AddMeasuredFinding(measured, options, findings);
        if (panel.FollowUp is { } followUp) AddFollowUpFindings(followUp, findings);
        AddSubjectFinding(panel.Subject, findings);
        AddCohortFinding(panel.Cohort, findings);
        AddFeatureFindings(matrix, scan, findings);
        AddOrientationFinding(matrix, options.Layout, findings);
        AddCaseOnlyDifferenceFinding(matrix.SampleIds, "sample ids", findings);
        AddCaseOnlyDifferenceFinding(matrix.FeatureNames, "feature names", findings);

        long cellCount = (long)matrix.SampleCount * matrix.FeatureCount;
        return new PanelInspection
        {
            MatrixPath = source.Path,
            FileFormat = source.Format,
            Delimiter = source.Delimiter is { } d ? Text.DelimiterDetector.Describe(d) : null,
            Compression = source.Gzip ? "gzip" : null,
            CommentLineCount = source.CommentLineCount,
            LongTable = source.LongTable,
            Layout = source.Layout,
            SampleSheetPath = sampleSheetPath,
            SampleCount = matrix.SampleCount,
            FeatureCount = matrix.FeatureCount,
            OutcomeKind = panel.Kind,
            OutcomeColumn = panel.OutcomeColumn,
            EventColumn = panel.FollowUp?.EventColumn,
            Classes = classes,
            PositiveClass = outcome is null ? null : outcome.ClassNames[outcome.PositiveClass],
            CohortColumn = panel.Cohort?.ColumnName,
            Cohorts = panel.Cohort is { } cohort ? Levels(cohort) : [],
            ClassesByCohort = panel.Cohort is { } grouping && outcome is not null ? CrossTable(outcome, grouping) : [],
            Covariates = panel.Covariates.Select(Summarise).ToArray(),
            SubjectColumn = panel.Subject?.ColumnName,
            SubjectCount = panel.Subject?.LevelCount ?? 0,
            MissingFraction = cellCount == 0 ? 0 : (double)scan.MissingCells / cellCount,
            MostMissingFeatures = WorstByMissingness(matrix, scan.MissingPerFeature),
            BelowDetectionCellCount = scan.BelowDetectionCells,
            BelowDetectionFeatureCount = scan.BelowDetectionFeatures,
            ConstantFeatures = scan.Constant,
            AllMissingFeatures = scan.AllMissing,
            DroppedSamples = droppedSamples,
            Findings = findings.ToArray(),
        };
    }

    /// <summary>A covariate's range and median (median of the sorted values, mean of the middle two for an even count), or its levels' counts.</summary>
    private static CovariateSummary Summarise(Covariate covariate)
    {
        if (covariate.IsCategorical)
        {
            var counts = new int[covariate.Levels.Count];
            for (int i = 0; i < covariate.SampleCount; i++) counts[covariate.LevelOf(i)]++;
            var levels = new LevelCount[counts.Length];
            for (int l = 0; l < counts.Length; l++) levels[l] = new LevelCount(covariate.Levels[l], counts[l]);
            return new CovariateSummary(covariate.Name, "categorical", double.NaN, double.NaN, double.NaN, levels);
        }
        var sorted = covariate.Values.ToArray();
        Array.Sort(sorted);
        int middle = sorted.Length / 2;
        double median = sorted.Length == 0 ? double.NaN
            : sorted.Length % 2 == 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
        return new CovariateSummary(covariate.Name, "numeric", sorted.Length == 0 ? double.NaN : sorted[0], median,
            sorted.Length == 0 ? double.NaN : sorted[^1], []);
    }

    private sealed record FeatureScan(int[] MissingPerFeature, long MissingCells, long BelowDetectionCells,
        int BelowDetectionFeatures, List<string> Constant, List<string> AllMissing, int ConstantBeyondFloatPrecision);

    /// <summary>2^24: above it a 32-bit float no longer holds every integer, so distinct large integers can read as one value.</summary>
    private const float ExactIntegerLimit = 16_777_216f;

    private static FeatureScan ScanFeatures(FeatureMatrix matrix)
    {
        var missingPerFeature = new int[matrix.FeatureCount];
        long missingCells = 0, belowCells = 0;
        int belowFeatures = 0;
        var constant = new List<string>();
        var allMissing = new List<string>();
        int beyondPrecision = 0;
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            var values = matrix.Column(f);
            var states = matrix.States(f);
            int missing = 0, below = 0;
            // Invariant: (firstState, firstValue) is the first non-missing cell seen; varies
            // becomes true once any later non-missing cell differs from it.
            bool seen = false, varies = false;
            var firstState = CellState.Measured;
            float firstValue = 0;
            for (int s = 0; s < values.Length; s++)
            {
                var state = states.IsEmpty ? CellState.Measured : states[s];
                if (state == CellState.Missing) { missing++; continue; }
                if (state == CellState.BelowDetection) below++;
                if (!seen)
                {
                    seen = true;
                    firstState = state;
                    firstValue = values[s];
                }
                else if (!varies && (state != firstState || !SameValue(values[s], firstValue))) varies = true;
            }
            missingPerFeature[f] = missing;
            missingCells += missing;
            belowCells += below;
            if (below > 0) belowFeatures++;
            if (!seen) allMissing.Add(matrix.FeatureNames[f]);
            else if (!varies)
            {
                constant.Add(matrix.FeatureNames[f]);
                if (Math.Abs(firstValue) >= ExactIntegerLimit) beyondPrecision++;
            }
        }
        return new FeatureScan(missingPerFeature, missingCells, belowCells, belowFeatures, constant, allMissing, beyondPrecision);
    }

    private static bool SameValue(float a, float b) => a == b || (float.IsNaN(a) && float.IsNaN(b));

    /// <summary>A screen draws complementary halves of the subjects; a single subject leaves one half empty.</summary>
    /// <summary>
    /// The cohort check screens each cohort and each leave-one-out set with its own seeds, a
    /// family of at most 999 (Screening's RandomStreams.SlotFamilyWidth); so many levels mostly
    /// mean a sample id named as the cohort.
    /// </summary>
    public const int MaxCohorts = 999;

    private static void AddCohortFinding(SampleGrouping? cohort, List<InspectionFinding> findings)
    {
        if (cohort is null || cohort.LevelCount <= MaxCohorts) return;
        findings.Add(new InspectionFinding(FindingSeverity.Error, "too-many-cohorts", Invariant(
            $"The cohort column '{cohort.ColumnName}' has {cohort.LevelCount} different values; the cohort check compares at most {MaxCohorts} cohorts. Check that --cohort names the recruitment centre, cohort or batch (not a sample or subject id), or leave out --cohort.")));
    }

    private static void AddSubjectFinding(SampleGrouping? subject, List<InspectionFinding> findings)
    {
        if (subject is null) return;
        var seen = new HashSet<int>();
        foreach (int level in subject.SampleLevels) seen.Add(level);
        if (seen.Count < 2)
            findings.Add(new InspectionFinding(FindingSeverity.Error, "single-subject", Invariant(
                $"Every sample belongs to one subject of '{subject.ColumnName}', so resampling by subject leaves nothing to compare; a screen needs at least two subjects. Check that the subject column names the person each sample comes from, or leave out --subject.")));
    }

    /// <summary>States the kind in one line, with the way back to classes, when it was decided from the values.</summary>
    private static void AddMeasuredFinding(MeasuredOutcome measured, PanelLoadOptions options, List<InspectionFinding> findings)
    {
        if (options.OutcomeKind != OutcomeKindChoice.Auto) return;
        var distinct = new HashSet<double>();
        foreach (double value in measured.Values) distinct.Add(value);
        findings.Add(new InspectionFinding(FindingSeverity.Note, "outcome-measured", Invariant(
            $"The outcome '{measured.ColumnName}' holds {distinct.Count} different numbers for {measured.SampleCount} samples, so it is read as a measured quantity; add --outcome-kind classes to read its values as class labels instead.")));
    }

    private static void AddFollowUpFindings(FollowUpOutcome followUp, List<InspectionFinding> findings)
    {
        int events = followUp.EventCount;
        if (events < TooFewEvents)
            findings.Add(new InspectionFinding(FindingSeverity.Error, "too-few-events", Invariant(
                $"'{followUp.EventColumn}' records {events} events among {followUp.SampleCount} samples; survival statistics need at least {TooFewEvents} (common practice), and a screen of many markers far more. Check the event coding (1 = event observed), or follow the samples longer.")));
        else if (events < FewEvents)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "few-events", Invariant(
                $"'{followUp.EventColumn}' records only {events} events among {followUp.SampleCount} samples; with fewer than {FewEvents} (common practice) prognostic markers are found unreliably.")));
    }

    private static void AddClassFindings(ClassOutcome outcome, PanelLoadOptions options, List<InspectionFinding> findings)
    {
        string column = outcome.ColumnName;
        if (outcome.ClassCount < 2)
        {
            findings.Add(new InspectionFinding(FindingSeverity.Error, "single-class", Invariant(
                $"The outcome '{column}' has a single class '{outcome.ClassNames[0]}' ({outcome.SampleCount} samples); a screen needs at least two classes. Check that the outcome column is the right one and that no class was dropped by the sample-sheet join.")));
            return;
        }
        if (OutcomeValues.LooksLikeMeasurement(outcome.ClassNames, outcome.ClassCounts))
        {
            // Only reached when classes were forced: one sentence instead of one error per value.
            findings.Add(new InspectionFinding(FindingSeverity.Error, "outcome-not-classes", Invariant(
                $"The outcome '{column}' holds {outcome.ClassCount} different numbers for {outcome.SampleCount} samples and is read as classes because of --outcome-kind classes, so most classes have a single sample. Leave out --outcome-kind to read it as a measured quantity, or group the values into a few classes in the sample sheet.")));
            return;
        }
        for (int c = 0; c < outcome.ClassCount; c++)
        {
            int count = outcome.ClassCounts[c];
            string name = outcome.ClassNames[c];
            if (count == 1)
                findings.Add(new InspectionFinding(FindingSeverity.Error, "class-with-one-sample", Invariant(
                    $"The class '{name}' of '{column}' has a single sample, which can be neither trained on nor validated. Merge it into another class or remove that sample.")));
            else if (count < SmallClassSamples)
                findings.Add(new InspectionFinding(FindingSeverity.Warning, "small-class", Invariant(
                    $"The class '{name}' of '{column}' has only {count} samples; importances will vary a lot between repeats. Consider merging classes or adding samples.")));
        }
        if (options.PositiveClass is null)
            findings.Add(new InspectionFinding(FindingSeverity.Note, "positive-class-default",
                $"The positive class is '{outcome.ClassNames[outcome.PositiveClass]}', the smallest class; name another positive class to change it."));
    }

    private static void AddFeatureFindings(FeatureMatrix matrix, FeatureScan scan, List<InspectionFinding> findings)
    {
        int uninformative = scan.Constant.Count + scan.AllMissing.Count;
        string precision = scan.ConstantBeyondFloatPrecision == 0 ? "" : Invariant(
            $" {scan.ConstantBeyondFloatPrecision} of them hold values of 16,777,216 or more, where measurements are kept with about 7 significant digits (32-bit floats), so distinct large numbers such as ids or raw counts can read as one value: rescale them (log-transform, or divide) before loading, or leave identifiers out of the matrix.");
        if (uninformative == matrix.FeatureCount)
        {
            findings.Add(new InspectionFinding(FindingSeverity.Error, "all-features-constant", Invariant(
                $"All {matrix.FeatureCount} features are constant or entirely missing, so there is nothing to screen. Check that this is the right file and that values were not lost in the export (for example text turned into one value).{precision}")));
            return;
        }
        if (scan.Constant.Count > 0)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "constant-features", Invariant(
                $"{scan.Constant.Count} features hold a single value in every sample ({Display.List(scan.Constant)}); they cannot separate classes and will never be selected. Remove them or check their export.{precision}")));
        if (scan.AllMissing.Count > 0)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "all-missing-features", Invariant(
                $"{scan.AllMissing.Count} features are missing in every sample ({Display.List(scan.AllMissing)}). Remove them or check their export.")));
        var high = new List<string>();
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            int missing = scan.MissingPerFeature[f];
            if (missing < matrix.SampleCount && missing > HighMissingFraction * matrix.SampleCount) high.Add(matrix.FeatureNames[f]);
        }
        if (high.Count > 0)
            findings.Add(new InspectionFinding(FindingSeverity.Warning, "high-missingness", Invariant(
                $"{high.Count} features are missing in more than half of the samples ({Display.List(high)}); their importances rest on few samples. Consider a missingness filter before screening.")));
        if (scan.BelowDetectionCells > 0)
            findings.Add(new InspectionFinding(FindingSeverity.Note, "below-detection", Invariant(
                $"{scan.BelowDetectionCells} cells in {scan.BelowDetectionFeatures} features are below the detection limit; they are kept as censored values, not as missing.")));
    }

    /// <summary>
    /// Names are compared exactly, so "P001" and "p001" are two samples; spreadsheets and some
    /// instruments change case silently, so such pairs are pointed out (and kept apart).
    /// </summary>
    private static void AddCaseOnlyDifferenceFinding(IReadOnlyList<string> names, string what, List<InspectionFinding> findings)
    {
        var firstByFolded = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        var pairs = new List<string>();
        int pairCount = 0;
        foreach (var name in names)
        {
            if (!firstByFolded.TryAdd(name, name))
            {
                pairCount++;
                if (pairs.Count < 3) pairs.Add($"'{Display.Name(firstByFolded[name])}' and '{Display.Name(name)}'");
            }
        }
        if (pairCount == 0) return;
        findings.Add(new InspectionFinding(FindingSeverity.Warning, "names-differ-only-by-case", Invariant(
            $"{pairCount} {what} differ from another only by upper and lower case ({string.Join(", ", pairs)}{(pairCount > pairs.Count ? ", ..." : "")}); they are kept as different {what}. If they are the same, make them identical in the file.")));
    }

    private static void AddOrientationFinding(FeatureMatrix matrix, PanelLayout layout, List<InspectionFinding> findings)
    {
        if (matrix.SampleCount < OrientationMinimumSamples || matrix.SampleCount < OrientationRatio * matrix.FeatureCount) return;
        string rows = layout == PanelLayout.SamplesInRows ? "rows" : "columns";
        string other = layout == PanelLayout.SamplesInRows ? "with --features-in-rows" : "without --features-in-rows";
        findings.Add(new InspectionFinding(FindingSeverity.Warning, "orientation-suspect", Invariant(
            $"The panel has {matrix.SampleCount} samples but only {matrix.FeatureCount} features; omics panels usually have more features than samples. If the file's {rows} are features, load it {other}.")));
    }

    private static LevelCount[] Levels(SampleGrouping grouping)
    {
        var counts = new int[grouping.LevelCount];
        foreach (int level in grouping.SampleLevels) counts[level]++;
        var levels = new LevelCount[counts.Length];
        for (int l = 0; l < levels.Length; l++) levels[l] = new LevelCount(grouping.LevelNames[l], counts[l]);
        return levels;
    }

    private static ClassCohortCount[] CrossTable(ClassOutcome outcome, SampleGrouping cohort)
    {
        var counts = new int[outcome.ClassCount, cohort.LevelCount];
        var classes = outcome.SampleClasses;
        var levels = cohort.SampleLevels;
        for (int s = 0; s < classes.Length; s++) counts[classes[s], levels[s]]++;
        var table = new ClassCohortCount[outcome.ClassCount * cohort.LevelCount];
        int i = 0;
        for (int c = 0; c < outcome.ClassCount; c++)
            for (int l = 0; l < cohort.LevelCount; l++)
                table[i++] = new ClassCohortCount(outcome.ClassNames[c], cohort.LevelNames[l], counts[c, l]);
        return table;
    }

    private static FeatureFraction[] WorstByMissingness(FeatureMatrix matrix, int[] missingPerFeature)
    {
        var order = new List<int>();
        for (int f = 0; f < missingPerFeature.Length; f++)
            if (missingPerFeature[f] > 0) order.Add(f);
        order.Sort((a, b) => missingPerFeature[a] != missingPerFeature[b]
            ? missingPerFeature[b].CompareTo(missingPerFeature[a])
            : string.CompareOrdinal(matrix.FeatureNames[a], matrix.FeatureNames[b]));
        int shown = Math.Min(WorstFeaturesShown, order.Count);
        var worst = new FeatureFraction[shown];
        for (int i = 0; i < shown; i++)
            worst[i] = new FeatureFraction(matrix.FeatureNames[order[i]], (double)missingPerFeature[order[i]] / matrix.SampleCount);
        return worst;
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
