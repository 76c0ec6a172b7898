namespace OmicsScreen.Data.Demo;

/// <summary>Why a demo feature behaves as it does; written to the truth table.</summary>
public enum DemoFeatureRole
{
    /// <summary>No relation to the outcome (may still belong to a correlated module).</summary>
    Noise,
    /// <summary>A true marker acting on its own.</summary>
    Marker,
    /// <summary>A true marker because its whole correlated module shifts with the outcome.</summary>
    ModuleMarker,
    /// <summary>A true marker that is often below the detection limit in controls.</summary>
    CensoredMarker,
    /// <summary>Shifted strongly in one cohort only, with no effect within any cohort.</summary>
    BatchArtefact,
    /// <summary>Mildly shifted in the batch-affected cohort, like many features of a real batch.</summary>
    BatchShifted,
}
