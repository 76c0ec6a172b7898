namespace OmicsScreen.Data.Inspection;

/// <summary>
/// What `check` found in one covariate column: numeric with its range and median, or
/// categorical with each level's sample count.
/// </summary>
/// <param name="Kind">"numeric" or "categorical".</param>
/// <param name="Minimum">Smallest value (numeric covariates; NaN otherwise).</param>
/// <param name="Median">Median (numeric covariates; NaN otherwise).</param>
/// <param name="Maximum">Largest value (numeric covariates; NaN otherwise).</param>
/// <param name="Levels">Levels with their sample counts (categorical covariates; empty otherwise).</param>
public sealed record CovariateSummary(string Name, string Kind, double Minimum, double Median, double Maximum,
    IReadOnlyList<LevelCount> Levels);
