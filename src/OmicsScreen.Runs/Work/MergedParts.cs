using System.Diagnostics.CodeAnalysis;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// The finished units of every part of a split run, read-only: the store a merge runs the
/// screen from. Any unit that is missing or unusable stops the merge with the file and reason.
/// </summary>
public sealed class MergedParts : IWorkUnitStore
{
    private readonly Dictionary<string, string> _fileOfUnit;
    private readonly byte[] _identity;
    private readonly int _featureCount;
    private readonly int _decoyCount;

    public MergedParts(Dictionary<string, string> fileOfUnit, byte[] identity, int featureCount, int decoyCount)
    {
        _fileOfUnit = fileOfUnit;
        _identity = identity;
        _featureCount = featureCount;
        _decoyCount = decoyCount;
    }

    /// <summary>Reads every unit once before any result is written, so a damaged part is found before the long work starts.</summary>
    public void CheckAll(IEnumerable<WorkUnit> units)
    {
        foreach (var unit in units) Load(unit);
    }

    public bool TryLoad(WorkUnit unit, [NotNullWhen(true)] out WorkUnitResult? result)
    {
        result = Load(unit);
        return true;
    }

    public void Save(WorkUnit unit, WorkUnitResult result) =>
        throw new InvalidOperationException($"A merge computes nothing, yet {unit.Name} was about to be saved.");

    private WorkUnitResult Load(WorkUnit unit)
    {
        if (!_fileOfUnit.TryGetValue(unit.Name, out var file))
            throw new RunRefusedException($"No part holds work unit {unit.Name}; run the missing part again, then merge.", RunRefusal.Input);
        if (!File.Exists(file))
            throw new RunRefusedException($"{file} is missing, though its part lists it; run that part again, then merge.", RunRefusal.Input);
        return WorkUnitCodec.Decode(File.ReadAllBytes(file), _identity, unit, _featureCount, _decoyCount, out var problem)
            ?? throw new RunRefusedException($"{file} {problem}; run that part again, then merge.", RunRefusal.Input);
    }
}
