using OmicsScreen.TestSupport.ExternalTools;

namespace OmicsScreen.Reporting.Tests.Support;

/// <summary>
/// Issue 16: a test whose tool is missing is reported skipped outside CI, never passed, and runs
/// (so fails) on CI. Slurm is the tool whose presence is CI itself, so both sides can be checked
/// on any machine. Only this class changes CI in this test process; nothing else here reads it.
/// </summary>
public sealed class RequiresToolFactTests
{
    private static RequiresToolFactAttribute WithCi(string? value)
    {
        string? before = Environment.GetEnvironmentVariable("CI");
        try
        {
            Environment.SetEnvironmentVariable("CI", value);
            return new RequiresToolFactAttribute(ExternalTool.Slurm);
        }
        finally
        {
            Environment.SetEnvironmentVariable("CI", before);
        }
    }

    [Fact]
    public void A_missing_tool_skips_the_test_outside_ci_with_the_reason()
    {
        var fact = WithCi(null);
        Assert.NotNull(fact.Skip);
        Assert.Contains("CI=true", fact.Skip);
    }

    [Fact]
    public void On_ci_the_test_always_runs()
    {
        Assert.Null(WithCi("true").Skip);
    }

    [Fact]
    public void Require_fails_the_test_when_a_tool_is_missing()
    {
        // Reached only on CI or by a test without the attribute: it must fail, not return.
        string? before = Environment.GetEnvironmentVariable("CI");
        try
        {
            Environment.SetEnvironmentVariable("CI", null);
            var failure = Assert.ThrowsAny<Xunit.Sdk.XunitException>(() => ExternalTools.Require(ExternalTool.Slurm));
            Assert.Contains("CI=true", failure.Message);
        }
        finally
        {
            Environment.SetEnvironmentVariable("CI", before);
        }
    }
}
