namespace OmicsScreen.Benchmarks;

/// <summary>Every benchmark case the program knows, grouped by the suite that selects it.</summary>
public static class BenchmarkRegistry
{
    public static IReadOnlyList<(string Suite, IBenchmarkCase Case)> All { get; } = Build();

    private static List<(string, IBenchmarkCase)> Build()
    {
        var cases = new List<(string, IBenchmarkCase)>();
        return cases;
    }
}
