namespace OmicsScreen.Reporting.Manifests;

/// <summary>One known class of the cohort and how many of its samples were called each class.</summary>
public sealed record EvaluationConfusionRow(string KnownClass, IReadOnlyList<EvaluationCall> Called);
