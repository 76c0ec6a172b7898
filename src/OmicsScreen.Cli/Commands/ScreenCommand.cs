using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen screen`: the main job. Repeated half-sample forests, corrected and permutation
/// importance, a stability-ranked shortlist with error control, and the selection-aware panel-size curve.
/// </summary>
public sealed class ScreenCommand : Command, IHelpLayout
{
    private static readonly ScreenOptions Defaults = new();

    public PanelInputOptions Input { get; } = new();

    public Option<string?> Out { get; } = CommonOptions.Out("Results folder. Default: a folder named after the panel file in reports/.");

    public Option<bool> Force { get; } = CommonOptions.Force("Write into a non-empty folder that does not hold an earlier screen's results.");

    public Option<bool> Resume { get; } = new("--resume")
    {
        Description = "Continue an unfinished run from the checkpoint in its results folder (or part folder): finished repeats and folds are not computed again.",
    };

    public Option<string?> Part { get; } = new("--part")
    {
        HelpName = "I/N",
        Description = "Run only part I of N of the work (repeats and folds) into the --out folder, for `omicsscreen merge` to join later.",
    };

    public Option<int> Pairs { get; } = new("--pairs")
    {
        HelpName = "N",
        Description = "Complementary pairs of half-samples; two forests are grown on each half.",
        DefaultValueFactory = _ => Defaults.HalfSamplePairs,
    };

    public Option<int> Trees { get; } = new("--trees")
    {
        HelpName = "N",
        Description = "Trees per forest.",
        DefaultValueFactory = _ => Defaults.TreesPerForest,
    };

    public Option<int?> FeaturesPerSplit { get; } = new("--features-per-split")
    {
        Description = "Features tried at each split. Default: floor(sqrt(features)).",
        HelpName = "K",
    };

    public Option<int?> MinLeaf { get; } = new("--min-leaf")
    {
        HelpName = "N",
        Description = "Fewest samples a leaf may hold. Default: 1 for classes (full trees), 5 for measured and time-to-event outcomes.",
    };

    public Option<BalanceMode> Balance { get; } = new("--balance")
    {
        Description = "Class-balanced drawing for each tree: auto (when the smallest class is under 2/3 of the largest), on or off.",
        HelpName = "auto|on|off",
        DefaultValueFactory = _ => Defaults.Balance,
    };

    public Option<InteractionScanMode> InteractionScan { get; } = new("--interaction-scan")
    {
        Description = "The pairwise scan for markers that act only together (both high or both low against one of each): auto, on or off. Auto runs it up to 150,000,000 feature pairs (about 10,000 features with their decoys). Needs decoys.",
        HelpName = "MODE",
        DefaultValueFactory = _ => Defaults.InteractionScan,
    };

    public Option<double> RepeatLevel { get; } = new("--repeat-level")
    {
        Description = "A repeat selects the features whose corrected importance beats this upper quantile of its null (mirrored and decoy importances).",
        DefaultValueFactory = _ => Defaults.RepeatSelectionLevel,
        HelpName = "A",
    };

    public Option<int?> PerRepeat { get; } = new("--per-repeat-cap")
    {
        Description = "Most features a repeat may select (its best ones). Default: no cap.",
        HelpName = "N",
    };

    public Option<double> MinFrequency { get; } = new("--min-frequency")
    {
        Description = "Selection frequency a marker needs for the shortlist: above 0.5 and at most 1; 0 leaves the list to the q-values.",
        DefaultValueFactory = _ => Defaults.FrequencyThreshold,
        HelpName = "F",
    };

    public Option<double> MaxQ { get; } = new("--max-q")
    {
        Description = "False discovery rate level: the largest q-value a shortlisted marker may have.",
        DefaultValueFactory = _ => Defaults.QValueThreshold,
        HelpName = "Q",
    };

    public Option<int?> Decoys { get; } = new("--decoys")
    {
        Description = "Decoys: copies of features permuted once per run and screened beside them; they give the p-values' null and the estimate of false markers. 0 turns them off. Default: one per feature, at least 1,000 and at most 5,000.",
        HelpName = "N",
    };

    public Option<string> Rule { get; } = new("--shortlist-rule")
    {
        Description = "How the list is cut: q-value (Benjamini-Hochberg on the decoy-calibrated p-values) or decoy-bound (the longest list whose decoy estimate, with the +1 correction, stays at or under --max-q).",
        DefaultValueFactory = _ => "q-value",
        HelpName = "RULE",
    };

    public Option<int> OutcomePermutations { get; } = new("--outcome-permutations")
    {
        Description = "Permute the outcome this many times for permutation p-values (Altmann et al. 2010); 0 uses the mirrored-null p-values.",
        DefaultValueFactory = _ => Defaults.OutcomePermutations,
        HelpName = "N",
    };

    public Option<double> RedundancyRho { get; } = new("--redundancy-rho")
    {
        Description = "Spearman |rho| at which shortlisted markers share a redundancy group.",
        HelpName = "RHO",
        DefaultValueFactory = _ => Defaults.RedundancyCorrelation,
    };

    public Option<int> CurveFolds { get; } = new("--curve-folds")
    {
        HelpName = "N",
        Description = "Outer folds of the panel-size curve (0 skips the curve).",
        DefaultValueFactory = _ => Defaults.CurveFolds,
    };

    public Option<int> CurveRepeats { get; } = new("--curve-repeats")
    {
        HelpName = "N",
        Description = "Repeats of the outer folds.",
        DefaultValueFactory = _ => Defaults.CurveFoldRepeats,
    };

    public Option<int> CurveInnerPairs { get; } = new("--curve-inner-pairs")
    {
        HelpName = "N",
        Description = "Half-sample pairs of the screen run inside each outer fold.",
        DefaultValueFactory = _ => Defaults.CurveInnerPairs,
    };

    public Option<int> MaxPanelSize { get; } = new("--max-panel-size")
    {
        HelpName = "N",
        Description = "Largest panel size on the curve.",
        DefaultValueFactory = _ => Defaults.CurveMaxPanelSize,
    };

    public Option<ulong> Seed { get; } = CommonOptions.Seed("Seed of the whole run; the same seed gives the same results on any number of threads.", Defaults.Seed);

    public Option<int?> Threads { get; } = CommonOptions.Threads("Threads to use. Default: all cores.");

    public Option<bool> ShowSampleIds { get; } = new("--show-sample-ids")
    {
        Description = "Put sample identifiers in the report's charts (chart descriptions and each point's hover title). Off by default: identifiers can be personal data.",
    };

    public Option<bool> Quiet { get; } = CommonOptions.Quiet();

    public Option<bool> Json { get; } = new("--json")
    {
        Description = "Print the headline results (shortlist, locked panel, files written) as JSON on standard output instead of the text summary; messages stay on standard error.",
    };

    public Option<long?> MemoryLimit { get; } = new("--memory-limit")
    {
        HelpName = "SIZE",
        Description = "Stop before loading if the estimated memory exceeds SIZE (bytes, or K, M, G, T in powers of 1024: 512M, 8G, 2.5G). Default: 90% of the available memory.",
        CustomParser = Memory.ByteSize.ParseOption,
    };

    public IReadOnlyList<HelpSection> HelpSections =>
    [
        new("Input", [Input.SampleSheet, Input.Outcome, Input.OutcomeKind, Input.FollowUp, Input.Event, Input.PositiveClass, Input.Subject, Input.Covariates, Input.SampleIdColumn, Input.Annotations,
            Input.FeatureSheet, Input.DetectionLimit, Input.FeaturesInRows, Input.Long, Input.FeatureColumns, Input.ValueColumn,
            Input.BelowDetectionFlag, Input.QualityFlag, Input.DisplayName, Input.DropUnmatched, Input.FeatureBlock, Input.KeepFeatures]),
        new("Forest", [Trees, FeaturesPerSplit, MinLeaf, Balance]),
        new("Selection and error control", [Pairs, RepeatLevel, PerRepeat, MinFrequency, MaxQ, Rule, Decoys, InteractionScan, OutcomePermutations, RedundancyRho]),
        new("Panel-size curve", [CurveFolds, CurveRepeats, CurveInnerPairs, MaxPanelSize]),
        new("Cohorts", [Input.Cohort]),
        new("Run", [Out, Force, Resume, Part, Seed, Threads, MemoryLimit, ShowSampleIds, Quiet, Json]),
    ];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("Screen a matrix whose outcome is a text column of the same file", "omicsscreen screen wdbc.csv --outcome diagnosis --out reports/wdbc"),
        new("Screen with a sample sheet and three recruitment centres, check the cohorts, and measure what the panel adds over age, sex and body mass",
            "omicsscreen screen plasma.csv --samples sheet.tsv --outcome status --cohort centre --covariates age,sex,bmi --out reports/plasma"),
        new("A stricter shortlist with more repeats, repeatable with its seed",
            "omicsscreen screen plasma.csv --samples sheet.tsv --outcome status --pairs 50 --min-frequency 0.8 --max-q 0.05 --seed 7"),
    ];

    public ScreenCommand(CliConsole console)
        : base("screen", "Screen a panel: repeated random forests on half-samples, a stability-ranked shortlist with error control, and the panel-size curve.")
    {
        Input.AddTo(this, withCovariates: true);
        foreach (var option in new Option[] { Out, Force, Resume, Part, Pairs, Trees, FeaturesPerSplit, MinLeaf, Balance, RepeatLevel, PerRepeat,
                     MinFrequency, MaxQ, Rule, Decoys, InteractionScan, OutcomePermutations, RedundancyRho, CurveFolds, CurveRepeats, CurveInnerPairs,
                     MaxPanelSize, Seed, Threads, ShowSampleIds, Quiet, Json })
            Options.Add(option);
        Options.Add(MemoryLimit);
        SetAction(parse => CommandRunner.Run(console, () => ScreenRun.Execute(console, new ScreenRunOptions
        {
            Panel = Input.ToLoadOptions(parse),
            OutputFolder = parse.GetValue(Out),
            Force = parse.GetValue(Force),
            Resume = parse.GetValue(Resume),
            Part = parse.GetValue(Part) is { } part ? IndexOfCount.ParsePart(part) : null,
            Quiet = parse.GetValue(Quiet),
            Json = parse.GetValue(Json),
            MemoryLimit = parse.GetValue(MemoryLimit),
            ShowSampleIds = parse.GetValue(ShowSampleIds),
            CommandLine = ["omicsscreen", .. parse.Tokens.Select(t => t.Value)],
            Screen = new ScreenOptions
            {
                Seed = parse.GetValue(Seed),
                HalfSamplePairs = parse.GetValue(Pairs),
                TreesPerForest = parse.GetValue(Trees),
                FeaturesPerSplit = ScreenOptionChecks.Given(parse.GetValue(FeaturesPerSplit), "--features-per-split", 1, "leave it out for the square root of the feature count"),
                MinLeafSize = ScreenOptionChecks.Given(parse.GetValue(MinLeaf), "--min-leaf", 1, "leave it out for the outcome kind's default"),
                Balance = parse.GetValue(Balance),
                RepeatSelectionLevel = parse.GetValue(RepeatLevel),
                SelectedPerRepeat = ScreenOptionChecks.Given(parse.GetValue(PerRepeat), "--per-repeat-cap", 1, "leave it out for no cap"),
                FrequencyThreshold = parse.GetValue(MinFrequency),
                QValueThreshold = parse.GetValue(MaxQ),
                DecoyCount = ScreenOptionChecks.Given(parse.GetValue(Decoys), "--decoys", 0, "0 turns decoys off; leave it out for the automatic count", Defaults.DecoyCount),
                Rule = ParseRule(parse.GetValue(Rule)),
                InteractionScan = parse.GetValue(InteractionScan),
                OutcomePermutations = parse.GetValue(OutcomePermutations),
                RedundancyCorrelation = parse.GetValue(RedundancyRho),
                CurveFolds = parse.GetValue(CurveFolds),
                CurveFoldRepeats = parse.GetValue(CurveRepeats),
                CurveInnerPairs = parse.GetValue(CurveInnerPairs),
                CurveMaxPanelSize = parse.GetValue(MaxPanelSize),
                ThreadCount = CommonOptions.ThreadCount(parse, Threads),
            },
        })));
    }

    /// <summary>The rule's name as the user writes it.</summary>
    internal static ShortlistRule ParseRule(string? name) => name?.Trim().ToLowerInvariant() switch
    {
        "q-value" or "qvalue" or null or "" => ShortlistRule.QValue,
        "decoy-bound" or "decoybound" => ShortlistRule.DecoyBound,
        _ => throw new CommandInputException($"--shortlist-rule: '{name}' is not a rule; use q-value or decoy-bound."),
    };
}
