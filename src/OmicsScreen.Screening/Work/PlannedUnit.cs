namespace OmicsScreen.Screening.Work;

/// <summary>A unit of a screen's plan with its relative cost (forests x training samples), used to balance parts.</summary>
public readonly record struct PlannedUnit(WorkUnit Unit, double Cost);
