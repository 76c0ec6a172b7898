namespace OmicsScreen.Engine.Trees;

/// <summary>Stopping rules and feature sampling of one classification tree (CART; Breiman et al. 1984).</summary>
public sealed record TreeOptions
{
    /// <summary>Features tried at each node (drawn without replacement); null means floor(sqrt(p)), common practice since Breiman 2001.</summary>
    public int? FeaturesPerSplit { get; init; }

    /// <summary>Fewest distinct samples a leaf may hold; 1 grows leaves to purity.</summary>
    public int MinLeafSize { get; init; } = 1;

    /// <summary>Deepest level a node may sit at; the root is level 0.</summary>
    public int MaxDepth { get; init; } = int.MaxValue;

    /// <summary>
    /// Smallest weighted impurity decrease, (W_t/W)(G_t - W_L/W_t G_L - W_R/W_t G_R), that a split
    /// must reach; W is the root's weight (the definition scikit-learn uses).
    /// </summary>
    public double MinImpurityDecrease { get; init; }

    public static TreeOptions Default { get; } = new();

    /// <summary>The number of features tried per node for a panel of featureCount features.</summary>
    public int ResolveFeaturesPerSplit(int featureCount)
    {
        int tried = FeaturesPerSplit ?? (int)Math.Floor(Math.Sqrt(featureCount));
        return Math.Clamp(tried, 1, Math.Max(1, featureCount));
    }

    public void Validate()
    {
        if (FeaturesPerSplit is < 1) throw new ArgumentException("At least one feature must be tried per split.");
        if (MinLeafSize < 1) throw new ArgumentException("The minimum leaf size must be at least 1.");
        if (MaxDepth < 0) throw new ArgumentException("The maximum depth cannot be negative.");
        if (!(MinImpurityDecrease >= 0)) throw new ArgumentException("The minimum impurity decrease cannot be negative.");
    }
}
