using OmicsScreen.Engine.Panels;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Friedman's first regression benchmark (Friedman 1991, Ann. Statist. 19:1-67) as committed in
/// reference/regression/friedman1.csv: 300 samples, outcome y, features x1..x30 of which only
/// x1..x5 enter y. Drawn by scikit-learn's make_friedman1 (see make_regression_reference.py).
/// </summary>
public static class Friedman1Data
{
    /// <summary>How many of the leading features enter the outcome; the rest are noise by construction.</summary>
    public const int InformativeCount = 5;

    public static (FeatureMatrix Matrix, double[] Outcome) Load() => ReferenceTables.Measured("regression", "friedman1.csv");
}
