namespace OmicsScreen.Reporting.Manifests;

/// <summary>How many samples of one known class were called <see cref="Class"/>.</summary>
public sealed record EvaluationCall(string Class, int Samples);
