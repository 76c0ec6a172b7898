namespace OmicsScreen.Data.Demo;

/// <summary>What the generator planted in one feature.</summary>
/// <param name="CaseShiftSd">Shift of the case mean on the log2 scale, in units of the feature's SD.</param>
/// <param name="CohortShiftSd">Shift in the batch-affected cohort, in SD units.</param>
/// <param name="Module">Correlated module number, or -1 when the feature is on its own.</param>
/// <param name="DetectionLimit">The feature's detection limit on the linear scale as written, or NaN when it has none.</param>
/// <param name="ActivityEffect">How the feature moves the invented activity score (a measured outcome): empty when it does not.</param>
/// <param name="LogHazardPerSd">Log hazard ratio of a flare per SD of the feature's log2 value (the time-to-event outcome); 0 when none.</param>
public sealed record DemoFeatureTruth(
    string Feature,
    DemoFeatureRole Role,
    double CaseShiftSd,
    double CohortShiftSd,
    int Module,
    double Log2Mean,
    double Log2Sd,
    double MissingRate,
    bool HasDetectionLimit,
    float DetectionLimit = float.NaN,
    string ActivityEffect = "",
    double LogHazardPerSd = 0);
