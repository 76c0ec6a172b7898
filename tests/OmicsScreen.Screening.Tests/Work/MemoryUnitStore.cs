using System.Diagnostics.CodeAnalysis;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Tests.Work;

/// <summary>A store in memory that keeps units as their encoded bytes, so every use goes through the file format.</summary>
internal sealed class MemoryUnitStore(byte[] identity, int featureCount, int decoyCount) : IWorkUnitStore
{
    public Dictionary<WorkUnit, byte[]> Units { get; } = [];
    public int Loads { get; private set; }

    public bool TryLoad(WorkUnit unit, [NotNullWhen(true)] out WorkUnitResult? result)
    {
        result = Units.TryGetValue(unit, out var bytes) ? WorkUnitCodec.Decode(bytes, identity, unit, featureCount, decoyCount, out _) : null;
        if (result is not null) Loads++;
        return result is not null;
    }

    public void Save(WorkUnit unit, WorkUnitResult result) => Units[unit] = WorkUnitCodec.Encode(identity, unit, result);
}
