namespace OmicsScreen.Reporting.Manifests;

/// <summary>An estimate in evaluation.json with its confidence interval and the method that gave the interval.</summary>
public sealed record EvaluationEstimate(double Estimate, double Lower, double Upper, double Level, string Method);
