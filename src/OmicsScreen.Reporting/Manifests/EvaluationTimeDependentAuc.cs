namespace OmicsScreen.Reporting.Manifests;

/// <summary>The cumulative/dynamic AUC at the horizon `apply --horizon` named, with the pairs it rests on.</summary>
public sealed record EvaluationTimeDependentAuc(double Horizon, double Auc, int Cases, int Controls, int CensoredBeforeHorizon, string Method);
