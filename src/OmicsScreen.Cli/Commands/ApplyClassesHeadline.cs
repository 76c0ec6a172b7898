using OmicsScreen.Runs.Apply;

namespace OmicsScreen.Cli.Commands;

/// <summary>What `apply --json` prints for a panel locked on classes (no outcome_kind key, as before the other kinds existed).</summary>
public sealed record ApplyClassesHeadline : ApplyHeadline
{
    private ApplyClassesHeadline(ClassesApplied applied) : base(applied)
    {
    }

    public required IReadOnlyDictionary<string, int> Called { get; init; }
    public required string PositiveClass { get; init; }
    public required double? Threshold { get; init; }
    public required double? Auc { get; init; }
    public required double? AucLow95 { get; init; }
    public required double? AucHigh95 { get; init; }
    public required double? Error { get; init; }
    public required double? DiscoveryOutOfBagAuc { get; init; }

    public static ApplyClassesHeadline Of(ClassesApplied applied)
    {
        var (model, scores, performance) = (applied.Model, applied.Scores, applied.Performance);
        var called = new SortedDictionary<string, int>(StringComparer.Ordinal);
        foreach (var name in scores.ClassNames) called[name] = 0;
        foreach (int c in scores.PredictedClasses) called[scores.ClassNames[c]]++;
        return new ApplyClassesHeadline(applied)
        {
            Called = called,
            PositiveClass = model.ClassNames[model.PositiveClass],
            Threshold = model.Threshold,
            Auc = performance?.Auc,
            AucLow95 = performance?.AucInterval?.Lower,
            AucHigh95 = performance?.AucInterval?.Upper,
            Error = performance?.Error,
            DiscoveryOutOfBagAuc = model.OutOfBagAuc,
        };
    }
}
