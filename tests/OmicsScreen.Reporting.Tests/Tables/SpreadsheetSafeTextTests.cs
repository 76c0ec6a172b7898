using OmicsScreen.Reporting.Tables;

namespace OmicsScreen.Reporting.Tests.Tables;

public class SpreadsheetSafeTextTests
{
    // OWASP "CSV Injection": cells starting with =, +, -, @, tab or carriage return are prefixed with a single quote.
    [Theory]
    [InlineData("=cmd()", "'=cmd()")]
    [InlineData("+1", "'+1")]
    [InlineData("-x", "'-x")]
    [InlineData("@SUM(A1)", "'@SUM(A1)")]
    [InlineData("\t=1", "' =1")]
    [InlineData("\r=1", "' =1")]
    [InlineData("  =HYPERLINK(\"http://x\")", "'  =HYPERLINK(\"http://x\")")]
    [InlineData("\uFF1D1+1", "'\uFF1D1+1")] // full-width equals sign
    [InlineData("\uFF0B1", "'\uFF0B1")]
    [InlineData("\uFF0D1", "'\uFF0D1")]
    [InlineData("\uFF20SUM", "'\uFF20SUM")]
    public void Formula_like_names_are_neutralised_with_a_leading_quote(string name, string expected) =>
        Assert.Equal(expected, SpreadsheetSafeText.Sanitise(name));

    [Theory]
    [InlineData("IL-6")]
    [InlineData("ALB")]
    [InlineData("Ångström-β")]
    [InlineData("a=b")]
    [InlineData("1-methylhistidine")]
    public void Ordinary_names_are_returned_unchanged(string name) =>
        Assert.Same(name, SpreadsheetSafeText.Sanitise(name));

    [Fact]
    public void Tabs_line_breaks_and_control_characters_become_spaces()
    {
        Assert.Equal("a b c d e f g", SpreadsheetSafeText.Sanitise("a\tb\nc\rd\u2028e\u0085f\u0000g"));
    }

    [Fact]
    public void Null_and_empty_names_give_an_empty_cell()
    {
        Assert.Equal("", SpreadsheetSafeText.Sanitise(null));
        Assert.Equal("", SpreadsheetSafeText.Sanitise(""));
    }
}
