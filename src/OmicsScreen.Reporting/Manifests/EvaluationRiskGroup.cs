namespace OmicsScreen.Reporting.Manifests;

/// <summary>One risk group of a follow-up panel on a cohort: its size, events and Kaplan-Meier median (null when not reached).</summary>
public sealed record EvaluationRiskGroup(string Group, int Samples, int Events, double? MedianSurvival);
