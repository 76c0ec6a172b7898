using System.Diagnostics.CodeAnalysis;

namespace OmicsScreen.Screening.Work;

/// <summary>
/// Where finished work units are kept between processes: a checkpoint that lets a killed run
/// resume, or the parts of a run split over machines. The screen never knows which.
/// </summary>
public interface IWorkUnitStore
{
    /// <summary>A stored result of the unit, or false when there is none (or it is unusable).</summary>
    bool TryLoad(WorkUnit unit, [NotNullWhen(true)] out WorkUnitResult? result);

    /// <summary>Keeps a finished unit; called once per computed unit, as soon as it is done.</summary>
    void Save(WorkUnit unit, WorkUnitResult result);
}
