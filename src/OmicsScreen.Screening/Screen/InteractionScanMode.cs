namespace OmicsScreen.Screening.Screen;

/// <summary>Whether the screen runs the pairwise interaction scan (<see cref="Univariate.PairwiseInteractionScan"/>).</summary>
public enum InteractionScanMode
{
    /// <summary>On while (features + decoys) x features stays within <see cref="ScreenOptions.InteractionScanPairLimit"/>.</summary>
    Auto,
    On,
    Off,
}
