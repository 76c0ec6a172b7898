namespace OmicsScreen.Screening.Resampling;

/// <summary>One outer fold: the rows a whole screen may see, and the rows it is scored on.</summary>
public sealed record OuterFold(int Repeat, int Fold, int[] TrainingRows, int[] TestRows);
