namespace OmicsScreen.Screening.Screen;

/// <summary>How the shortlist's cut is placed; both keep the selection-frequency filter.</summary>
public enum ShortlistRule
{
    /// <summary>
    /// Benjamini-Hochberg (1995) q-values of the decoy-calibrated p-values at or under the level:
    /// controls the false discovery rate when null features and decoys are exchangeable.
    /// </summary>
    QValue,

    /// <summary>
    /// The longest list whose decoy bound (features/decoys) x (1 + decoys passing) / listed, the
    /// knockoff+ form of Barber &amp; Candès (2015, Ann Stat 43(5)), stays at or under the level.
    /// </summary>
    DecoyBound,
}
