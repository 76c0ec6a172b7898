using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Work;

/// <summary>What a work unit produced; exactly what the rest of the screen needs from it.</summary>
public abstract record WorkUnitResult;

/// <summary>One repeat of the main screen, as a one-row <see cref="RepeatImportances"/>.</summary>
public sealed record RepeatUnitResult(RepeatImportances Row) : WorkUnitResult;

/// <summary>
/// An inner screen (a curve fold, a cohort, or all cohorts but one): its final feature order,
/// each feature's corrected importance averaged over its repeats, and the features its own
/// shortlist rule passed, in order.
/// </summary>
public sealed record InnerScreenResult(int[] Order, double[] MeanCorrected, int[] Shortlist) : WorkUnitResult;
