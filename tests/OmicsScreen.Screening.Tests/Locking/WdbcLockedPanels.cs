using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Locking;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Screening.Tests.Locking;

/// <summary>
/// Wisconsin breast cancer (reference/wdbc, UCI) split into its train and test rows by
/// wdbc_split.csv, and a panel locked on the train rows with five well-known markers.
/// </summary>
internal static class WdbcLockedPanels
{
    /// <summary>Five features that rank high by every importance in rf_summary.json "top10"; any strong five would do.</summary>
    public static readonly string[] Markers = ["worst_perimeter", "worst_concave_points", "mean_concave_points", "worst_radius", "worst_area"];

    private static readonly Lazy<(Panel Train, Panel Test)> Split = new(LoadSplit);
    private static readonly Lazy<LockedPanel> Locked = new(() => Lock(Split.Value.Train));

    public static Panel Train => Split.Value.Train;
    public static Panel Test => Split.Value.Test;
    public static LockedPanel Panel => Locked.Value;

    public static ForestOptions ForestOptions { get; } = new() { TreeCount = 150, Seed = 7, Repeat = PanelLocker.LockRepeat };

    public static int[] MarkerIndices(FeatureMatrix matrix) =>
        Markers.Select(name => matrix.FeatureNames.ToList().IndexOf(name)).ToArray();

    private static LockedPanel Lock(Panel train) =>
        PanelLocker.Lock(train, MarkerIndices(train.Matrix), ForestOptions,
            new PanelLockOptions { Seed = 7, TreeCount = 150, ToolVersion = "test" });

    private static (Panel, Panel) LoadSplit()
    {
        var (matrix, outcome) = OmicsScreen.TestSupport.WdbcData.Load();
        var panel = new Panel(matrix, outcome);
        var set = OmicsScreen.TestSupport.WdbcData.ReadTable("wdbc_split.csv").ToDictionary(r => r["sample_id"], r => r["set"]);
        var train = new List<int>();
        var test = new List<int>();
        for (int s = 0; s < matrix.SampleCount; s++)
            (set[matrix.SampleIds[s]] == "train" ? train : test).Add(s);
        return (panel.SelectSamples(train.ToArray()), panel.SelectSamples(test.ToArray()));
    }
}
