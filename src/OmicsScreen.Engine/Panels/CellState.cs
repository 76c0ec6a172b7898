namespace OmicsScreen.Engine.Panels;

/// <summary>What is known about one cell of the measurement matrix.</summary>
/// <remarks>
/// Missing and below-detection are kept apart because they mean different things to an assay:
/// a missing cell says nothing, a censored cell says "lower than the limit". Trees route both
/// through their own bin code, so a forest can learn from censoring without imputation.
/// </remarks>
public enum CellState : byte
{
    Measured = 0,
    Missing = 1,
    /// <summary>Censored by the assay's limit; the stored value is the limit when one was given, NaN otherwise.</summary>
    BelowDetection = 2,
}
