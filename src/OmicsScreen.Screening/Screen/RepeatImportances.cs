namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The raw results of every repeat, kept whole (repeat-major, one row of features per repeat):
/// every summary of the screen is a view of these matrices, which is also what lets parts of a
/// run be merged exactly.
/// </summary>
public sealed class RepeatImportances
{
    public RepeatImportances(int repeatCount, int featureCount, int decoyCount)
    {
        RepeatCount = repeatCount;
        FeatureCount = featureCount;
        DecoyCount = decoyCount;
        Corrected = new double[repeatCount * featureCount];
        Permutation = new double[repeatCount * featureCount];
        Impurity = new double[repeatCount * featureCount];
        CombinedRank = new double[repeatCount * featureCount];
        Selected = new bool[repeatCount * featureCount];
        DecoyCorrected = new double[repeatCount * decoyCount];
        DecoySelected = new bool[repeatCount * decoyCount];
        TrainingSampleCounts = new int[repeatCount];
    }

    public int RepeatCount { get; }
    public int FeatureCount { get; }
    public int DecoyCount { get; }

    /// <summary>Corrected impurity importance (Nembrini et al. 2018) of each feature in each repeat.</summary>
    public double[] Corrected { get; }

    /// <summary>Out-of-bag permutation importance (mean accuracy drop over trees) in each repeat.</summary>
    public double[] Permutation { get; }

    /// <summary>Mean decrease in Gini impurity in each repeat (uncorrected; shown for comparison).</summary>
    public double[] Impurity { get; }

    /// <summary>Mean of the feature's corrected-importance rank and permutation rank in each repeat (1 = best).</summary>
    public double[] CombinedRank { get; }

    /// <summary>Whether the repeat selected the feature (one of its top corrected importances, above zero).</summary>
    public bool[] Selected { get; }

    public double[] DecoyCorrected { get; }
    public bool[] DecoySelected { get; }

    /// <summary>Samples each repeat's forests were grown on.</summary>
    public int[] TrainingSampleCounts { get; }

    public Span<double> Row(double[] matrix, int repeat) => matrix.AsSpan(repeat * FeatureCount, FeatureCount);

    /// <summary>Copies every value of repeat <paramref name="fromRepeat"/> of <paramref name="source"/> into repeat <paramref name="toRepeat"/>.</summary>
    public void CopyRepeatFrom(RepeatImportances source, int fromRepeat, int toRepeat)
    {
        if (source.FeatureCount != FeatureCount || source.DecoyCount != DecoyCount)
            throw new ArgumentException($"A repeat of {source.FeatureCount} features and {source.DecoyCount} decoys does not fit {FeatureCount} and {DecoyCount}.");
        source.Row(source.Corrected, fromRepeat).CopyTo(Row(Corrected, toRepeat));
        source.Row(source.Permutation, fromRepeat).CopyTo(Row(Permutation, toRepeat));
        source.Row(source.Impurity, fromRepeat).CopyTo(Row(Impurity, toRepeat));
        source.Row(source.CombinedRank, fromRepeat).CopyTo(Row(CombinedRank, toRepeat));
        source.Selected.AsSpan(fromRepeat * FeatureCount, FeatureCount).CopyTo(Selected.AsSpan(toRepeat * FeatureCount, FeatureCount));
        source.DecoyCorrected.AsSpan(fromRepeat * DecoyCount, DecoyCount).CopyTo(DecoyCorrected.AsSpan(toRepeat * DecoyCount, DecoyCount));
        source.DecoySelected.AsSpan(fromRepeat * DecoyCount, DecoyCount).CopyTo(DecoySelected.AsSpan(toRepeat * DecoyCount, DecoyCount));
        TrainingSampleCounts[toRepeat] = source.TrainingSampleCounts[fromRepeat];
    }
}
