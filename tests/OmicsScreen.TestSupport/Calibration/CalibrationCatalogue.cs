namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// The panels of the calibration suite (issue 12, item 7): eight null shapes and three planted
/// designs, each drawn afresh for every seed number.
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

    /// <summary>Every shape and design, null shapes first, in design-number order.</summary>
    public static IReadOnlyList<string> All { get; } = [.. NullShapes, .. PlantedDesigns];

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
            _ => throw new ArgumentException($"No calibration shape or design is called '{name}'."),
        };
    }

    private static int DesignNumber(string name)
    {
        for (int i = 0; i < All.Count; i++) if (All[i] == name) return i + 1;
        throw new ArgumentException($"No calibration shape or design is called '{name}'.");
    }
}
