namespace OmicsScreen.TestSupport.ExternalTools;

/// <summary>
/// A fact that needs programs outside .NET: reported as skipped, with the reason and the fix,
/// when one is missing outside CI; on CI (CI=true) it always runs, and the test's
/// <see cref="ExternalTools.Require"/> fails it when a tool is missing.
/// </summary>
[AttributeUsage(AttributeTargets.Method, AllowMultiple = false)]
public sealed class RequiresToolFactAttribute : FactAttribute
{
    public RequiresToolFactAttribute(params ExternalTool[] tools)
    {
        Tools = tools;
        if (ExternalTools.OnCi) return;
        var missing = tools.Where(tool => !ExternalTools.IsAvailable(tool)).Select(ExternalTools.Missing).ToArray();
        if (missing.Length > 0) Skip = string.Join("; ", missing);
    }

    public IReadOnlyList<ExternalTool> Tools { get; }
}
