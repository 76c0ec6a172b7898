using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// One setting of a screen under its one name: the command-line option, the manifest key (the
/// option without its dashes, in snake case) and the report label all come from here.
/// </summary>
/// <param name="Option">The option that sets it, such as <c>--max-q</c>.</param>
/// <param name="Property">The <see cref="ScreenOptions"/> property it sets.</param>
/// <param name="Label">What the report calls it, in words.</param>
/// <param name="Value">The value the run used (automatic settings resolved; null for "none" or "all"), as the manifest records it.</param>
/// <param name="Text">The value as the report shows it, in words where a number alone would mislead.</param>
public sealed record ScreenParameter(string Option, string Property, string Label, Func<ScreenSettings, object?> Value, Func<ScreenSettings, string> Text)
{
    public string Key => Option.TrimStart('-').Replace('-', '_');
}
