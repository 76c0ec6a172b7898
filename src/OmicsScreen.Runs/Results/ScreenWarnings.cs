using System.Globalization;
using OmicsScreen.Data;
using OmicsScreen.Data.Inspection;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Results;

/// <summary>
/// What a screen should be warned about: the loader's warnings (an outcome column given twice,
/// constant features, dropped samples) and settings that are legal for the panel but weak. Printed
/// before the work starts, kept in the manifest's warnings list and shown in the report.
/// </summary>
public static class ScreenWarnings
{
    /// <summary>Fewer trees than this leave out-of-bag estimates and importances visibly seed-dependent (common practice: a few hundred trees).</summary>
    public const int FewTrees = 100;

    /// <summary>Fewer half-sample pairs than this give under 10 repeats: selection frequencies in steps of a tenth or coarser.</summary>
    public const int FewPairs = 5;

    /// <summary>Above this false discovery rate a shortlist is mostly a list of candidates (common practice: 0.05 to 0.2).</summary>
    public const double LooseQ = 0.25;

    /// <summary>Below this Spearman |rho| single linkage chains markers that share little into one group.</summary>
    public const double LowRedundancyRho = 0.5;

    /// <summary>The loader's warnings, then the settings' (<see cref="OfSettings"/>).</summary>
    /// <param name="withSampleIds">False for the report without --show-sample-ids: a warning that names samples says how many instead.</param>
    public static List<string> Of(ScreenOptions options, LoadedPanel loaded, bool withSampleIds = true)
    {
        var warnings = new List<string>();
        foreach (var finding in loaded.Inspection.Findings)
        {
            if (finding.Severity != FindingSeverity.Warning) continue;
            if (!withSampleIds && finding.Code == "unmatched-samples-dropped")
                warnings.Add($"{loaded.Inspection.DroppedSamples.Count} samples were dropped because they are in only one file (--drop-unmatched); the console named them, and --show-sample-ids lists them here.");
            else if (!withSampleIds && finding.Code == "names-differ-only-by-case" && finding.Message.Contains("sample ids", StringComparison.Ordinal))
                warnings.Add("Some sample ids differ from another only by upper and lower case; they are kept as different samples. `omicsscreen check` names them.");
            else warnings.Add(finding.Message);
        }
        warnings.AddRange(OfSettings(options, loaded.Panel));
        return warnings;
    }

    /// <summary>Settings that are legal for this panel but make the screen weak, each in one sentence naming the option and a better value.</summary>
    public static List<string> OfSettings(ScreenOptions options, Panel panel)
    {
        var warnings = new List<string>();
        if (options.TreesPerForest < FewTrees)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--trees {options.TreesPerForest} is few: out-of-bag estimates and importances of so small a forest change visibly with the seed; use {FewTrees} or more (the default is 500)."));
        if (options.HalfSamplePairs < FewPairs)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--pairs {options.HalfSamplePairs} gives only {2 * options.HalfSamplePairs} half-sample repeats: selection frequencies move in steps of {1.0 / (2 * options.HalfSamplePairs):0.##} and the stability of the list rests on few lists; use {FewPairs} or more (the default is 25)."));
        int decoys = ScreenSettings.DecoyCountFor(options, panel.FeatureCount);
        if (decoys > 0 && decoys < DecoyNull.MinimumTailFitCount)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--decoys {decoys} is too few for the p-values' tail fit (it needs {DecoyNull.MinimumTailFitCount}): no p-value can fall below 1/({decoys} + 1) = {1.0 / (decoys + 1):0.####}, so only strong markers can reach the shortlist; leave --decoys out for the automatic count."));
        if (options.OutcomePermutations > 0 && options.OutcomePermutations < DecoyNull.MinimumTailFitCount)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--outcome-permutations {options.OutcomePermutations} gives permutation p-values no smaller than 1/({options.OutcomePermutations} + 1) = {1.0 / (options.OutcomePermutations + 1):0.####}, so the forest's evidence hardly counts; use {DecoyNull.MinimumTailFitCount} or more, or 0."));
        if (options.QValueThreshold > LooseQ)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--max-q {options.QValueThreshold} lets up to {options.QValueThreshold:0%} of the shortlist be false markers; treat the list as candidates, or use 0.05 to 0.2."));
        if (options.RedundancyCorrelation < LowRedundancyRho)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--redundancy-rho {options.RedundancyCorrelation} groups markers whose Spearman |rho| is this low, and single linkage chains them: groups may join markers that share little; use 0.5 or more (the default is 0.7)."));
        if (panel.Kind != OutcomeKind.Classes && options.Balance == BalanceMode.On)
            warnings.Add("--balance on draws class-balanced trees, and this outcome has no classes: every tree draws a plain bootstrap.");
        if (options.FeaturesPerSplit > 1 && options.FeaturesPerSplit == panel.FeatureCount)
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"--features-per-split {options.FeaturesPerSplit} tries every feature at every split: the trees are then alike and the strongest markers mask the others' importance; leave it out for the square root of the feature count (Breiman 2001)."));
        return warnings;
    }
}
