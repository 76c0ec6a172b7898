using OmicsScreen.Engine.Panels;
using OmicsScreen.Reporting.Screen;
using OmicsScreen.Screening.Screen;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Reporting.Tests.Screen;

/// <summary>
/// A real screen of a small simulated panel (<see cref="CausalBlockPanel"/>) whose planted features
/// carry hostile and non-ASCII names, with hostile class and cohort names, a few below-detection
/// and missing cells, and sample ids no report text could contain by chance. Screened once per
/// test run with quick settings.
/// </summary>
internal static class ScreenReportSample
{
    public const string Script = "<script>alert(1)</script>";
    public const string Ampersand = "&amp;";
    public const string Quoted = "\"quoted\"";
    public const string Formula = "=cmd()";
    public const string NonAscii = "\u00C5ngstr\u00F6m-\u03B2";
    public const string CaseClass = "<b>case</b>";
    public const string ControlClass = "ctrl & co";
    public const string SampleIdPrefix = "SUBJ-ID-";

    /// <summary>Names given to the first planted feature of each block: the likeliest to be shortlisted.</summary>
    public static readonly string[] HostileNames = [Script, Ampersand, Quoted, Formula, NonAscii];

    private static readonly Lazy<(Panel Panel, ScreenResult Result)> Screened = new(Screen);

    public static Panel Panel => Screened.Value.Panel;

    public static ScreenResult Result => Screened.Value.Result;

    public static IReadOnlyList<string> SampleIds => Panel.Matrix.SampleIds;

    public static ScreenReportInput Input(bool showSampleIds = false, ScreenResult? result = null) => new(
        Panel,
        result ?? Result,
        [new ReportedFile("matrix", "data/<panel> & co.csv", new string('a', 64)), new ReportedFile("sample sheet", "sheet.tsv", new string('b', 64))],
        "samples in rows",
        [new ReportedFile("result table", "shortlist.tsv", new string('c', 64))],
        "omicsscreen screen 'data/<panel> & co.csv' --pairs 3",
        "0.1.0-test",
        new DateTimeOffset(2026, 1, 2, 3, 4, 5, TimeSpan.Zero),
        new DateTimeOffset(2026, 1, 2, 3, 5, 6, TimeSpan.Zero),
        LoadSeconds: 0.25,
        Cores: 2,
        Threads: 2,
        ShowSampleIds: showSampleIds);

    public static ScreenOptions QuickOptions { get; } = new()
    {
        Seed = 7,
        HalfSamplePairs = 3,
        TreesPerForest = 60,
        CurveFolds = 3,
        CurveInnerPairs = 2,
        CurveMaxPanelSize = 6,
    };

    private static (Panel, ScreenResult) Screen()
    {
        var (simulated, _) = CausalBlockPanel.Generate(new CausalBlockPanel.Design
        {
            SampleCount = 80,
            FeatureCount = 60,
            CausalBlocks = 5,
            CausalPerBlock = 2,
            BlockSize = 6,
            MinEffect = 1.2,
            MaxEffect = 1.8,
            Seed = 11,
        });
        var matrix = simulated.Matrix;
        var names = new string[matrix.FeatureCount];
        for (int f = 0; f < names.Length; f++) names[f] = matrix.FeatureNames[f];
        for (int b = 0; b < HostileNames.Length; b++) names[b * 6] = HostileNames[b];
        var ids = new string[matrix.SampleCount];
        for (int s = 0; s < ids.Length; s++) ids[s] = SampleIdPrefix + s.ToString("D4", System.Globalization.CultureInfo.InvariantCulture);

        var columns = new float[matrix.FeatureCount][];
        var states = new CellState[]?[matrix.FeatureCount];
        for (int f = 0; f < columns.Length; f++) columns[f] = matrix.Column(f).ToArray();
        // The first planted feature gets its five lowest-index samples censored at a limit of 0.2, and one missing cell.
        var censored = new CellState[matrix.SampleCount];
        for (int s = 0; s < 5; s++)
        {
            censored[s] = CellState.BelowDetection;
            columns[0][s] = 0.2f;
        }
        censored[5] = CellState.Missing;
        columns[0][5] = float.NaN;
        states[0] = censored;

        var outcome = simulated.Outcome;
        var cohortLevels = new int[matrix.SampleCount];
        for (int s = 0; s < cohortLevels.Length; s++) cohortLevels[s] = s % 2;
        var panel = new Panel(new FeatureMatrix(names, ids, columns, states),
            new ClassOutcome("status <x>", [ControlClass, CaseClass], outcome.SampleClasses.ToArray(), positiveClass: 1),
            new SampleGrouping("centre", ["north & <west>", "south"], cohortLevels));
        return (panel, ScreenRunner.Run(panel, QuickOptions));
    }
}
