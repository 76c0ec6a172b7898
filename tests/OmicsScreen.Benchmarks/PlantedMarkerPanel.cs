using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks;

/// <summary>The simulated panel the forest benchmarks train on: two classes, 10 planted markers shifted by one SD, fixed seed.</summary>
public static class PlantedMarkerPanel
{
    public static Panel Generate(int sampleCount, int featureCount) => ForestReferenceShapes.Generate(sampleCount, featureCount);
}
