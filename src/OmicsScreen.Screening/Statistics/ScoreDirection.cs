namespace OmicsScreen.Screening.Statistics;

/// <summary>Whether a larger score is better (AUC, accuracy) or worse (error, loss).</summary>
public enum ScoreDirection
{
    HigherIsBetter = 0,
    LowerIsBetter = 1,
}
