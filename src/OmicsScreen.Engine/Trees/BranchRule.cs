namespace OmicsScreen.Engine.Trees;

/// <summary>
/// Which way a sample goes at a split: the one rule the builder's partition, a stored tree's
/// prediction and the reference split search all follow.
/// </summary>
/// <remarks>
/// Value codes at most the bin threshold go left, other value codes right. The two reserved
/// codes sit just above the value codes (missing = value bin count, below detection = one more;
/// see <see cref="Binning.FeatureBins"/>), so one comparison settles every measured cell and the
/// routing flags settle the rest.
/// </remarks>
internal static class BranchRule
{
    public static bool GoesLeft(byte code, byte binThreshold, byte missingCode, UnmeasuredRouting routing)
    {
        if (code <= binThreshold) return true;
        if (code < missingCode) return false;
        var flag = code == missingCode ? UnmeasuredRouting.MissingLeft : UnmeasuredRouting.BelowDetectionLeft;
        return (routing & flag) != 0;
    }
}
