using OmicsScreen.Data.Tests.Support;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Assembly;

/// <summary>A feature sheet joined on feature id: display names, annotations, per-feature detection limits, unmatched features.</summary>
public class FeatureSheetTests
{
    private const string Matrix = "id,status,F1,F2,F3\ns1,x,1,0.2,<LOD\ns2,y,2,0.5,NA\ns3,y,3,0.05,9\ns4,x,0.4,0.3,<0.01\n";

    private static PanelLoadOptions Options(string matrix, string sheet) =>
        new() { MatrixPath = matrix, OutcomeColumn = "status", FeatureSheetPath = sheet };

    [Fact]
    public void Display_names_and_annotations_are_carried_in_matrix_order_whatever_the_sheet_order()
    {
        using var folder = new TempFolder();
        string sheet = folder.File("features.tsv", "feature\tpanel\tdisplay_name\nF3\tinflammation\tMarker C\nF1\tmetabolic\tMarker A\nF2\t\tMarker B\n");

        var loaded = PanelLoader.Load(Options(folder.File("m.csv", Matrix), sheet));

        // Values as written in the sheet above, put into the matrix's feature order F1, F2, F3.
        Assert.Equal(["Marker A", "Marker B", "Marker C"], loaded.Features.DisplayNames);
        Assert.Equal("panel", loaded.Features.Annotations.Single().Name);
        Assert.Equal(["metabolic", "", "inflammation"], loaded.Features.Annotations[0].Values);
        Assert.Equal("display_name", loaded.Inspection.FeatureSheet!.DisplayNameColumn);
        Assert.Null(loaded.Inspection.FeatureSheet.DetectionLimitColumn);
    }

    [Fact]
    public void Values_below_a_features_detection_limit_become_below_detection_cells_holding_the_limit()
    {
        using var folder = new TempFolder();
        string sheet = folder.File("features.csv", "feature,detection_limit\nF1,1.5\nF2,0.3\nF3,\n");

        var loaded = PanelLoader.Load(Options(folder.File("m.csv", Matrix), sheet));
        var matrix = loaded.Panel.Matrix;

        // Common practice: a value under the limit of detection is reported as "< LOD", censored at the limit.
        // F1 = 1, 2, 3, 0.4 with limit 1.5: samples 1 and 4 are below it.
        Assert.Equal([CellState.BelowDetection, CellState.Measured, CellState.Measured, CellState.BelowDetection], matrix.States(0).ToArray());
        Assert.Equal([1.5f, 2f, 3f, 1.5f], matrix.Column(0).ToArray());
        // F2 = 0.2, 0.5, 0.05, 0.3 with limit 0.3: a value equal to the limit is not below it.
        Assert.Equal([CellState.BelowDetection, CellState.Measured, CellState.BelowDetection, CellState.Measured], matrix.States(1).ToArray());
        // F3 has no limit: its own tokens are kept as read (<LOD without a value, <0.01 with one).
        Assert.True(float.IsNaN(matrix.Value(2, 0)));
        Assert.Equal(0.01f, matrix.Value(2, 3));
        var found = loaded.Inspection.FeatureSheet!;
        Assert.Equal(2, found.FeaturesWithLimit);
        Assert.Equal([new OmicsScreen.Data.Inspection.FeatureCellCount("F1", 2), new OmicsScreen.Data.Inspection.FeatureCellCount("F2", 2)], found.CensoredCells);
        Assert.Equal(4, found.CensoredCellTotal);
    }

    [Fact]
    public void A_below_detection_token_without_its_own_limit_takes_the_features_limit()
    {
        using var folder = new TempFolder();
        string sheet = folder.File("features.csv", "feature,detection_limit\nF1,\nF2,\nF3,0.5\n");

        var matrix = PanelLoader.Load(Options(folder.File("m.csv", Matrix), sheet)).Panel.Matrix;

        Assert.Equal(0.5f, matrix.Value(2, 0));
        Assert.Equal(CellState.BelowDetection, matrix.State(2, 0));
        // <0.01 carries its own limit, which is kept.
        Assert.Equal(0.01f, matrix.Value(2, 3));
    }

    [Fact]
    public void Features_in_only_one_file_are_refused_naming_both_lists_or_dropped_with_a_warning()
    {
        using var folder = new TempFolder();
        string matrix = folder.File("m.csv", Matrix);
        string sheet = folder.File("features.csv", "feature,display_name\nF1,A\nF2,B\nF9,Z\n");

        var error = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(matrix, sheet)));
        var dropped = PanelLoader.Load(Options(matrix, sheet) with { DropUnmatchedSamples = true });

        Assert.StartsWith("features.csv, column 'feature': features do not match: 1 in m.csv but not in features.csv ('F3'). 1 in features.csv but not in m.csv ('F9').", error.Message);
        Assert.Contains("--drop-unmatched", error.Message);
        Assert.Equal(["F1", "F2"], dropped.Panel.Matrix.FeatureNames);
        Assert.Equal(["A", "B"], dropped.Features.DisplayNames);
        Assert.Contains(dropped.Inspection.Findings, f => f.Code == "unmatched-features-dropped");
    }

    [Fact]
    public void A_repeated_feature_id_or_a_limit_that_is_not_a_number_is_an_error_naming_the_line()
    {
        using var folder = new TempFolder();
        string matrix = folder.File("m.csv", Matrix);

        var repeated = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(matrix, folder.File("a.csv", "feature\nF1\nF2\nF1\nF3\n"))));
        var notANumber = Assert.Throws<PanelInputException>(() => PanelLoader.Load(Options(matrix, folder.File("b.csv", "feature,detection_limit\nF1,0.1\nF2,low\nF3,\n"))));

        Assert.StartsWith("a.csv, line 4, column 'feature': the feature id 'F1' occurs more than once", repeated.Message);
        Assert.StartsWith("b.csv, line 3, column 'detection_limit': the detection limit 'low' of feature 'F2' is not a number.", notANumber.Message);
    }
}
