namespace OmicsScreen.Engine.Forests;

/// <summary>
/// One tree's out-of-bag samples (eligible rows it was not grown on), in increasing order, and
/// the class the tree gives each of them.
/// </summary>
public sealed class TreeOutOfBag
{
    private readonly int[] _rows;
    private readonly int[] _predictedClasses;

    public TreeOutOfBag(int[] rows, int[] predictedClasses)
    {
        if (rows.Length != predictedClasses.Length) throw new ArgumentException("One prediction per row is needed.");
        _rows = rows;
        _predictedClasses = predictedClasses;
    }

    public ReadOnlySpan<int> Rows => _rows;
    public ReadOnlySpan<int> PredictedClasses => _predictedClasses;
    public int Count => _rows.Length;
}
