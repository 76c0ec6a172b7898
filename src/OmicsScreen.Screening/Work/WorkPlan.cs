using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Cohorts;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Work;

/// <summary>
/// Every work unit of a screen of one panel with given options, in a fixed order, and its fixed
/// division into parts: the same panel and options always give the same units and the same parts.
/// </summary>
public sealed class WorkPlan
{
    private WorkPlan(IReadOnlyList<PlannedUnit> units) => Units = units;

    /// <summary>All units in plan order: repeats, curve folds, cohort screens, held-out screens.</summary>
    public IReadOnlyList<PlannedUnit> Units { get; }

    public static WorkPlan For(Panel panel, ScreenSettings settings)
    {
        var options = settings.Options;
        int sampleCount = panel.SampleCount;
        var units = new List<PlannedUnit>();
        // Cost = forests grown x samples each is grown on; trees and features are the same for all units.
        for (int r = 0; r < settings.RepeatCount; r++)
            units.Add(new(new WorkUnit(WorkUnitKind.Repeat, r), 2 * sampleCount / 2.0));
        int innerForests = 2 * 2 * options.CurveInnerPairs;
        int folds = options.CurveFolds * options.CurveFoldRepeats;
        for (int i = 0; i < (options.CurveFolds > 0 ? folds : 0); i++)
            units.Add(new(new WorkUnit(WorkUnitKind.CurveFold, i), innerForests * sampleCount * (options.CurveFolds - 1.0) / options.CurveFolds / 2));
        // The cohort check's inner screens, for every outcome kind, as ScreenRunner runs them.
        if (panel.Cohort is { LevelCount: >= 2 })
        {
            var rows = CohortMembership.RowsOf(panel);
            var screenable = CohortMembership.ScreenableCohorts(panel, rows);
            foreach (int c in screenable)
                units.Add(new(new WorkUnit(WorkUnitKind.CohortScreen, c), innerForests * rows[c].Length / 2.0));
            foreach (int c in CohortMembership.HeldOutCohorts(panel, screenable))
                units.Add(new(new WorkUnit(WorkUnitKind.HeldOutScreen, c), innerForests * (sampleCount - rows[c].Length) / 2.0));
        }
        return new WorkPlan(units);
    }

    /// <summary>
    /// The units of part <paramref name="part"/> (1-based) of <paramref name="partCount"/>, in plan
    /// order. Units go to parts by the longest-processing-time rule (Graham 1969): costliest first,
    /// each to the part with the least work so far, ties to the lower part, so parts take about
    /// equally long and the division is a pure function of the plan.
    /// </summary>
    public IReadOnlyList<WorkUnit> UnitsOfPart(int part, int partCount)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(partCount, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(part, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(part, partCount);
        var byCost = Enumerable.Range(0, Units.Count).ToArray();
        Array.Sort(byCost, (a, b) => Units[a].Cost != Units[b].Cost ? Units[b].Cost.CompareTo(Units[a].Cost) : a.CompareTo(b));
        var load = new double[partCount];
        var owner = new int[Units.Count];
        foreach (int u in byCost)
        {
            int lightest = 0;
            for (int p = 1; p < partCount; p++) if (load[p] < load[lightest]) lightest = p;
            owner[u] = lightest;
            load[lightest] += Units[u].Cost;
        }
        var mine = new List<WorkUnit>();
        for (int u = 0; u < Units.Count; u++) if (owner[u] == part - 1) mine.Add(Units[u].Unit);
        return mine;
    }
}
