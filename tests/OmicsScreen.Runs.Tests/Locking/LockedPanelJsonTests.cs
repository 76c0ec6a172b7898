using System.Text.Json.Nodes;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Tests.Locking;

namespace OmicsScreen.Runs.Tests.Locking;

public class LockedPanelJsonTests
{
    // Moved from Screening's PanelLockerTests with the codec: the file's text is the strictest comparison.
    [Fact]
    public void One_thread_and_two_threads_lock_the_same_panel_to_the_byte()
    {
        var train = WdbcLockedPanels.Train;
        var markers = WdbcLockedPanels.MarkerIndices(train.Matrix);
        var options = new PanelLockOptions { Seed = 9 };
        var oneThread = PanelLocker.Lock(train, markers, WdbcLockedPanels.ForestOptions with { TreeCount = 40, ThreadCount = 1 }, options);
        var twoThreads = PanelLocker.Lock(train, markers, WdbcLockedPanels.ForestOptions with { TreeCount = 40, ThreadCount = 2 }, options);
        Assert.Equal(LockedPanelJson.ToJson(oneThread).ToJsonString(), LockedPanelJson.ToJson(twoThreads).ToJsonString());
    }

    [Fact]
    public void A_panel_through_json_text_gives_bit_identical_probabilities()
    {
        var locked = WdbcLockedPanels.Panel;
        string text = LockedPanelJson.ToJson(locked).ToJsonString();
        var reloaded = LockedPanelJson.FromJson(JsonNode.Parse(text)!.AsObject());
        var test = WdbcLockedPanels.Test.Matrix;
        var before = LockedPanelScorer.Score(locked, test);
        var after = LockedPanelScorer.Score(reloaded, test);
        Assert.Equal(before.Probabilities.Select(BitConverter.DoubleToInt64Bits), after.Probabilities.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(before.PredictedClasses, after.PredictedClasses);
        for (int t = 0; t < locked.Trees.Count; t++)
            Assert.Equal(locked.Trees[t].Thresholds.ToArray().Select(BitConverter.SingleToInt32Bits),
                reloaded.Trees[t].Thresholds.ToArray().Select(BitConverter.SingleToInt32Bits));
        Assert.Equal(locked.Threshold, reloaded.Threshold);
        Assert.Equal(locked.Markers, reloaded.Markers);
        Assert.Equal(locked.Provenance.Seed, reloaded.Provenance.Seed);
    }

    [Fact]
    public void A_tree_splitting_on_a_marker_that_does_not_exist_is_refused()
    {
        var content = LockedPanelJson.ToJson(WdbcLockedPanels.Panel);
        var features = content["forest"]![0]!["features"]!.AsArray();
        features[0] = 99;
        var error = Assert.Throws<InvalidDataException>(() => LockedPanelJson.FromJson(content));
        Assert.Contains("marker 99", error.Message);
    }

    [Fact]
    public void A_tree_whose_child_points_backwards_is_refused()
    {
        var content = LockedPanelJson.ToJson(WdbcLockedPanels.Panel);
        content["forest"]![0]!["left"]!.AsArray()[0] = 0;
        var error = Assert.Throws<InvalidDataException>(() => LockedPanelJson.FromJson(content));
        Assert.StartsWith("forest[0]:", error.Message);
    }

    [Fact]
    public void Arrays_of_different_lengths_are_refused()
    {
        var content = LockedPanelJson.ToJson(WdbcLockedPanels.Panel);
        content["forest"]![1]!["thresholds"]!.AsArray().RemoveAt(0);
        Assert.Throws<InvalidDataException>(() => LockedPanelJson.FromJson(content));
    }
}
