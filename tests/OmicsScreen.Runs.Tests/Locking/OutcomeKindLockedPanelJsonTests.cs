using System.Text.Json.Nodes;
using OmicsScreen.Data;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Runs.Locking;
using OmicsScreen.Screening.Locking;
using OmicsScreen.Screening.Tests.Locking;

namespace OmicsScreen.Runs.Tests.Locking;

/// <summary>The locked-panel file for measured and time-to-event panels: exact round trips, thread independence, version and kind.</summary>
public class OutcomeKindLockedPanelJsonTests
{
    private static readonly PanelLockOptions Options = new() { Seed = 11, TreeCount = 60, ToolVersion = "test" };

    private static LockedMeasuredPanel Measured(int threads = 0) =>
        PanelLocker.LockMeasured(OutcomeKindLockedPanels.Friedman().Train, [0, 1, 2, 3, 4],
            OutcomeKindLockedPanels.ForestOptions(threads) with { TreeCount = 60 }, Options);

    private static LockedFollowUpPanel FollowUp(int threads = 0) =>
        PanelLocker.LockFollowUp(OutcomeKindLockedPanels.Survival().Train, [0, 1, 2],
            OutcomeKindLockedPanels.ForestOptions(threads) with { TreeCount = 60 }, Options);

    [Fact]
    public void One_thread_and_two_threads_lock_the_same_file_text()
    {
        Assert.Equal(LockedPanelJson.ToJson(Measured(1)).ToJsonString(), LockedPanelJson.ToJson(Measured(2)).ToJsonString());
        Assert.Equal(LockedPanelJson.ToJson(FollowUp(1)).ToJsonString(), LockedPanelJson.ToJson(FollowUp(2)).ToJsonString());
    }

    [Fact]
    public void A_measured_panel_through_its_file_predicts_bit_identically()
    {
        using var folder = new TempFolder();
        var locked = Measured();
        string path = folder.File("locked_panel.json");
        LockedPanelFile.Write(path, locked);

        var stored = LockedPanelFile.ReadAny(path);
        Assert.Equal(OutcomeKind.Measured, stored.Kind);
        var test = OutcomeKindLockedPanels.Friedman().Test.Matrix;
        var before = LockedPanelScorer.ScoreMeasured(locked, test).Predictions;
        var after = LockedPanelScorer.ScoreMeasured(stored.Measured!, test).Predictions;
        Assert.Equal(before.Select(BitConverter.DoubleToInt64Bits), after.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(locked.OutOfBagRSquared, stored.Measured!.OutOfBagRSquared);
        Assert.Equal(locked.Markers, stored.Measured.Markers);

        var lines = File.ReadAllLines(path);
        Assert.Equal($"  \"version\": {LockedPanelEnvelope.OutcomeKindsVersion},", lines[2]);
        Assert.Contains("\"outcome_kind\": \"measured\"", File.ReadAllText(path));
    }

    [Fact]
    public void A_follow_up_panel_through_its_file_scores_bit_identically_with_the_same_cut()
    {
        using var folder = new TempFolder();
        var locked = FollowUp();
        string path = folder.File("locked_panel.json");
        LockedPanelFile.Write(path, locked);

        var stored = LockedPanelFile.ReadAny(path).FollowUp!;
        var test = OutcomeKindLockedPanels.Survival().Test.Matrix;
        var before = LockedPanelScorer.ScoreFollowUp(locked, test);
        var after = LockedPanelScorer.ScoreFollowUp(stored, test);
        Assert.Equal(before.RiskScores.Select(BitConverter.DoubleToInt64Bits), after.RiskScores.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(before.HighRisk, after.HighRisk);
        Assert.Equal(BitConverter.DoubleToInt64Bits(locked.RiskGroupCut), BitConverter.DoubleToInt64Bits(stored.RiskGroupCut));
        Assert.Equal(("time", "status"), (stored.TimeColumn, stored.EventColumn));
    }

    [Fact]
    public void A_class_reader_refuses_another_kind_by_name_and_an_unknown_kind_is_refused()
    {
        var content = LockedPanelJson.ToJson(Measured());
        var error = Assert.Throws<InvalidDataException>(() => LockedPanelJson.FromJson(content));
        Assert.Contains("a measured outcome, not for classes", error.Message);

        content[LockedPanelJson.OutcomeKindKey] = "dose_response";
        var unknown = Assert.Throws<InvalidDataException>(() => LockedPanelJson.KindOf(content));
        Assert.Contains("'dose_response' is not an outcome kind", unknown.Message);
    }

    /// <summary>Files written before there were other kinds have no outcome_kind and read as classes.</summary>
    [Fact]
    public void A_class_file_has_no_kind_key_and_reads_as_classes()
    {
        using var folder = new TempFolder();
        string path = LockedPanelFile.WriteInto(folder.Path, WdbcLockedPanels.Panel);
        Assert.DoesNotContain("outcome_kind", File.ReadAllText(path));
        Assert.Equal($"  \"version\": 1,", File.ReadAllLines(path)[2]);
        var stored = LockedPanelFile.ReadAny(path);
        Assert.Equal(OutcomeKind.Classes, stored.Kind);
        Assert.Equal(WdbcLockedPanels.Panel.MarkerNames, stored.Classes!.MarkerNames);
    }

    [Fact]
    public void An_edited_measured_file_fails_its_checksum()
    {
        using var folder = new TempFolder();
        string path = folder.File("locked_panel.json");
        LockedPanelFile.Write(path, Measured());
        File.WriteAllText(path, File.ReadAllText(path).Replace("\"outcome\": \"y\"", "\"outcome\": \"z\""));
        var error = Assert.Throws<PanelInputException>(() => LockedPanelFile.ReadAny(path));
        Assert.Contains("checksum does not match", error.Message);
    }
}
