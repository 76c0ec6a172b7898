namespace OmicsScreen.Data.Inspection;

/// <summary>One cell of the class by cohort table.</summary>
public sealed record ClassCohortCount(string ClassName, string Cohort, int SampleCount);
