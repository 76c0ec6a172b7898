using System.Security.Cryptography;
using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Nodes;
using OmicsScreen.Data;
using OmicsScreen.Data.Output;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// The envelope of the locked-panel file (see FORMAT.md beside this file): format name,
/// version and the SHA-256 of the content's canonical text, around the content itself. The
/// envelope knows nothing of what the content means; <see cref="LockedPanelFile"/> encodes and
/// decodes it.
/// </summary>
/// <remarks>
/// The canonical text is the content written compactly (no whitespace, properties in file
/// order, numbers exactly as written, strings escaped as this writer escapes them). A reader
/// that re-parses and re-writes the content gets the same text back, so any change to a value,
/// or a file cut short, shows up as a checksum mismatch.
/// </remarks>
public static class LockedPanelEnvelope
{
    public const string FormatName = "omicsscreen-locked-panel";
    /// <summary>The version of class panels' files, unchanged since the first.</summary>
    public const int FormatVersion = 1;

    /// <summary>
    /// The version of measured and time-to-event panels' files: a reader of version 1 would take
    /// their content for a class panel, so they carry a version it refuses by name. The newest
    /// version this reader reads.
    /// </summary>
    public const int OutcomeKindsVersion = 2;

    private const string ChecksumMismatch = "checksum does not match: the file was changed or truncated.";
    private const string ChecksumFix = "Restore the file as it was written, or lock the panel again from the discovery results.";

    private static readonly JsonSerializerOptions Canonical = new()
    {
        WriteIndented = false,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    private static readonly JsonWriterOptions Indented = new()
    {
        Indented = true,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    /// <summary>Writes the envelope and content atomically; the content node is copied, not taken over.</summary>
    /// <param name="version">The format version the content needs: <see cref="FormatVersion"/> for classes, <see cref="OutcomeKindsVersion"/> for the other kinds.</param>
    public static void Write(string path, JsonObject content, int version = FormatVersion)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(content);
        var copy = content.DeepClone().AsObject();
        var envelope = new JsonObject
        {
            ["format"] = FormatName,
            ["version"] = version,
            ["content_sha256"] = Checksum(copy),
            ["content"] = copy,
        };
        AtomicFile.Write(path, stream =>
        {
            using var writer = new Utf8JsonWriter(stream, Indented);
            envelope.WriteTo(writer);
            writer.Flush();
            stream.WriteByte((byte)'\n');
        });
    }

    /// <summary>
    /// Reads and checks the envelope, then decodes the content; every problem, including an
    /// <see cref="InvalidDataException"/> or <see cref="ArgumentException"/> from the decoder,
    /// becomes a <see cref="PanelInputException"/> naming the file.
    /// </summary>
    public static T Read<T>(string path, Func<JsonObject, T> decode)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(decode);
        var content = Read(path);
        try
        {
            return decode(content);
        }
        catch (Exception e) when (e is InvalidDataException or ArgumentException or FormatException or InvalidOperationException)
        {
            throw PanelInputException.At(path, null, null, $"the locked panel is not valid: {e.Message}",
                "The file may come from a faulty writer; lock the panel again from the discovery results.", e);
        }
    }

    /// <summary>Reads and checks the envelope and returns the content, undecoded.</summary>
    public static JsonObject Read(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (!File.Exists(path))
            throw PanelInputException.At(path, null, null, "does not exist.", "Check the path of the locked panel file.");
        string text = File.ReadAllText(path, Encoding.UTF8);
        JsonNode? root;
        try
        {
            root = JsonNode.Parse(text, documentOptions: new JsonDocumentOptions { MaxDepth = 16 });
        }
        catch (JsonException e)
        {
            // A file that starts as ours but does not parse was cut short or edited by hand.
            if (LooksLikeOurs(text))
                throw PanelInputException.At(path, e.LineNumber + 1, null, $"{ChecksumMismatch} It is not complete JSON.", ChecksumFix, e);
            throw PanelInputException.At(path, null, null, "is not a locked panel file: it is not JSON.",
                "Give the locked_panel.json of a screen's results folder.", e);
        }
        try
        {
            // A name given twice would otherwise surface as a crash when the object is first read.
            using var strict = JsonDocument.Parse(text, new JsonDocumentOptions { MaxDepth = 16, AllowDuplicateProperties = false });
        }
        catch (JsonException e)
        {
            throw PanelInputException.At(path, e.LineNumber + 1, null,
                "is not a valid locked panel file: a property name appears twice in one object, so which value holds is ambiguous (the file was edited or written by another program).",
                "Lock the panel again from the discovery results instead of editing the file.", e);
        }
        if (root is not JsonObject envelope || !TryGetString(envelope, "format", out var format))
            throw PanelInputException.At(path, null, null, $"is not a locked panel file: it has no \"format\": \"{FormatName}\" header.",
                "Give the locked_panel.json of a screen's results folder.");
        if (format != FormatName)
            throw PanelInputException.At(path, null, null, $"is not a locked panel file: its format is '{format}', not '{FormatName}'.",
                "Give the locked_panel.json of a screen's results folder.");
        if (envelope["version"] is not JsonValue versionValue || !versionValue.TryGetValue(out int version) || version < 1)
            throw PanelInputException.At(path, null, null, "has no valid format version.", ChecksumFix);
        if (version > OutcomeKindsVersion)
            throw PanelInputException.At(path, null, null,
                FormattableString.Invariant($"has format version {version}, which this version of OmicsScreen cannot read (it reads versions up to {OutcomeKindsVersion})."),
                "Use the OmicsScreen version that wrote it, or a newer one.");
        if (envelope["content"] is not JsonObject content || !TryGetString(envelope, "content_sha256", out var expected))
            throw PanelInputException.At(path, null, null, ChecksumMismatch, ChecksumFix);
        if (!string.Equals(Checksum(content), expected, StringComparison.OrdinalIgnoreCase))
            throw PanelInputException.At(path, null, null, ChecksumMismatch, ChecksumFix);
        return content;
    }

    /// <summary>SHA-256 (lower-case hex) of the content's canonical text.</summary>
    public static string Checksum(JsonObject content)
    {
        ArgumentNullException.ThrowIfNull(content);
        var canonical = Encoding.UTF8.GetBytes(content.ToJsonString(Canonical));
        return Convert.ToHexStringLower(SHA256.HashData(canonical));
    }

    private static bool TryGetString(JsonObject envelope, string name, out string value)
    {
        value = "";
        if (envelope[name] is JsonValue node && node.TryGetValue(out string? text) && text is not null)
        {
            value = text;
            return true;
        }
        return false;
    }

    private static bool LooksLikeOurs(string text)
    {
        var head = text.AsSpan(0, Math.Min(text.Length, 512));
        return head.Contains($"\"{FormatName}\"".AsSpan(), StringComparison.Ordinal);
    }
}
