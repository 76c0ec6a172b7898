using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// Settings that cannot give a meaningful screen of this panel, refused with the option to
/// change before any forest is grown: they depend on the panel's size, so the options record
/// alone cannot check them. Settings that are legal but weak are the Runs project's
/// <see cref="Runs.Results.ScreenWarnings"/>.
/// </summary>
internal static class ScreenFeasibility
{
    /// <exception cref="CommandInputException">The settings cannot give a meaningful screen of <paramref name="panel"/>.</exception>
    public static void Check(ScreenOptions options, Panel panel)
    {
        int sampleCount = panel.SampleCount;
        int units = SamplingUnitCount(panel);
        string unitName = panel.Subject is null ? "samples" : $"subjects (--subject {panel.Subject.ColumnName})";
        if (options.OutcomePermutations > 0 && panel.Kind != OutcomeKind.Classes)
            throw new CommandInputException(
                "--outcome-permutations takes class outcomes only in this version; a measured or time-to-event screen's p-values come from the decoys. Leave the option out.");
        if (options.FeaturesPerSplit > panel.FeatureCount)
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--features-per-split {options.FeaturesPerSplit} is more than the panel's {panel.FeatureCount} features. Use --features-per-split {panel.FeatureCount} or fewer "
                + $"(all of them tries every feature at every split), or leave it out for the square root of the feature count."));
        // Each forest of the screen is grown on a bootstrap of a half-sample; a node splits only
        // when both children can hold min-leaf distinct samples, and a bootstrap of m samples holds
        // about m (1 - (1 - 1/m)^m), 63% of them: with 2 x min-leaf above that every tree is one leaf.
        int halfSample = sampleCount / 2;
        double distinct = BootstrapDistinct(halfSample);
        // The default of 1 is never refused: a panel too small for one split is the inspection's to report.
        if (options.MinLeafSize > 1 && 2 * options.MinLeafSize > distinct)
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--min-leaf {options.MinLeafSize} leaves every tree of the screen a single leaf: its forests are grown on half-samples of {halfSample} samples "
                + $"(a bootstrap of which holds about {distinct:0} distinct ones), and a split needs 2 x {options.MinLeafSize} of them. "
                + $"Use --min-leaf {Math.Max(1, halfSample / 4)} or less (the default 1 grows full trees)."));
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
        if (options.CurveFolds > 0 && panel.Kind == OutcomeKind.TimeToEvent && options.CurveFolds > panel.FollowUp!.EventCount)
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--curve-folds {options.CurveFolds} is more than the {panel.FollowUp.EventCount} events of the follow-up: some fold would hold no event, so its concordance is undefined. "
                + $"Use --curve-folds {Math.Max(2, Math.Min(panel.FollowUp.EventCount, 5))} or fewer, or 0 to skip the panel-size curve."));
        if (options.CurveFolds > 0)
        {
            var (className, classUnits) = panel.Kind == OutcomeKind.Classes ? SmallestClassUnits(panel) : ("", int.MaxValue);
            if (options.CurveFolds > classUnits)
                throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                    $"--curve-folds {options.CurveFolds} is more than the {classUnits} {unitName} of the smallest class '{Display(className)}': some fold would test no "
                    + $"'{Display(className)}' sample, so its AUC, and the panel-size curve's, is undefined. Use --curve-folds {Math.Max(2, Math.Min(classUnits, 5))} or fewer, or 0 to skip the panel-size curve."));
            // The curve's inner screen grows its forests on half of a fold's training part.
            int innerHalf = (sampleCount - (sampleCount + options.CurveFolds - 1) / options.CurveFolds) / 2;
            double innerDistinct = BootstrapDistinct(innerHalf);
            if (options.MinLeafSize > 1 && 2 * options.MinLeafSize > innerDistinct)
                throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                    $"--min-leaf {options.MinLeafSize} leaves every tree of the panel-size curve's inner screens a single leaf: with --curve-folds {options.CurveFolds} they grow "
                    + $"on half-samples of about {innerHalf} samples (a bootstrap of which holds about {innerDistinct:0} distinct ones), and a split needs 2 x {options.MinLeafSize}. "
                    + $"Use --min-leaf {Math.Max(1, innerHalf / 4)} or less, or --curve-folds 0 to skip the curve."));
        }
    }

    /// <summary>The expected number of distinct samples in a bootstrap of <paramref name="count"/> from <paramref name="count"/>: count x (1 - (1 - 1/count)^count).</summary>
    internal static double BootstrapDistinct(int count) =>
        count <= 0 ? 0 : count * (1 - Math.Pow(1 - 1.0 / count, count));

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

    /// <summary>
    /// The class present in the fewest sampling units (samples, or subjects with a sample of it):
    /// a fold's test part holds a class only if one of its units does.
    /// </summary>
    private static (string Name, int Units) SmallestClassUnits(Panel panel)
    {
        var outcome = panel.Outcome;
        var unitsOfClass = new HashSet<int>[outcome.ClassCount];
        for (int c = 0; c < unitsOfClass.Length; c++) unitsOfClass[c] = [];
        for (int s = 0; s < panel.SampleCount; s++)
            unitsOfClass[outcome.SampleClasses[s]].Add(panel.Subject is null ? s : panel.Subject.SampleLevels[s]);
        int smallest = 0;
        for (int c = 1; c < unitsOfClass.Length; c++)
            if (unitsOfClass[c].Count < unitsOfClass[smallest].Count) smallest = c;
        return (outcome.ClassNames[smallest], unitsOfClass[smallest].Count);
    }

    private static string Display(string name) => Console.TextTable.Printable(name);

}
