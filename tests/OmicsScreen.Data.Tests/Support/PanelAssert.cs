using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Tests.Support;

/// <summary>Compares panels bit for bit: names, labels, cell states and float bits.</summary>
internal static class PanelAssert
{
    public static void Identical(Panel expected, Panel actual)
    {
        Assert.Equal(expected.Matrix.SampleIds, actual.Matrix.SampleIds);
        Assert.Equal(expected.Matrix.FeatureNames, actual.Matrix.FeatureNames);
        for (int f = 0; f < expected.FeatureCount; f++)
        {
            for (int s = 0; s < expected.SampleCount; s++)
            {
                Assert.Equal(expected.Matrix.State(f, s), actual.Matrix.State(f, s));
                Assert.Equal(BitConverter.SingleToInt32Bits(expected.Matrix.Value(f, s)),
                    BitConverter.SingleToInt32Bits(actual.Matrix.Value(f, s)));
            }
        }
        Assert.Equal(expected.Outcome.ColumnName, actual.Outcome.ColumnName);
        Assert.Equal(expected.Outcome.ClassNames, actual.Outcome.ClassNames);
        Assert.Equal(expected.Outcome.SampleClasses.ToArray(), actual.Outcome.SampleClasses.ToArray());
        Assert.Equal(expected.Outcome.PositiveClass, actual.Outcome.PositiveClass);
        Grouping(expected.Cohort, actual.Cohort);
        Grouping(expected.Subject, actual.Subject);
        Assert.Equal(expected.ExtraColumns.Keys.Order(), actual.ExtraColumns.Keys.Order());
        foreach (var (name, values) in expected.ExtraColumns) Assert.Equal(values, actual.ExtraColumns[name]);
    }

    private static void Grouping(SampleGrouping? expected, SampleGrouping? actual)
    {
        Assert.Equal(expected is null, actual is null);
        if (expected is null || actual is null) return;
        Assert.Equal(expected.ColumnName, actual.ColumnName);
        Assert.Equal(expected.LevelNames, actual.LevelNames);
        Assert.Equal(expected.SampleLevels.ToArray(), actual.SampleLevels.ToArray());
    }
}
