namespace OmicsScreen.Engine.Trees;

/// <summary>Which child receives a split feature's missing and below-detection cells.</summary>
[Flags]
public enum UnmeasuredRouting : byte
{
    /// <summary>Both go right.</summary>
    BothRight = 0,
    MissingLeft = 1,
    BelowDetectionLeft = 2,
}
