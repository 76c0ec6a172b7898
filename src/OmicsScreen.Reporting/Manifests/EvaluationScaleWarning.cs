namespace OmicsScreen.Reporting.Manifests;

/// <summary>A marker that looks measured on another scale than in discovery, or not measured at all.</summary>
public sealed record EvaluationScaleWarning(string Marker, bool Unmeasured, string Message);
