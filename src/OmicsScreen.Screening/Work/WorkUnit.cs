using System.Globalization;

namespace OmicsScreen.Screening.Work;

/// <summary>
/// One piece of a screen that can be computed on its own, in any order, on any machine: its
/// result depends only on the panel, the options and (kind, index), never on what ran before.
/// </summary>
public readonly record struct WorkUnit(WorkUnitKind Kind, int Index)
{
    /// <summary>A stable file-name-safe name, e.g. <c>repeat-0007</c>.</summary>
    public string Name => Kind switch
    {
        WorkUnitKind.Repeat => string.Create(CultureInfo.InvariantCulture, $"repeat-{Index:D4}"),
        WorkUnitKind.CurveFold => string.Create(CultureInfo.InvariantCulture, $"curve-fold-{Index:D3}"),
        WorkUnitKind.CohortScreen => string.Create(CultureInfo.InvariantCulture, $"cohort-screen-{Index:D3}"),
        WorkUnitKind.HeldOutScreen => string.Create(CultureInfo.InvariantCulture, $"held-out-screen-{Index:D3}"),
        _ => throw new ArgumentOutOfRangeException(nameof(Kind)),
    };

    public override string ToString() => Name;
}
