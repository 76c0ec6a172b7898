using OmicsScreen.Reporting.Html;
using OmicsScreen.Reporting.Tests.Support;

namespace OmicsScreen.Reporting.Tests.Html;

public class MarkupTextTests
{
    // OWASP XSS prevention guidance: encode & < > " ' in element content and quoted attributes.
    [Fact]
    public void The_five_markup_characters_are_encoded()
    {
        Assert.Equal("&lt;script&gt;alert(1)&lt;/script&gt;", MarkupText.Encode("<script>alert(1)</script>"));
        Assert.Equal("&amp;amp; &quot;q&quot; &#39;s&#39;", MarkupText.Encode("&amp; \"q\" 's'"));
    }

    [Fact]
    public void Non_ascii_letters_are_kept()
    {
        Assert.Same(SampleReport.NonAscii, MarkupText.Encode(SampleReport.NonAscii));
        Assert.Equal("\U0001F9EC gene", MarkupText.Encode("\U0001F9EC gene")); // a surrogate pair stays whole
    }

    // XML 1.0 section 2.2 (Char production) forbids most C0 controls and unpaired surrogates.
    [Fact]
    public void Characters_xml_forbids_are_replaced_so_the_result_parses()
    {
        string encoded = MarkupText.Encode("a\u0001b\uD800c\uFFFEd\te");
        Assert.Equal("a\uFFFDb\uFFFDc\uFFFDd\te", encoded);
        var document = Markup.Parse("<p>" + encoded + "</p>");
        Assert.Equal("a\uFFFDb\uFFFDc\uFFFDd\te", document.Root!.Value);
    }

    // Unicode Technical Report 36 (security considerations): bidirectional overrides such as U+202E
    // reorder what is shown, and zero-width characters hide a difference between two names.
    [Fact]
    public void Bidirectional_and_zero_width_characters_are_shown_as_a_visible_mark()
    {
        Assert.Equal("ab&lt;U+202E&gt;cd x&lt;U+200B&gt;y", MarkupText.Encode("ab\u202Ecd x\u200By"));
    }
}
