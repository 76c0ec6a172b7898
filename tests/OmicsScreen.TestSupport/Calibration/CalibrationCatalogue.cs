namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// The panels of the calibration suite (issue 12, item 7; issues 17 and 18 for the measured and
/// follow-up ones): null shapes and planted designs of every outcome kind, each drawn afresh for
/// every seed number.
/// </summary>
/// <remarks>
/// A model's seed is 100 x seed number + the design's number (1-11), so the same seed number
/// gives unrelated data in every shape, and a printed seed names its panel.
/// Null shapes (no feature related to the outcome; "blocks" = blocks of 10 with rho = 0.6 on
/// the log scale, log-normal cells):
/// 1 null-normal: 150 x 1,000 independent normal cells, classes 1:1.
/// 2 null-blocks: 150 x 1,000 correlated log-normal blocks, 1:1.
/// 3 null-imbalanced: 160 x 1,000 blocks, 1:3 (40 cases, 120 controls).
/// 4 null-censored: 150 x 1,000 blocks, each feature left-censored at its 15% quantile (15% of cells below detection).
/// 5 null-heavy-tails: 150 x 1,000 independent cells with Student t (2 df) noise, 1:1.
/// 6 null-wide: 60 x 2,000 blocks, 1:1.
/// 7 null-tall: 400 x 300 blocks, 1:1.
/// 8 null-three-classes: 150 x 1,000 blocks, three classes of 50.
/// Planted designs (150 x 1,000 log-normal, background blocks of 5 with rho = 0.6): 9
/// planted-blocks (<see cref="BlockShiftModel"/>), 10 planted-interaction
/// (<see cref="InteractionModel"/>), 11 planted-threshold (<see cref="ThresholdModel"/>).
/// Measured outcome (issue 17), numbers 12-16: 12 measured-null-normal: 150 x 1,000 independent
/// normal cells, normal outcome; 13 measured-null-skewed: 150 x 1,000 independent log-normal cells,
/// log-normal outcome; 14 measured-null-blocks: 150 x 1,000 blocks, normal outcome; 15
/// measured-null-small: 60 x 1,000 blocks, normal outcome (<see cref="MeasuredNullModel"/>); 16
/// measured-planted (<see cref="MeasuredPlantedModel"/>, 150 x 1,000, background blocks of 5).
/// Censored follow-up (issue 18), numbers 17-21, all on 150 x 1,000 blocks unless said, exponential
/// event and censoring times (<see cref="FollowUpDesign"/>): 17 follow-up-null-light-censoring: 30%
/// censored; 18 follow-up-null-heavy-censoring: 70% censored; 19 follow-up-null-tied: 30% censored,
/// follow-up in whole years (about 30 distinct times for 150 samples); 20 follow-up-null-small: 60
/// x 1,000, 30% censored (about 42 events); 21 follow-up-planted (<see cref="FollowUpPlantedModel"/>,
/// 150 x 1,000, background blocks of 5).
/// </remarks>
public static class CalibrationCatalogue
{
    /// <summary>Phi^-1(0.15), the standard normal's 15% quantile (from memory; a unit test checks the censored share).</summary>
    public const double FifteenPercentQuantile = -1.0364333894937898;

    public static IReadOnlyList<string> NullShapes { get; } =
    [
        "null-normal", "null-blocks", "null-imbalanced", "null-censored",
        "null-heavy-tails", "null-wide", "null-tall", "null-three-classes",
    ];

    public static IReadOnlyList<string> PlantedDesigns { get; } = ["planted-blocks", "planted-interaction", "planted-threshold"];

    public static IReadOnlyList<string> MeasuredNullShapes { get; } =
        ["measured-null-normal", "measured-null-skewed", "measured-null-blocks", "measured-null-small"];

    public static IReadOnlyList<string> MeasuredPlantedDesigns { get; } = ["measured-planted"];

    public static IReadOnlyList<string> FollowUpNullShapes { get; } =
        ["follow-up-null-light-censoring", "follow-up-null-heavy-censoring", "follow-up-null-tied", "follow-up-null-small"];

    public static IReadOnlyList<string> FollowUpPlantedDesigns { get; } = ["follow-up-planted"];

    /// <summary>
    /// Every shape and design in design-number order: the class ones (null shapes first), then the
    /// measured ones, then the follow-up ones. New designs go at the end, so no design's number
    /// (and so no drawn panel) ever changes.
    /// </summary>
    public static IReadOnlyList<string> All { get; } =
    [
        .. NullShapes, .. PlantedDesigns, .. MeasuredNullShapes, .. MeasuredPlantedDesigns, .. FollowUpNullShapes, .. FollowUpPlantedDesigns,
    ];

