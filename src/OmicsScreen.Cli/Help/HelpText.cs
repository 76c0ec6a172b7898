using System.CommandLine;
using System.CommandLine.Help;
using System.Globalization;
using System.Text;

namespace OmicsScreen.Cli.Help;

/// <summary>
/// The help of one command as plain text: usage, description, arguments, the options in the
/// command's sections (each with its value name and default), and examples. Lines are wrapped
/// at 100 characters so the text reads the same in any terminal and in the approved copy.
/// </summary>
public static class HelpText
{
    private const int Width = 100;
    private const int LabelWidthLimit = 34;

    public static string For(Command command)
    {
        var text = new StringBuilder();
        string path = UsageErrors.Path(command);
        text.Append("Usage: ").Append(path);
        if (command.Subcommands.Count > 0) text.Append(" COMMAND");
        foreach (var argument in command.Arguments) text.Append(' ').Append(ArgumentLabel(argument));
        foreach (var option in command.Options.Where(o => o.Required)) text.Append(' ').Append(Label(option));
        text.Append(" [options]\n\n");
        AppendWrapped(text, command.Description ?? "", 0);
        text.Append('\n');

        var rows = new List<(string Title, List<(string Label, string Text)> Rows)>();
        if (command.Arguments.Count > 0)
            rows.Add(("Arguments", command.Arguments.Select(a => (ArgumentLabel(a), a.Description ?? "")).ToList()));
        if (command.Subcommands.Count > 0)
            rows.Add(("Commands", command.Subcommands.Where(c => !c.Hidden).Select(c => (c.Name, c.Description ?? "")).ToList()));
        foreach (var section in Sections(command))
            rows.Add((section.Title, section.Options.Select(o => (Label(o), Describe(o))).ToList()));
        int labelWidth = Math.Min(LabelWidthLimit, rows.SelectMany(r => r.Rows).Max(r => r.Label.Length));
        foreach (var (title, entries) in rows)
        {
            text.Append(title).Append(":\n");
            foreach (var (label, description) in entries) AppendRow(text, label, description, labelWidth);
            text.Append('\n');
        }
        if (command is IHelpLayout { Examples.Count: > 0 } layout)
        {
            text.Append("Examples:\n");
            foreach (var example in layout.Examples)
            {
                AppendWrapped(text, example.Purpose + ":", 2);
                text.Append("    ").Append(example.CommandLine).Append('\n');
            }
            text.Append('\n');
        }
        return text.ToString();
    }

    /// <summary>The command's own sections, then any option they leave out, then help.</summary>
    public static IReadOnlyList<HelpSection> Sections(Command command)
    {
        var sections = command is IHelpLayout layout ? layout.HelpSections.ToList() : [];
        var placed = new HashSet<Option>(sections.SelectMany(s => s.Options));
        var rest = command.Options.Where(o => !o.Hidden && !placed.Contains(o) && o is not HelpOption && o is not VersionOption).ToList();
        var help = AllOptions(command).OfType<HelpOption>().FirstOrDefault();
        if (help is not null) rest.Add(help);
        string title = sections.Count == 0 ? "Options" : rest.All(o => o is HelpOption) ? "Help" : "Other options";
        if (rest.Count > 0) sections.Add(new HelpSection(title, rest));
        return sections;
    }

    private static IEnumerable<Option> AllOptions(Command command)
    {
        for (Command? current = command; current is not null; current = current.Parents.OfType<Command>().FirstOrDefault())
            foreach (var option in current.Options) yield return option;
    }

    public static string Label(Option option)
    {
        // The parser also accepts /h, -? and /?; the help shows the two spellings people type.
        if (option is HelpOption) return "-h, --help";
        var names = new List<string>(option.Aliases.Where(a => !a.StartsWith("--", StringComparison.Ordinal)).OrderBy(a => a.Length));
        names.Add(option.Name);
        string label = string.Join(", ", names);
        if (TakesValue(option)) label += " " + (option.HelpName ?? "VALUE");
        return label;
    }

    /// <summary>Switches take no value; everything else shows the name of the value it takes.</summary>
    public static bool TakesValue(Option option) =>
        option.ValueType != typeof(bool) && option.ValueType != typeof(bool?) && option.Arity.MaximumNumberOfValues > 0;

    private static string ArgumentLabel(Argument argument) =>
        argument.Arity.MaximumNumberOfValues > 1 ? argument.Name + "..." : argument.Name;

    private static string Describe(Option option)
    {
        string text = option.Description ?? "";
        if (option.Required) text += " Required.";
        if (option.HasDefaultValue && TakesValue(option) && option.GetDefaultValue() is { } value)
            text += " Default: " + DefaultText(value) + ".";
        return text;
    }

    private static string DefaultText(object value) => value switch
    {
        double d => d.ToString("0.###", CultureInfo.InvariantCulture),
        Enum e => e.ToString().ToLowerInvariant(),
        IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
        _ => value.ToString() ?? "",
    };

    private static void AppendRow(StringBuilder text, string label, string description, int labelWidth)
    {
        int indent = 2 + labelWidth + 2;
        text.Append("  ").Append(label);
        if (label.Length > labelWidth)
        {
            text.Append('\n');
            AppendWrapped(text, description, indent);
            return;
        }
        text.Append(' ', labelWidth - label.Length + 2);
        AppendWrapped(text, description, indent, firstLineIndented: true);
    }

    /// <summary>Word-wraps <paramref name="paragraph"/> at <see cref="Width"/>, every line indented.</summary>
    private static void AppendWrapped(StringBuilder text, string paragraph, int indent, bool firstLineIndented = false)
    {
        int column = firstLineIndented ? indent : 0;
        if (!firstLineIndented) text.Append(' ', indent);
        column = indent;
        bool lineEmpty = true;
        foreach (var word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            if (!lineEmpty && column + 1 + word.Length > Width)
            {
                text.Append('\n').Append(' ', indent);
                column = indent;
                lineEmpty = true;
            }
            if (!lineEmpty)
            {
                text.Append(' ');
                column++;
            }
            text.Append(word);
            column += word.Length;
            lineEmpty = false;
        }
        text.Append('\n');
    }
}
