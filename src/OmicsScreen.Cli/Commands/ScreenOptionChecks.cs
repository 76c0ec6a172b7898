using System.Globalization;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// The screen's settings checked against the options that set them, so a wrong value is reported
/// as the option to change and the values it accepts, not as the library's field name.
/// </summary>
internal static class ScreenOptionChecks
{
    public static void Check(ScreenOptions o)
    {
        Require(o.HalfSamplePairs >= 1, "--pairs", o.HalfSamplePairs, "must be at least 1 (each pair gives two half-sample repeats)");
        Require(o.TreesPerForest >= 10, "--trees", o.TreesPerForest, "must be at least 10: fewer trees give no stable out-of-bag estimate");
        Require(o.FeaturesPerSplit >= 0, "--features-per-split", o.FeaturesPerSplit, "must be at least 1 (leave it out for the square root of the feature count)");
        Require(o.MinLeafSize >= 0, "--min-leaf", o.MinLeafSize, "must be at least 1 (leave it out for the outcome kind's default)");
        Require(o.RepeatSelectionLevel > 0 && o.RepeatSelectionLevel < 0.5, "--repeat-level", o.RepeatSelectionLevel, "must lie between 0 and 0.5 (for example 0.10)");
        Require(o.SelectedPerRepeat >= 0, "--per-repeat-cap", o.SelectedPerRepeat, "must be at least 1 (leave it out for no cap)");
        Require(o.FrequencyThreshold == 0 || (o.FrequencyThreshold > 0.5 && o.FrequencyThreshold <= 1), "--min-frequency", o.FrequencyThreshold,
            "must be above 0.5 and at most 1 (for example 0.6), or 0 to leave the list to the q-values: a filter must ask for more than half of the repeats");
        Require(o.QValueThreshold > 0 && o.QValueThreshold <= 1, "--max-q", o.QValueThreshold, "must be above 0 and at most 1 (for example 0.10)");
        Require(o.DecoyCount >= -1, "--decoys", o.DecoyCount, "must be 0 or more (leave it out for the automatic count)");
        Require(o.OutcomePermutations >= 0, "--outcome-permutations", o.OutcomePermutations, "must be 0 or more");
        Require(o.RedundancyCorrelation > 0 && o.RedundancyCorrelation <= 1, "--redundancy-rho", o.RedundancyCorrelation, "must be above 0 and at most 1 (for example 0.7)");
        Require(o.CurveFolds == 0 || o.CurveFolds >= 2, "--curve-folds", o.CurveFolds, "must be at least 2 (or 0 to skip the panel-size curve)");
        // Each fold's inner screen has its own seed from a family of RandomStreams.SlotFamilyWidth.
        Require(o.CurveFolds < RandomStreams.SlotFamilyWidth, "--curve-folds", o.CurveFolds,
            FormattableString.Invariant($"must be below {RandomStreams.SlotFamilyWidth} (5 or 10 folds are usual)"));
        Require(o.CurveFoldRepeats >= 1, "--curve-repeats", o.CurveFoldRepeats, "must be at least 1");
        Require(o.CurveInnerPairs >= 1, "--curve-inner-pairs", o.CurveInnerPairs, "must be at least 1");
        Require(o.CurveMaxPanelSize >= 1, "--max-panel-size", o.CurveMaxPanelSize, "must be at least 1");
        Require(o.ThreadCount >= 0, "--threads", o.ThreadCount, "must be at least 1 (leave it out to use all cores)");
        CheckDecoysAgainstLevel(o);
    }

    /// <summary>
    /// Below the tail fit's 100 decoys a p-value is a Monte Carlo count against the decoys, never
    /// under 1/(decoys + 1) (Davison &amp; Hinkley 1997, eq. 4.11), and a Benjamini-Hochberg q-value is
    /// never under its p-value; the decoy bound's smallest value is 1/decoys (a list of every
    /// feature, no decoy passing). When that floor is above --max-q no feature can ever be listed.
    /// </summary>
    private static void CheckDecoysAgainstLevel(ScreenOptions o)
    {
        if (o.DecoyCount <= 0) return;
        // From 100 decoys on, a tail fitted to the largest decoys gives p-values below the count's floor.
        if (o.Rule == ShortlistRule.QValue && o.DecoyCount >= DecoyNull.MinimumTailFitCount) return;
        double floor = o.Rule == ShortlistRule.DecoyBound ? 1.0 / o.DecoyCount : 1.0 / (o.DecoyCount + 1);
        if (floor <= o.QValueThreshold) return;
        int needed = o.Rule == ShortlistRule.DecoyBound
            ? (int)Math.Ceiling(1 / o.QValueThreshold - 1e-9)
            : (int)Math.Ceiling(1 / o.QValueThreshold - 1 - 1e-9);
        string measure = o.Rule == ShortlistRule.DecoyBound ? "the decoy bound" : "a p-value";
        throw new CommandInputException(string.Create(CultureInfo.InvariantCulture,
            $"--decoys {o.DecoyCount} can never give a shortlist at --max-q {o.QValueThreshold}: with so few decoys {measure} cannot fall below {floor:0.####}. "
            + $"Leave --decoys out for the automatic count (at least 1,000), give at least {Math.Max(needed, 1)}, or 0 to turn decoys off."));
    }

    /// <summary>
    /// An option whose absence means "automatic" (0 in the options record): a value given must be
    /// at least <paramref name="least"/>, since a given 0 or -1 would silently mean "automatic" too.
    /// </summary>
    /// <returns>The value given, or <paramref name="absent"/> when the option was left out.</returns>
    public static int Given(int? value, string option, int least, string whenLeftOut, int absent = 0)
    {
        if (value is not { } given) return absent;
        Require(given >= least, option, given, FormattableString.Invariant($"must be at least {least} ({whenLeftOut})"));
        return given;
    }

    private static void Require(bool condition, string option, double value, string rule)
    {
        if (!condition)
            throw new CommandInputException($"{option} {value.ToString(CultureInfo.InvariantCulture)}: the value {rule}.");
    }
}
