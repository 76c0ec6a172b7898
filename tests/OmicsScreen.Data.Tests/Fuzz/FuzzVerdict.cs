using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Fuzz;

/// <summary>
/// Judges the result of loading one fuzz case: a load must give a sound panel, a refusal must be
/// a <see cref="PanelInputException"/> with a one-line message naming the file. Returns null when
/// the result is allowed, otherwise what is wrong.
/// </summary>
internal static class FuzzVerdict
{
    public static string? OfPanel(Panel panel, FuzzCase fuzzCase)
    {
        var matrix = panel.Matrix;
        if (panel.SampleCount == 0 || panel.FeatureCount == 0)
            return $"loaded an empty panel ({panel.SampleCount} samples x {panel.FeatureCount} features)";
        if (Repeated(matrix.SampleIds) is { } sample) return $"loaded the sample id '{sample}' twice";
        if (Repeated(matrix.FeatureNames) is { } feature) return $"loaded the feature name '{feature}' twice";
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            var values = matrix.Column(f);
            for (int s = 0; s < values.Length; s++)
                if (matrix.State(f, s) == CellState.Measured && !float.IsFinite(values[s]))
                    return $"loaded the non-finite value {values[s]} as measured (feature '{matrix.FeatureNames[f]}', sample '{matrix.SampleIds[s]}')";
        }
        // Every kind passes the screenability gate now; each must carry an outcome for every sample.
        switch (panel.Kind)
        {
            case OutcomeKind.Classes when panel.Outcome.ClassCount < 1 || panel.Outcome.SampleCount != panel.SampleCount:
                return "loaded an outcome without a class for every sample";
            case OutcomeKind.Measured when panel.Measured!.SampleCount != panel.SampleCount:
                return "loaded a measured outcome without a value for every sample";
            case OutcomeKind.TimeToEvent when panel.FollowUp!.SampleCount != panel.SampleCount:
                return "loaded a follow-up without a time for every sample";
        }
        if (Capacity(fuzzCase) is var (maxSamples, maxFeatures) && (panel.SampleCount > maxSamples || panel.FeatureCount > maxFeatures))
            return $"loaded {panel.SampleCount} samples x {panel.FeatureCount} features, more than the file can hold ({maxSamples} x {maxFeatures})";
        if (fuzzCase.IsUnchanged)
        {
            try
            {
                PanelAssert.Identical(fuzzCase.Seed.Expected, panel);
            }
            catch (Xunit.Sdk.XunitException e)
            {
                return $"the bytes were unchanged but the panel differs from the seed: {e.Message}";
            }
        }
        return null;
    }

    public static string? OfRefusal(PanelInputException error, string matrixPath, string? sampleSheetPath)
    {
        string message = error.Message;
        if (string.IsNullOrWhiteSpace(message)) return "refused with an empty message";
        if (message.Contains('\n') || message.Contains('\r')) return $"refused with a message of several lines: {message}";
        bool namesMatrix = message.Contains(Path.GetFileName(matrixPath), StringComparison.Ordinal);
        bool namesSheet = sampleSheetPath is not null && message.Contains(Path.GetFileName(sampleSheetPath), StringComparison.Ordinal);
        if (!namesMatrix && !namesSheet) return $"refused with a message that names no input file: {message}";
        if (error.FilePath != matrixPath && error.FilePath != sampleSheetPath)
            return $"refused naming the path '{error.FilePath}', which is not an input: {message}";
        return null;
    }

    /// <summary>
    /// Upper bounds on (samples, features) the damaged matrix can hold. Text: a sample or feature
    /// row needs a line, and a column after the first needs a delimiter before it. Any format:
    /// distinct non-empty names need at least one byte each.
    /// </summary>
    private static (long Samples, long Features) Capacity(FuzzCase fuzzCase)
    {
        var bytes = fuzzCase.MatrixBytes;
        if (!fuzzCase.Seed.IsText) return (bytes.Length, bytes.Length);
        long lineBreaks = 0, delimiters = 0;
        foreach (byte b in bytes)
        {
            if (b is (byte)'\n' or (byte)'\r') lineBreaks++;
            else if (b is (byte)',' or (byte)'\t' or (byte)';') delimiters++;
        }
        // The header takes one line, and the first column (ids or feature names) no delimiter.
        long rows = lineBreaks, columns = delimiters;
        return fuzzCase.Seed.Layout == PanelLayout.SamplesInRows ? (rows, columns) : (columns, rows);
    }

    private static string? Repeated(IReadOnlyList<string> names)
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var name in names)
            if (!seen.Add(name)) return name;
        return null;
    }
}
