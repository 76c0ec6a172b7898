using System.CommandLine;
using OmicsScreen.Cli.Console;
using OmicsScreen.Cli.Help;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// `omicsscreen grow`: one random forest on the whole panel, with its out-of-bag error and
/// impurity decrease per feature (for a measured or time-to-event outcome also its out-of-bag R² or
/// concordance and permutation importance). A quick look; the screen is what ranks markers.
/// </summary>
public sealed class GrowCommand : Command, IHelpLayout
{
    public PanelInputOptions Input { get; } = new();

    public Option<int> Trees { get; } = new("--trees")
    {
        Description = "Trees in the forest.",
        HelpName = "N",
        DefaultValueFactory = _ => 500,
    };

    public Option<int?> FeaturesPerSplit { get; } = new("--features-per-split")
    {
        Description = "Features tried at each split. Default: floor(sqrt(features)).",
        HelpName = "K",
    };

    public Option<int?> MinLeaf { get; } = new("--min-leaf")
    {
        Description = "Fewest samples a leaf may hold (1 grows leaves to purity). Default: 1 for classes, 5 for a measured or time-to-event outcome, as in `screen`.",
        HelpName = "N",
    };

    public Option<int?> MaxDepth { get; } = new("--max-depth")
    {
        Description = "Deepest level a split may sit at (the root is level 0). Default: no limit.",
        HelpName = "N",
    };

    public Option<double?> SampleFraction { get; } = new("--sample-fraction")
    {
        Description = "Grow each tree on this fraction of samples drawn without replacement, instead of a bootstrap (e.g. 0.632).",
        HelpName = "F",
    };

    public Option<BalanceMode> Balance { get; } = new("--balance")
    {
        Description = "Class-balanced drawing for each tree, as in `screen`: on, off, or auto (on when the smallest class is under 2/3 of the largest).",
        HelpName = "auto|on|off",
        DefaultValueFactory = _ => BalanceMode.Off,
    };

    /// <summary>The earlier spelling of --balance on, kept working but not shown.</summary>
    public Option<bool> Balanced { get; } = new("--balanced") { Hidden = true };

    public Option<ulong> Seed { get; } = CommonOptions.Seed("Seed of every random draw; the same seed gives the same forest on any number of threads.", 1);

    public Option<int?> Threads { get; } = CommonOptions.Threads("Threads to grow trees on. Default: all cores.");

    public Option<string?> ImportanceFile { get; } = new("--importance-out")
    {
        Description = "Write every feature's impurity decrease to this TSV file.",
        HelpName = "FILE",
    };

    public Option<bool> Json { get; } = new("--json")
    {
        Description = "Print the summary as JSON instead of text.",
    };

    public IReadOnlyList<HelpSection> HelpSections =>
    [
        new("Input", [Input.SampleSheet, Input.Outcome, Input.OutcomeKind, Input.FollowUp, Input.Event, Input.PositiveClass, Input.Subject, Input.SampleIdColumn, Input.Annotations,
            Input.FeatureSheet, Input.DetectionLimit, Input.FeaturesInRows, Input.Long, Input.FeatureColumns, Input.ValueColumn,
            Input.BelowDetectionFlag, Input.QualityFlag, Input.DisplayName, Input.DropUnmatched, Input.FeatureBlock, Input.KeepFeatures]),
        new("Forest", [Trees, FeaturesPerSplit, MinLeaf, MaxDepth, SampleFraction, Balance]),
        new("Cohorts", [Input.Cohort]),
        new("Run", [Seed, Threads, ImportanceFile, Json]),
    ];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("One forest of 500 trees: out-of-bag error, AUC and the top features", "omicsscreen grow wdbc.csv --outcome diagnosis"),
        new("A regression forest on a measured outcome: out-of-bag R², every feature's importance in a table",
            "omicsscreen grow plasma.csv --samples sheet.tsv --outcome activity_score --importance-out importance.tsv"),
        new("A random survival forest on follow-up: out-of-bag concordance, the summary as JSON for a pipeline",
            "omicsscreen grow plasma.csv --samples sheet.tsv --follow-up months --event relapse --json"),
    ];

    public GrowCommand(CliConsole console)
        : base("grow", "Grow one random forest on a panel and report its out-of-bag error (AUC, R² or concordance by outcome kind) and importance per feature.")
    {
        Input.AddTo(this);
        Options.Add(Trees);
        Options.Add(FeaturesPerSplit);
        Options.Add(MinLeaf);
        Options.Add(MaxDepth);
        Options.Add(SampleFraction);
        Options.Add(Balance);
        Options.Add(Balanced);
        Options.Add(Seed);
        Options.Add(Threads);
        Options.Add(ImportanceFile);
        Options.Add(Json);
        SetAction(parse => CommandRunner.Run(console, () => GrowRun.Execute(console, new GrowRunOptions
        {
            Panel = Input.ToLoadOptions(parse),
            TreeCount = parse.GetValue(Trees),
            FeaturesPerSplit = ScreenOptionChecks.Given(parse.GetValue(FeaturesPerSplit), "--features-per-split", 1, "leave it out for the square root of the feature count"),
            MinLeafSize = ScreenOptionChecks.Given(parse.GetValue(MinLeaf), "--min-leaf", 1, "leave it out for the outcome kind's default"),
            MaxDepth = parse.GetValue(MaxDepth),
            SampleFraction = parse.GetValue(SampleFraction),
            Balance = parse.GetValue(Balanced) ? BalanceMode.On : parse.GetValue(Balance),
            Seed = parse.GetValue(Seed),
            ThreadCount = CommonOptions.ThreadCount(parse, Threads),
            ImportanceFile = parse.GetValue(ImportanceFile),
            Json = parse.GetValue(Json),
        })));
    }
}
