using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Assembly;

/// <summary>
/// Per-feature detection limits from a feature sheet, applied to each column as a reader builds
/// the matrix (so the matrix is never copied for it), with the cells each one censored counted.
/// </summary>
/// <remarks>
/// A measured value strictly below its feature's limit becomes a below-detection cell holding the
/// limit, as a censored token "&lt;limit" in the file would (common practice: a value under the
/// limit of detection is reported as "&lt; LOD", not as the number). A below-detection cell of the
/// file with no limit of its own (&lt;LOD) takes the feature's limit; one with its own limit keeps it.
/// Missing cells stay missing.
/// </remarks>
internal sealed class DetectionLimits
{
    private readonly Dictionary<string, float> _limits;
    private readonly Dictionary<string, int> _censored = new(StringComparer.Ordinal);

    public DetectionLimits(Dictionary<string, float> limits) => _limits = limits;

    public int FeatureCount => _limits.Count;

    /// <summary>Cells turned below-detection by their feature's limit, per feature that had any.</summary>
    public IReadOnlyDictionary<string, int> CensoredCells => _censored;

    public bool TryGetLimit(string feature, out float limit) => _limits.TryGetValue(feature, out limit);

    /// <summary>Applies the feature's limit to its column in place; the states array is created when a cell is censored.</summary>
    public void Apply(string feature, float[] values, ref CellState[]? states)
    {
        if (!_limits.TryGetValue(feature, out float limit)) return;
        int censored = Censor(values, ref states, limit);
        if (censored > 0) _censored[feature] = censored;
    }

    /// <summary>The censoring rule for one column; returns the number of measured cells it censored.</summary>
    public static int Censor(Span<float> values, ref CellState[]? states, float limit)
    {
        int censored = 0;
        for (int s = 0; s < values.Length; s++)
        {
            var state = states is null ? CellState.Measured : states[s];
            if (state == CellState.Measured && values[s] < limit)
            {
                states ??= new CellState[values.Length];
                states[s] = CellState.BelowDetection;
                values[s] = limit;
                censored++;
            }
            else if (state == CellState.BelowDetection && float.IsNaN(values[s]))
                values[s] = limit;
        }
        return censored;
    }
}
