using OmicsScreen.Engine.Panels;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;
using OmicsScreen.Data;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Work;

/// <summary>
/// What makes two runs the same run: the panel's content, every setting that changes a result
/// (all but the thread count, which never does), and the software version. Stored units are
/// used only by a run with the same identity.
/// </summary>
public static class RunIdentity
{
    internal static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        // A file, not HTML: keep '+' and non-ASCII names readable.
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        Converters = { new JsonStringEnumConverter() },
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    /// <summary>The options as they enter the identity: threads zeroed, since results do not depend on them.</summary>
    public static ScreenOptions Canonical(ScreenOptions options) => options with { ThreadCount = 0 };

    /// <summary>
    /// The canonical options with the smallest leaf resolved for the outcome kind, so a run that
    /// left --min-leaf at its default and one that named the same value are the same run (and a
    /// checkpoint written before the default became per kind still resumes).
    /// </summary>
    private static ScreenOptions Resolved(ScreenOptions options, OutcomeKind kind) =>
        Canonical(options) with { MinLeafSize = ScreenSettings.MinLeafFor(options, kind) };

    /// <summary>The identity of a run of this program on a loaded panel, and the record that describes it.</summary>
    /// <param name="panel">How the panel was loaded; recorded so another node can load it again.</param>
    /// <param name="commandLine">The command as typed, recorded so a merge can name the single run it equals.</param>
    public static (byte[] Identity, RunRecord Record) Of(string kind, LoadedPanel loaded, PanelLoadOptions panel, ScreenOptions screen,
        bool showSampleIds, IReadOnlyList<string> commandLine)
    {
        var digest = PanelDigest.Compute(loaded.Panel);
        var resolved = Resolved(screen, loaded.Panel.Kind);
        var identity = Compute(digest, resolved, ToolVersion.Current);
        return (identity, Describe(kind, loaded, digest, panel, resolved, showSampleIds, commandLine, identity));
    }

    private static byte[] Compute(byte[] panelDigest, ScreenOptions options, string softwareVersion)
    {
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        hash.AppendData(Encoding.UTF8.GetBytes($"omicsscreen run v{RunRecord.CurrentFormatVersion}\n{softwareVersion}\n"));
        hash.AppendData(panelDigest);
        hash.AppendData(Encoding.UTF8.GetBytes(JsonSerializer.Serialize(Canonical(options), Json)));
        return hash.GetHashAndReset();
    }

    /// <summary>A record describing this run; paths made absolute so another node can load the inputs again.</summary>
    private static RunRecord Describe(string kind, LoadedPanel loaded, byte[] panelDigest, PanelLoadOptions panel, ScreenOptions screen,
        bool showSampleIds, IReadOnlyList<string> commandLine, byte[] identity)
    {
        var load = panel with
        {
            MatrixPath = Path.GetFullPath(panel.MatrixPath),
            SampleSheetPath = panel.SampleSheetPath is { } sheet ? Path.GetFullPath(sheet) : null,
            FeatureSheetPath = panel.FeatureSheetPath is { } features ? Path.GetFullPath(features) : null,
        };
        return new RunRecord
        {
            Kind = kind,
            SoftwareVersion = ToolVersion.Current,
            RunIdentity = Convert.ToHexStringLower(identity),
            PanelSha256 = Convert.ToHexStringLower(panelDigest),
            Inputs = loaded.Inputs.Select(i => new RecordedInput(Path.GetFullPath(i.Path), i.ByteCount, i.Sha256)).ToArray(),
            LoadOptions = load,
            ScreenOptions = Canonical(screen),
            ShowSampleIds = showSampleIds,
            CommandLine = commandLine,
        };
    }

    /// <summary>Why a stored record is not of this run, in words a user can act on; null when it is.</summary>
    public static string? Difference(RunRecord stored, RunRecord current)
    {
        if (stored.RunIdentity == current.RunIdentity) return null;
        if (stored.SoftwareVersion != current.SoftwareVersion)
            return $"it was made by OmicsScreen {stored.SoftwareVersion}, and this is {current.SoftwareVersion}";
        if (stored.PanelSha256 != current.PanelSha256)
            return "it was made from different input data (the panel's content differs)";
        var settings = ChangedSettings(stored.ScreenOptions, current.ScreenOptions);
        return settings.Count > 0
            ? "it was made with different settings: " + string.Join("; ", settings)
            : "its run identity differs";
    }

    private static List<string> ChangedSettings(ScreenOptions stored, ScreenOptions current)
    {
        var a = JsonSerializer.SerializeToElement(Canonical(stored), Json);
        var b = JsonSerializer.SerializeToElement(Canonical(current), Json);
        var changed = new List<string>();
        foreach (var property in a.EnumerateObject())
        {
            string now = b.TryGetProperty(property.Name, out var value) ? value.GetRawText() : "(none)";
            if (now != property.Value.GetRawText()) changed.Add($"{property.Name} {property.Value.GetRawText()} then, {now} now");
        }
        return changed;
    }
}
