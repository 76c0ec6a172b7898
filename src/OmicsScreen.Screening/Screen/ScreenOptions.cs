namespace OmicsScreen.Screening.Screen;

/// <summary>
/// Every setting of a screen, with its default, in one place: the CLI builds its options from
/// these defaults and the manifest echoes the resolved record whole, so a run can be repeated.
/// </summary>
public sealed record ScreenOptions
{
    /// <summary>Seed of the whole run; every random stream is derived from it.</summary>
    public ulong Seed { get; init; } = 1;

    /// <summary>
    /// Complementary pairs of half-samples (Shah &amp; Samworth 2013); the screen grows two
    /// forests on each half, so repeats = 2 x pairs.
    /// </summary>
    public int HalfSamplePairs { get; init; } = 25;

    public int TreesPerForest { get; init; } = 500;

    /// <summary>Features tried at each split; 0 means floor(sqrt(features)), common practice since Breiman 2001.</summary>
    public int FeaturesPerSplit { get; init; }

    /// <summary>
    /// Fewest samples a leaf may hold; 0 means the outcome kind's default (<see cref="ScreenSettings.DefaultMinLeafSize"/>):
    /// 1 for classes (full trees, Breiman 2001), 5 for measured and time-to-event outcomes.
    /// </summary>
    public int MinLeafSize { get; init; }

    /// <summary>Class-balanced drawing for each tree (Chen, Liaw &amp; Breiman 2004).</summary>
    public BalanceMode Balance { get; init; } = BalanceMode.Auto;

    /// <summary>
    /// A repeat selects the features whose corrected importance exceeds the (1 - level) quantile
    /// of that repeat's null sample (mirrored non-positive importances and decoys): a test per
    /// repeat, whose passes are then counted over repeats.
    /// </summary>
    public double RepeatSelectionLevel { get; init; } = 0.10;

    /// <summary>Most features a repeat may select (its best ones); 0 sets no cap.</summary>
    public int SelectedPerRepeat { get; init; }

    /// <summary>
    /// Selection frequency a feature needs to enter the shortlist, in (0.5, 1]; 0 (the default)
    /// leaves the list to the q-values alone. Frequency always orders the list. A filter costs
    /// recall of modest markers (selected in 40-60% of repeats) and buys nothing the q-values do not
    /// already control; decoys face the same filter, so the decoy estimate stays comparable.
    /// </summary>
    public double FrequencyThreshold { get; init; }

    /// <summary>False discovery rate level for the importance q-values of shortlisted features.</summary>
    public double QValueThreshold { get; init; } = 0.10;

    /// <summary>How the shortlist's cut is placed: q-values (default) or the decoy bound.</summary>
    public ShortlistRule Rule { get; init; } = ShortlistRule.QValue;

    /// <summary>
    /// Decoys (copies of real features, each permuted once per run and grown in every repeat);
    /// -1 means automatic: one per feature, at least <see cref="AutomaticDecoyFloor"/> and at most
    /// <see cref="AutomaticDecoyCeiling"/>.
    /// </summary>
    public int DecoyCount { get; init; } = -1;

    /// <summary>
    /// Fewest automatic decoys: the p-values' tail fit needs a few hundred decoys above its
    /// threshold (<see cref="Importance.DecoyNull"/>), and narrow panels need the resolution most.
    /// </summary>
    public int AutomaticDecoyFloor { get; init; } = 1000;

    /// <summary>
    /// Most automatic decoys: past this the tail fit gains little while every forest keeps widening.
    /// </summary>
    public int AutomaticDecoyCeiling { get; init; } = 5000;

    /// <summary>Outcome permutations for Altmann et al. (2010) p-values; 0 turns them off.</summary>
    public int OutcomePermutations { get; init; }

    /// <summary>
    /// The pairwise interaction scan (markers that act only together); it needs decoys, which
    /// calibrate it, and is skipped automatically on panels where it would cost more than
    /// <see cref="InteractionScanPairLimit"/> pairs per screen.
    /// </summary>
    public InteractionScanMode InteractionScan { get; init; } = InteractionScanMode.Auto;

    /// <summary>Most (features + decoys) x features pairs the automatic scan takes on (measured cost: see the README).</summary>
    public long InteractionScanPairLimit { get; init; } = 150_000_000;

    /// <summary>Spearman |rho| at or above which shortlisted markers share a redundancy group.</summary>
    public double RedundancyCorrelation { get; init; } = 0.7;

    /// <summary>Outer folds of the panel-size curve; 0 skips the curve.</summary>
    public int CurveFolds { get; init; } = 5;

    public int CurveFoldRepeats { get; init; } = 1;

    /// <summary>Half-sample pairs of the screen run inside each outer fold.</summary>
    public int CurveInnerPairs { get; init; } = 5;

    /// <summary>Largest panel size on the curve's grid.</summary>
    public int CurveMaxPanelSize { get; init; } = 55;

    public int ThreadCount { get; init; }

    public void Validate()
    {
        Require(HalfSamplePairs >= 1, "The number of half-sample pairs must be at least 1.");
        Require(TreesPerForest >= 10, "A forest needs at least 10 trees.");
        Require(FeaturesPerSplit >= 0, "Features per split must be positive (or 0 for the default).");
        Require(MinLeafSize >= 0, "The minimum leaf size must be at least 1 (or 0 for the outcome kind's default).");
        Require(RepeatSelectionLevel > 0 && RepeatSelectionLevel < 0.5, "The per-repeat selection level must lie in (0, 0.5).");
        Require(SelectedPerRepeat >= 0, "The cap on features selected per repeat must be positive (or 0 for none).");
        Require(FrequencyThreshold == 0 || (FrequencyThreshold > 0.5 && FrequencyThreshold <= 1), "The frequency threshold must be 0 (no filter) or lie in (0.5, 1].");
        Require(QValueThreshold > 0 && QValueThreshold <= 1, "The q-value threshold must lie in (0, 1].");
        Require(DecoyCount >= -1, "The decoy count must be 0 or more (or -1 for automatic).");
        Require(AutomaticDecoyFloor >= 0 && AutomaticDecoyCeiling >= AutomaticDecoyFloor, "The automatic decoy floor must lie between 0 and the ceiling.");
        Require(OutcomePermutations >= 0, "Outcome permutations must be 0 or more.");
        Require(RedundancyCorrelation > 0 && RedundancyCorrelation <= 1, "The redundancy correlation must lie in (0, 1].");
        Require(CurveFolds == 0 || CurveFolds >= 2, "The panel-size curve needs at least 2 folds (or 0 to skip it).");
        Require(CurveFoldRepeats >= 1, "Curve fold repeats must be at least 1.");
        Require(CurveInnerPairs >= 1, "The curve's inner screen needs at least 1 half-sample pair.");
        Require(CurveMaxPanelSize >= 1, "The largest panel size must be at least 1.");
        Require(ThreadCount >= 0, "The thread count must be 0 (all cores) or more.");
    }

    private static void Require(bool condition, string message)
    {
        if (!condition) throw new ArgumentException(message);
    }
}
