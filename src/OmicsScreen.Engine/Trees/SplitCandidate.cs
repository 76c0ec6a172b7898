namespace OmicsScreen.Engine.Trees;

/// <summary>
/// One way to split a node: value codes &lt;= <see cref="BinThreshold"/> go left, unmeasured cells
/// follow <see cref="Routing"/>. <see cref="Score"/> is the Gini proxy sum_c L_c^2/W_L + sum_c R_c^2/W_R,
/// which orders splits as the weighted impurity decrease does (the constant parent term cancels).
/// </summary>
internal struct SplitCandidate
{
    public int Feature;
    public byte BinThreshold;
    public UnmeasuredRouting Routing;
    public double Score;
    public int LeftRowCount;
    public int RightRowCount;

    public static SplitCandidate None => new() { Feature = -1, Score = double.NegativeInfinity };

    public readonly bool IsFound => Feature >= 0;
}
