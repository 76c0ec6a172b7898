using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Calibration;

/// <summary>Reads a calibration panel back on the model's standardised scale, for the generator tests.</summary>
internal static class CalibrationValues
{
    /// <summary>z = (log x - mu) / sigma for log-normal cells, (x - mu) / sigma otherwise (the inverse of the model's transform).</summary>
    public static double[] Standardised(CalibrationModel model, Panel panel, int feature)
    {
        var column = panel.Matrix.Column(feature);
        var values = new double[column.Length];
        bool log = model.Background.Distribution == CellDistribution.LogNormal;
        for (int s = 0; s < column.Length; s++)
            values[s] = ((log ? Math.Log(column[s]) : column[s]) - model.Location(feature)) / model.Scale(feature);
        return values;
    }

    /// <summary>Mean of the standardised values in class 1 minus class 0, in SD units of the model.</summary>
    public static double ClassShift(CalibrationModel model, Panel panel, int feature)
    {
        var values = Standardised(model, panel, feature);
        var classes = panel.Outcome.SampleClasses;
        double caseSum = 0, controlSum = 0;
        int cases = 0, controls = 0;
        for (int s = 0; s < values.Length; s++)
            if (classes[s] == 1) { caseSum += values[s]; cases++; }
            else { controlSum += values[s]; controls++; }
        return caseSum / cases - controlSum / controls;
    }

    /// <summary>Mann-Whitney p-value of one feature, the positive class against the rest (below-detection cells lowest).</summary>
    public static double RankTestP(Panel panel, int feature)
    {
        var column = panel.Matrix.Column(feature);
        var classes = panel.Outcome.SampleClasses;
        var positive = new List<double>();
        var rest = new List<double>();
        for (int s = 0; s < column.Length; s++)
        {
            double value = panel.Matrix.State(feature, s) == CellState.BelowDetection ? double.NegativeInfinity : column[s];
            (classes[s] == panel.Outcome.PositiveClass ? positive : rest).Add(value);
        }
        return MannWhitney.Test(positive.ToArray(), rest.ToArray()).PValue;
    }
}
