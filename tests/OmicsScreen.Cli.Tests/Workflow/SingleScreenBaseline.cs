namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>The small panel and the results of one whole `screen` of it: what every split run must reproduce.</summary>
internal sealed record SingleScreenBaseline(WorkflowPanel Panel, string Results)
{
    /// <summary>Writes the panel into <paramref name="folder"/> and screens it once into folder/single.</summary>
    public static SingleScreenBaseline Create(string folder, DateTime deadline)
    {
        var panel = WorkflowPanel.Write(folder);
        string results = Path.Combine(folder, "single");
        OmicsScreenProgram.ScreenOnce(panel, results, deadline);
        return new SingleScreenBaseline(panel, results);
    }
}
