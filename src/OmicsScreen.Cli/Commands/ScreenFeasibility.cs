using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// Settings that cannot give a meaningful screen of this panel, refused with the option to
/// change before any forest is grown: they depend on the panel's size, so the options record
/// alone cannot check them.
/// </summary>
internal static class ScreenFeasibility
{
    /// <exception cref="CommandInputException">The settings cannot give a meaningful screen of <paramref name="panel"/>.</exception>
    public static void Check(ScreenOptions options, Panel panel)
    {
        int sampleCount = panel.SampleCount;
        int units = SamplingUnitCount(panel);
        string unitName = panel.Subject is null ? "samples" : $"subjects (--subject {panel.Subject.ColumnName})";
        // Each forest of the screen is grown on a half-sample; a node splits only when both
        // children can hold min-leaf samples, so 2 x min-leaf above the half-sample leaves every tree one leaf.
        int halfSample = sampleCount / 2;
        if (2 * options.MinLeafSize > halfSample)
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--min-leaf {options.MinLeafSize} leaves every tree of the screen a single leaf: its forests are grown on half-samples of {halfSample} samples, "
                + $"and a split needs 2 x {options.MinLeafSize} of them. Use --min-leaf {Math.Max(1, halfSample / 4)} or less (the default 1 grows full trees)."));
        if (options.CurveFolds > 0 && TrainingUnits(units, options.CurveFolds) < 2)
        {
            int workable = 0;
            for (int folds = 2; folds <= units; folds++) if (TrainingUnits(units, folds) >= 2) workable = folds;
            string fix = workable >= 2
                ? $"Use --curve-folds {Math.Min(workable, 5)} or fewer, or 0 to skip the panel-size curve."
                : "Use --curve-folds 0 to skip the panel-size curve.";
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--curve-folds {options.CurveFolds} leaves too few {unitName} to train on: the panel has {units}, and in "
                + $"{(options.CurveFolds > units ? "every" : "some")} fold the screen inside it would have fewer than 2 to draw half-samples from. {fix}"));
        }
    }

    /// <summary>Units left for training in the fold with the largest test part (fold sizes differ by at most one unit).</summary>
    private static int TrainingUnits(int units, int folds) => folds > units ? 0 : units - (units + folds - 1) / folds;

    /// <summary>What resampling draws: samples, or whole subjects when a subject column is given.</summary>
    private static int SamplingUnitCount(Panel panel)
    {
        if (panel.Subject is null) return panel.SampleCount;
        var seen = new HashSet<int>();
        foreach (int level in panel.Subject.SampleLevels) seen.Add(level);
        return seen.Count;
    }
}
