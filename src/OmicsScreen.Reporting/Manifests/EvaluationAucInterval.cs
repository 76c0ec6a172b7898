namespace OmicsScreen.Reporting.Manifests;

/// <summary>The AUC's confidence interval in evaluation.json, with the method that gave it.</summary>
public sealed record EvaluationAucInterval(string Method, double Level, double Lower, double Upper);