    /// <summary>The seed of a design's model for a seed number (1, 2, ...).</summary>
    public static ulong ModelSeed(string name, int seedNumber)
    {
        int designNumber = DesignNumber(name);
        if (seedNumber < 1) throw new ArgumentOutOfRangeException(nameof(seedNumber), "Seed numbers start at 1.");
        return 100UL * (ulong)seedNumber + (ulong)designNumber;
    }

    public static CalibrationModel Create(string name, int seedNumber)
    {
        ulong seed = ModelSeed(name, seedNumber);
        var blocks = new BackgroundDesign { FeatureCount = 1000, BlockSize = 10, BlockCorrelation = 0.6 };
        var plantedBackground = new BackgroundDesign { FeatureCount = 1000, BlockSize = 5, BlockCorrelation = 0.6 };
        string[] twoClasses = ["control", "case"];
        double[] even = [0.5, 0.5];
        return name switch
        {
            "null-normal" => new NullModel(name, seed, 150,
                new BackgroundDesign { FeatureCount = 1000, Distribution = CellDistribution.Normal }, twoClasses, even, 1),
            "null-blocks" => new NullModel(name, seed, 150, blocks, twoClasses, even, 1),
            "null-imbalanced" => new NullModel(name, seed, 160, blocks, twoClasses, [0.75, 0.25], 1),
            "null-censored" => new NullModel(name, seed, 150, blocks with { DetectionLimit = FifteenPercentQuantile }, twoClasses, even, 1),
            "null-heavy-tails" => new NullModel(name, seed, 150,
                new BackgroundDesign { FeatureCount = 1000, Distribution = CellDistribution.HeavyTailed }, twoClasses, even, 1),
            "null-wide" => new NullModel(name, seed, 60, blocks with { FeatureCount = 2000 }, twoClasses, even, 1),
            "null-tall" => new NullModel(name, seed, 400, blocks with { FeatureCount = 300 }, twoClasses, even, 1),
            "null-three-classes" => new NullModel(name, seed, 150, blocks, ["group-a", "group-b", "group-c"], [1 / 3.0, 1 / 3.0, 1 / 3.0]),
            "planted-blocks" => new BlockShiftModel(name, seed, 150, plantedBackground, [0.6, 0.8, 1.0]),
            "planted-interaction" => new InteractionModel(name, seed, 150, plantedBackground, MarginalMarkers.DefaultEffects),
            "planted-threshold" => new ThresholdModel(name, seed, 150, plantedBackground, MarginalMarkers.DefaultEffects),
            "measured-null-normal" => new MeasuredNullModel(name, seed, 150,
                new BackgroundDesign { FeatureCount = 1000, Distribution = CellDistribution.Normal }, skewedOutcome: false),
            "measured-null-skewed" => new MeasuredNullModel(name, seed, 150, new BackgroundDesign { FeatureCount = 1000 }, skewedOutcome: true),
            "measured-null-blocks" => new MeasuredNullModel(name, seed, 150, blocks, skewedOutcome: false),
            "measured-null-small" => new MeasuredNullModel(name, seed, 60, blocks, skewedOutcome: false),
            "measured-planted" => new MeasuredPlantedModel(name, seed, 150, plantedBackground,
                MeasuredPlantedModel.DefaultBlockEffects, MeasuredPlantedModel.DefaultThresholdEffect),
            "follow-up-null-light-censoring" => new FollowUpNullModel(name, seed, 150, blocks, FollowUpDesign.WithCensoredShare(0.3)),
            "follow-up-null-heavy-censoring" => new FollowUpNullModel(name, seed, 150, blocks, FollowUpDesign.WithCensoredShare(0.7)),
            "follow-up-null-tied" => new FollowUpNullModel(name, seed, 150, blocks, FollowUpDesign.WithCensoredShare(0.3) with { TimeUnit = 1 }),
            "follow-up-null-small" => new FollowUpNullModel(name, seed, 60, blocks, FollowUpDesign.WithCensoredShare(0.3)),
            "follow-up-planted" => new FollowUpPlantedModel(name, seed, 150, plantedBackground, FollowUpDesign.WithCensoredShare(0.3),
                FollowUpPlantedModel.DefaultLogHazardRatios, FollowUpPlantedModel.DefaultThresholdLogHazardRatio),
            _ => throw new ArgumentException($"No calibration shape or design is called '{name}'."),
        };
    }

    private static int DesignNumber(string name)
    {
        for (int i = 0; i < All.Count; i++) if (All[i] == name) return i + 1;
        throw new ArgumentException($"No calibration shape or design is called '{name}'.");
    }
}
