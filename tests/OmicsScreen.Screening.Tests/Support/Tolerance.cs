namespace OmicsScreen.Screening.Tests.Support;

internal static class Tolerance
{
    /// <summary>Asserts |actual - expected| &lt;= relative |expected| (NaN only matches NaN).</summary>
    public static void Relative(double expected, double actual, double relative, string? what = null)
    {
        if (double.IsNaN(expected))
        {
            Assert.True(double.IsNaN(actual), $"{what}: expected NaN, got {actual:R}");
            return;
        }
        double allowed = relative * Math.Abs(expected);
        Assert.True(Math.Abs(actual - expected) <= allowed,
            $"{what}: expected {expected:R}, got {actual:R} (relative error {Math.Abs(actual - expected) / Math.Abs(expected):E2}, allowed {relative:E1})");
    }

    /// <summary>Asserts |actual - expected| &lt;= absolute.</summary>
    public static void Absolute(double expected, double actual, double absolute, string? what = null) =>
        Assert.True(Math.Abs(actual - expected) <= absolute,
            $"{what}: expected {expected:R}, got {actual:R} (difference {Math.Abs(actual - expected):E2}, allowed {absolute:E1})");
}
