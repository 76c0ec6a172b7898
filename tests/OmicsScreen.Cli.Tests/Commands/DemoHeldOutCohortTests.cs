using System.Text.Json;
using OmicsScreen.Data.Demo;

namespace OmicsScreen.Cli.Tests.Commands;

/// <summary>The whole path a lab takes: screen the discovery centres, lock the panel, apply it to a centre held back.</summary>
public sealed class DemoHeldOutCohortTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void A_panel_locked_on_two_demo_centres_classifies_the_third()
    {
        var files = DemoStudyWriter.Write(DemoStudyGenerator.Generate(new DemoStudyOptions()), Path.Combine(_folder.Path, "panel"));
        var sheet = File.ReadAllLines(files.SampleSheet);
        string discovery = _folder.File("discovery.tsv", string.Join('\n', sheet.Where(l => !l.Contains("\teast\t"))) + "\n");
        string heldOut = _folder.File("east.tsv", string.Join('\n', sheet.Where((l, i) => i == 0 || l.Contains("\teast\t"))) + "\n");
        string results = Path.Combine(_folder.Path, "screen");

        var screen = CliHarness.Run("screen", files.Panel, "--samples", discovery, "--drop-unmatched", "--outcome", "status",
            "--out", results, "--pairs", "5", "--trees", "200", "--curve-folds", "3", "--curve-inner-pairs", "2", "--max-panel-size", "21", "--quiet");
        Assert.True(screen.ExitCode == ExitCode.Success, screen.Error);
        string model = Path.Combine(results, "locked_panel.json");
        Assert.True(File.Exists(model));

        string applied = Path.Combine(_folder.Path, "applied");
        var apply = CliHarness.Run("apply", model, files.Panel, "--samples", heldOut, "--drop-unmatched", "--outcome", "status", "--out", applied);
        Assert.True(apply.ExitCode == ExitCode.Success, apply.Error);
        using var evaluation = JsonDocument.Parse(File.ReadAllText(Path.Combine(applied, "evaluation.json")));
        var text = evaluation.RootElement.ToString();
        // The planted markers act the same in every centre, so the held-out centre is classified
        // about as well as the selection-aware estimate of the discovery screen (about 0.95 for the demo).
        double auc = FindNumber(evaluation.RootElement, "auc");
        Assert.True(auc > 0.85, $"held-out AUC {auc:0.000}: {text}");
        Assert.Equal(91, File.ReadAllLines(Path.Combine(applied, "scores.tsv")).Length);
    }

    private static double FindNumber(JsonElement element, string name)
    {
        if (element.ValueKind == JsonValueKind.Object)
            foreach (var property in element.EnumerateObject())
            {
                if (property.Name == name && property.Value.ValueKind == JsonValueKind.Number) return property.Value.GetDouble();
                double inner = FindNumber(property.Value, name);
                if (!double.IsNaN(inner)) return inner;
            }
        return double.NaN;
    }
}
