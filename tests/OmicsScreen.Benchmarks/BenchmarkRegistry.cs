namespace OmicsScreen.Benchmarks;

/// <summary>Every benchmark case the program knows, grouped by the suite that selects it.</summary>
public static class BenchmarkRegistry
{
    public static IReadOnlyList<(string Suite, IBenchmarkCase Case)> All { get; } = Build();

    /// <summary>Summaries printed after their suite's cases have run.</summary>
    public static IReadOnlyList<ISuiteReport> Reports { get; } = [new ScalingReport(), new ForestReport(), new GrowProcessReport()];

    private static List<(string, IBenchmarkCase)> Build()
    {
        var cases = new List<(string, IBenchmarkCase)>();
        AddLoadCases(cases);
        foreach (var point in ScalingPlan.Points) cases.Add(("scaling", point));
        cases.Add(("scaling", ScalingPlan.ScreenCheck));
        cases.Add(("forest", new ForestTrainingCase("forest-200x20000", 200, 20_000, 0.1)));
        cases.Add(("forest", new ForestTrainingCase("forest-1000x2000", 1_000, 2_000, 0.2)));
        cases.Add(("forest", new ForestTrainingCase("forest-4000x500", 4_000, 500, 0.5)));
        // One thread, processor seconds: the before/after figure for engine changes.
        cases.Add(("engine-cost", new EngineCostCase("engine-cost-200x20000", 200, 20_000, 100)));
        cases.Add(("engine-cost", new EngineCostCase("engine-cost-1000x2000", 1_000, 2_000, 100)));
        cases.Add(("engine-cost", new EngineCostCase("engine-cost-4000x500", 4_000, 500, 30)));
        // Measured and time-to-event forests beside ranger (issues 17 and 18).
        // ranger's log-rank forests with leaves of one sample are slow, so the survival cases grow 100 trees.
        cases.Add(("outcome-forests", new OutcomeForestCase("regression-500x2000", false, 500, 2_000, 500)));
        cases.Add(("outcome-forests", new OutcomeForestCase("survival-500x2000", true, 500, 2_000, 100)));
        cases.Add(("outcome-forests", new OutcomeForestCase("survival-200x5000", true, 200, 5_000, 100)));
        cases.Add(("grow-process", new GrowProcessCase("grow-process-1000x2000", 1_000, 2_000)));
        cases.Add(("interaction-scan", new InteractionScanCase(150, 1_000, 1_000)));
        cases.Add(("interaction-scan", new InteractionScanCase(200, 10_000, 5_000)));
        cases.Add(("interaction-scan", new InteractionScanCase(1_000, 5_000, 5_000)));
        cases.Add(("screen", new ScreenCase("screen-200x20000", 200, 20_000)));
        cases.Add(("screen", new ScreenCase("screen-1000x2000", 1_000, 2_000)));
        // Issues 17 and 18: the same shapes with a measured and with a time-to-event outcome.
        cases.Add(("screen-kinds", new OutcomeKindScreenCase("screen-measured-200x20000", Engine.Panels.OutcomeKind.Measured, 200, 20_000)));
        cases.Add(("screen-kinds", new OutcomeKindScreenCase("screen-measured-1000x2000", Engine.Panels.OutcomeKind.Measured, 1_000, 2_000)));
        cases.Add(("screen-kinds", new OutcomeKindScreenCase("screen-follow-up-200x20000", Engine.Panels.OutcomeKind.TimeToEvent, 200, 20_000)));
        cases.Add(("screen-kinds", new OutcomeKindScreenCase("screen-follow-up-1000x2000", Engine.Panels.OutcomeKind.TimeToEvent, 1_000, 2_000)));
        // The widest panel the automatic interaction scan takes on, with and without it.
        cases.Add(("screen-scan", new ScreenCase("screen-200x10000", 200, 10_000)));
        cases.Add(("screen-scan", new ScreenCase("screen-200x10000-no-scan", 200, 10_000, Screening.Screen.InteractionScanMode.Off)));
        // The runtime's own share: a panel too small to matter.
        cases.Add(("memory-baseline", new MemoryCase("memory-60x100", 60, 100)));
        cases.Add(("memory", new MemoryCase("memory-200x2000", 200, 2_000)));
        cases.Add(("memory", new MemoryCase("memory-200x20000", 200, 20_000)));
        cases.Add(("memory", new MemoryCase("memory-1000x5000", 1_000, 5_000)));
        return cases;
    }

    private static void AddLoadCases(List<(string, IBenchmarkCase)> cases)
    {
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.DelimitedText)));
        cases.Add(("load", new LoadPanelCase(5000, 1000, Data.MatrixFileFormat.DelimitedText)));
        // The layouts of issue 20, made from the same 200 x 20,000 panel as the CSV above.
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.DelimitedText, variant: LoadPanelCase.TextVariant.Gzip)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.DelimitedText, variant: LoadPanelCase.TextVariant.FeaturesDescribed)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.DelimitedText, variant: LoadPanelCase.TextVariant.Long)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.DelimitedText, variant: LoadPanelCase.TextVariant.LongGzip)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.Parquet)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.ArrowFile)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.ArrowStream)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.Parquet, Data.PanelLayout.FeaturesInRows)));
        cases.Add(("load", new LoadPanelCase(200, 20_000, Data.MatrixFileFormat.ArrowFile, Data.PanelLayout.FeaturesInRows)));
    }
}
