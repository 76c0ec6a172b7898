using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Runs.Results;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// The settings of `grow` checked against the panel before the forest is grown: those that can
/// give no meaningful forest are refused with the option to change, the weak ones are named in warnings.
/// </summary>
internal static class GrowFeasibility
{
    /// <exception cref="CommandInputException">The settings cannot give a meaningful forest of <paramref name="panel"/>.</exception>
    public static void Check(GrowRunOptions options, Panel panel)
    {
        int sampleCount = panel.SampleCount;
        if (options.FeaturesPerSplit > panel.FeatureCount)
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--features-per-split {options.FeaturesPerSplit} is more than the panel's {panel.FeatureCount} features. Use --features-per-split {panel.FeatureCount} or fewer "
                + $"(all of them tries every feature at every split), or leave it out for the square root of the feature count."));
        // The engine's subsample: round(fraction x samples), at least 1 and at most all of them.
        int drawn = options.SampleFraction is { } fraction
            ? Math.Clamp((int)Math.Round(fraction * sampleCount, MidpointRounding.AwayFromZero), 1, sampleCount)
            : sampleCount;
        if (options.SampleFraction is { } whole && drawn == sampleCount)
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--sample-fraction {whole} draws all {sampleCount} samples for every tree, so no sample is ever out of bag and the out-of-bag error and AUC are undefined. "
                + $"Use a fraction below {(sampleCount - 0.5) / sampleCount:0.###} (for example 0.632), or leave it out for a bootstrap."));
        // A node splits only when both children can hold min-leaf distinct samples; a bootstrap of
        // n samples holds about 63% of them distinct, a subsample exactly what it draws.
        double distinct = options.SampleFraction is null ? ScreenFeasibility.BootstrapDistinct(sampleCount) : drawn;
        string draw = options.SampleFraction is null
            ? string.Create(CultureInfo.InvariantCulture, $"the panel has {sampleCount} samples, a bootstrap of which holds about {distinct:0} distinct ones")
            : string.Create(CultureInfo.InvariantCulture, $"--sample-fraction {options.SampleFraction} draws {drawn} of the panel's {sampleCount} samples");
        // The smallest leaf the forest will use: the given one or the outcome kind's default.
        int minLeaf = options.MinLeafFor(panel);
        if (2 * minLeaf > distinct)
        {
            string fix = minLeaf > 1
                ? string.Create(CultureInfo.InvariantCulture, $"Use --min-leaf {Math.Max(1, (int)(distinct / 4))} or less (the default 1 grows full trees).")
                : "Draw more samples per tree: a larger --sample-fraction, or leave it out for a bootstrap.";
            throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
                $"--min-leaf {minLeaf} leaves every tree a single leaf: {draw}, and a split needs 2 x {minLeaf} of them. {fix}"));
        }
    }

    /// <summary>Settings that are legal for this panel but make the forest weak, each in one sentence naming the option and a better value.</summary>
    public static List<string> Warnings(GrowRunOptions options, Panel panel)
    {
        var warnings = new List<string>();
        if (options.TreeCount < ScreenWarnings.FewTrees)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--trees {options.TreeCount} is few: the out-of-bag error and the importances of so small a forest change visibly with the seed; use {ScreenWarnings.FewTrees} or more (the default is 500)."));
        if (options.FeaturesPerSplit > 1 && options.FeaturesPerSplit == panel.FeatureCount)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--features-per-split {options.FeaturesPerSplit} tries every feature at every split: the trees are then alike and the strongest features mask the others' importance; leave it out for the square root of the feature count (Breiman 2001)."));
        return warnings;
    }

}
