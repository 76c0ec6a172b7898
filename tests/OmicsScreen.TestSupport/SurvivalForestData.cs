using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Survival;

namespace OmicsScreen.TestSupport;

/// <summary>
/// The invented censored panel of reference/survival/survival_forest.csv (200 samples, 20 markers,
/// hazard 0.1 exp(0.8 x1 - 0.6 x2 + 0.7 [x3 > 0]); made by make_survival_forest_reference.R).
/// </summary>
public static class SurvivalForestData
{
    public static (FeatureMatrix Matrix, FollowUpTimes FollowUp) Load()
    {
        var lines = File.ReadAllLines(Path.Combine(ReferenceData.Directory, "survival", "survival_forest.csv"));
        var markers = lines[0].Split(',')[3..];
        var rows = lines[1..].Select(l => l.Split(',')).ToArray();
        var builder = new FeatureMatrixBuilder(markers, rows.Select(r => r[0]).ToArray());
        var time = new double[rows.Length];
        var events = new bool[rows.Length];
        for (int s = 0; s < rows.Length; s++)
        {
            time[s] = double.Parse(rows[s][1], CultureInfo.InvariantCulture);
            events[s] = rows[s][2] == "1";
            for (int f = 0; f < markers.Length; f++)
                builder.SetMeasured(f, s, float.Parse(rows[s][f + 3], CultureInfo.InvariantCulture));
        }
        return (builder.Build(), new FollowUpTimes(time, events));
    }
}
