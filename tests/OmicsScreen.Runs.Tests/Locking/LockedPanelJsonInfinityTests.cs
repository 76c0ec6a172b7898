using System.Text.Json.Nodes;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Tests.Locking;

namespace OmicsScreen.Runs.Tests.Locking;

public class LockedPanelJsonInfinityTests
{
    [Fact]
    public void A_split_that_only_separates_unmeasured_cells_survives_the_file_format()
    {
        // A root whose threshold is +Infinity: every measured value goes left, unmeasured cells
        // right. The demo panel grows such splits on features with many cells below detection.
        var tree = new DecisionTree(2,
            features: [0, -1, -1], binThresholds: [9, 0, 0], thresholds: [float.PositiveInfinity, float.NaN, float.NaN],
            missingCodes: [10, 0, 0], routing: [UnmeasuredRouting.BothRight, UnmeasuredRouting.BothRight, UnmeasuredRouting.BothRight],
            leftChildren: [1, 0, 0], rightChildren: [2, 0, 0], classWeights: [3, 3, 3, 0, 0, 3], nodeClasses: [0, 0, 1],
            impurityDecreases: [0.5, 0, 0], sampleCounts: [6, 3, 3]);
        var json = LockedPanelJson.TreeJsonRoundTrip(tree);
        Assert.Equal(float.PositiveInfinity, json.Thresholds[0]);
        Assert.True(float.IsNaN(json.Thresholds[1]));
        Assert.Equal(tree.Features.ToArray(), json.Features.ToArray());
    }
}
