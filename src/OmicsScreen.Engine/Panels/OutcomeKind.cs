namespace OmicsScreen.Engine.Panels;

/// <summary>What a panel's outcome is: classes to separate, a quantity to predict, or a censored time to an event.</summary>
public enum OutcomeKind
{
    /// <summary>Each sample belongs to one of a few named classes (case/control, subtypes).</summary>
    Classes,
    /// <summary>Each sample has a measured quantity (a lab value, a clinical score, a dose response).</summary>
    Measured,
    /// <summary>Each sample has a follow-up time and whether the event was observed at its end (or censored).</summary>
    TimeToEvent,
}
