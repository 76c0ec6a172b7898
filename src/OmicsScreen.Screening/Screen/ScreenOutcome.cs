using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Resampling;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// What a screen needs to know of its outcome kind, and nothing more: which forest a repeat grows
/// and which importances it reads off it, how the reference forest is summarised, which rank test
/// stands beside the forest, how a panel is scored on held-out samples, and which strata keep the
/// half-samples and folds balanced. Everything else (decoys, p-values, q-values, stability, the
/// shortlist rule, the curve's lock rule) works on the importance arrays and scores alone, so it
/// means the same for classes, measured quantities and censored follow-up.
/// </summary>
internal abstract class ScreenOutcome
{
    public static ScreenOutcome For(Panel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        return panel.Kind switch
        {
            OutcomeKind.Measured => new MeasuredScreenOutcome(panel.Measured!),
            OutcomeKind.TimeToEvent => new FollowUpScreenOutcome(panel.FollowUp!),
            _ => new ClassScreenOutcome(panel.Outcome),
        };
    }

    public abstract OutcomeKind Kind { get; }

    /// <summary>What held-out panels are scored in: "auc", "accuracy", "r_squared" or "concordance" (higher is better for all).</summary>
    public abstract string ScoreName { get; }

    /// <summary>The strata of the half-samples and outer folds.</summary>
    public abstract ResamplingStrata Strata { get; }

    /// <summary>
    /// Grows the repeat's clean forest on <paramref name="rows"/> and writes its impurity and
    /// out-of-bag permutation importances, then the corrected impurity importance of the features
    /// and the decoys from the forest that carries permuted copies (same options, same streams).
    /// </summary>
    public abstract void GrowRepeat(BinnedMatrix matrix, int[] rows, ForestOptions options, ReadOnlySpan<int> decoySources,
        int threadCount, Span<double> impurity, Span<double> permutation, Span<double> corrected, Span<double> decoys);

    /// <summary>The forest on all samples and features: how predictable the outcome is, and whether there are enough trees.</summary>
    public abstract ReferenceForest GrowReference(BinnedMatrix matrix, ForestOptions options);

    /// <summary>
    /// Each column's rank-test p-value on <paramref name="rows"/> against the outcome (the test the
    /// screen combines with the forest's evidence); missing cells left out, below-detection cells
    /// tied lowest.
    /// </summary>
    public abstract double[] RankTestPValues(FeatureMatrix values, int[] rows, int threadCount);

    /// <summary>How the forest's p-value and the direct tests' are weighed in the combination (<see cref="CombinationWeights"/>).</summary>
    public virtual CombinationWeights CombinationWeights => CombinationWeights.Even;

    /// <summary>A forest on <paramref name="features"/> grown on the training rows and scored on the test rows.</summary>
    public abstract PanelScore ScorePanel(BinnedMatrix matrix, ReadOnlySpan<int> features, int[] trainingRows, ReadOnlySpan<int> testRows,
        ForestOptions options);

    /// <summary>What a fold scores when its procedure locks no panel: chance, or the training part's mean or largest class.</summary>
    public abstract PanelScore ChanceScore(int[] trainingRows, int[] testRows);

    /// <summary>
    /// How long a curve fold's panel may be. False (classes): at most the fold's own inner list,
    /// and a fold whose inner list is empty scores chance. True: as long as the list whose prefix
    /// is locked, the fold's inner list first, then its order past the list's end
    /// (<see cref="PanelSizeEstimator"/>): the fold then estimates a panel of the locked length.
    /// </summary>
    public virtual bool FoldPanelsTakeLockedLength => false;

    /// <summary>The single-marker statistics of every feature on all samples, with each feature's rank by their p-value.</summary>
    public abstract SingleMarkerStatistics SingleMarkers(Panel panel, int threadCount);

    /// <summary>A forest of the screen's kind on all samples of <paramref name="matrix"/>, read as leaf values (effects: partial dependence, partner scan).</summary>
    public abstract IReadOnlyList<Effects.TreeLeafValues> GrowLeafValues(BinnedMatrix matrix, ForestOptions options);

    /// <summary>
    /// The strata the interaction-partner scan permutes its copies within: fine enough that a copy
    /// keeps its marker's link to the outcome, coarse enough to hold several samples each.
    /// </summary>
    public abstract int[] PartnerStrata();

    /// <summary>The values of the given rows, in their order.</summary>
    protected static double[] AtRows(double[] values, ReadOnlySpan<int> rows)
    {
        var picked = new double[rows.Length];
        for (int i = 0; i < rows.Length; i++) picked[i] = values[rows[i]];
        return picked;
    }
}
