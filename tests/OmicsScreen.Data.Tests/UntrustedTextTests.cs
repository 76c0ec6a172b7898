using System.Globalization;
using OmicsScreen.Data;

namespace OmicsScreen.Data.Tests;

public class UntrustedTextTests
{
    [Fact]
    public void Terminal_escape_sequences_cannot_reach_the_console()
    {
        // ECMA-48 (5th edition, 1991): ESC (0x1B) followed by '[' and the 8-bit CSI (0x9B) start
        // control sequences that recolour text, move the cursor or retitle the window; BEL (0x07) rings.
        Assert.Equal("\\u001b[31mred\\u001b[0m", UntrustedText.Printable("\u001b[31mred\u001b[0m"));
        Assert.Equal("\\u009b2J", UntrustedText.Printable("\u009b2J"));
        Assert.Equal("bell\\u0007", UntrustedText.Printable("bell\u0007"));
        Assert.Equal("a\\nb\\r\\tc", UntrustedText.Printable("a\nb\r\tc"));
    }

    [Fact]
    public void Bidirectional_zero_width_and_line_separator_characters_get_a_visible_mark()
    {
        // Unicode Technical Report 36, section 2.2: bidirectional overrides (U+202E) and isolates
        // (U+2066) reorder what is displayed, zero-width characters (U+200B, U+FEFF) hide a difference.
        Assert.Equal("ab<U+202E>cd", UntrustedText.Printable("ab\u202Ecd"));
        Assert.Equal("<U+2066>x<U+200B>y<U+FEFF>", UntrustedText.Printable("\u2066x\u200By\uFEFF"));
        // U+2028 and U+2029 end a line in some viewers, so a name could fake a line of its own (common practice).
        Assert.Equal("x<U+2028>y<U+2029>", UntrustedText.Printable("x\u2028y\u2029"));
    }

    [Fact]
    public void No_character_that_acts_or_hides_survives_and_escaped_text_prints_unchanged()
    {
        // Every UTF-16 code unit, one at a time, between two letters.
        for (int code = 0; code <= char.MaxValue; code++)
        {
            string text = "a" + (char)code + "b";
            string printed = UntrustedText.Printable(text);
            foreach (char c in printed)
            {
                var category = char.GetUnicodeCategory(c);
                Assert.False(char.IsControl(c) || category is UnicodeCategory.Format or UnicodeCategory.LineSeparator or UnicodeCategory.ParagraphSeparator,
                    $"U+{code:X4} printed as U+{(int)c:X4}");
            }
            Assert.Equal(printed, UntrustedText.Printable(printed));
        }
    }

    [Fact]
    public void Names_differing_only_in_a_hidden_character_print_differently()
    {
        Assert.NotEqual(UntrustedText.Printable("IL\u00016"), UntrustedText.Printable("IL\u00026"));
        Assert.NotEqual(UntrustedText.Printable("IL\u00016"), UntrustedText.Printable("IL?6"));
        Assert.NotEqual(UntrustedText.Printable("IL6\u200B"), UntrustedText.Printable("IL6"));
    }

    [Fact]
    public void Ordinary_names_print_as_they_are()
    {
        foreach (string name in new[] { "", "IL-6", "β-alanine (µmol/L)", "ТНФ-α", "名前", "a\\nb", "x<U+0041>" })
            Assert.Equal(name, UntrustedText.Printable(name));
    }

    [Fact]
    public void A_long_name_is_cut_after_the_printed_length_with_an_ellipsis()
    {
        Assert.Equal("abc…", UntrustedText.Printable("abcdef", maxLength: 3));
        Assert.Equal("abc", UntrustedText.Printable("abc", maxLength: 3));
        // The cut counts printed characters, escapes included.
        Assert.Equal("\\u0001…", UntrustedText.Printable("\u0001\u0001", maxLength: 6));
    }

    [Fact]
    public void Error_messages_show_names_by_the_same_rule_cut_at_sixty_characters()
    {
        Assert.Equal(UntrustedText.Printable("s\u00011\u202E"), Display.Name("s\u00011\u202E"));
        Assert.Equal(new string('x', 60) + "…", Display.Name(new string('x', 61)));
    }
}
