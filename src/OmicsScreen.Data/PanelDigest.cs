using System.Buffers.Binary;
using System.Runtime.InteropServices;
using System.Security.Cryptography;
using System.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data;

/// <summary>
/// A SHA-256 of what a screen sees of a panel: names, values (as their float bits), cell states,
/// outcome (classes, measured values, or follow-up times and events), cohorts and subjects. Two loads give the same digest exactly when the screen would
/// compute the same thing from them, whatever file format or layout they came from.
/// </summary>
public static class PanelDigest
{
    public static byte[] Compute(Panel panel)
    {
        ArgumentNullException.ThrowIfNull(panel);
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var matrix = panel.Matrix;
        AppendNames(hash, "features", matrix.FeatureNames);
        AppendNames(hash, "samples", matrix.SampleIds);
        for (int f = 0; f < matrix.FeatureCount; f++)
        {
            hash.AppendData(MemoryMarshal.AsBytes(matrix.Column(f)));
            if (matrix.HasUnmeasuredCells(f)) hash.AppendData(MemoryMarshal.AsBytes(matrix.States(f)));
            else AppendInt(hash, -1);
        }
        switch (panel.Kind)
        {
            case OutcomeKind.Measured:
                // A distinct role text, so a measured outcome never hashes like a class one.
                AppendText(hash, "measured outcome " + panel.Measured!.ColumnName);
                hash.AppendData(MemoryMarshal.AsBytes(panel.Measured.Values));
                break;
            case OutcomeKind.TimeToEvent:
                var followUp = panel.FollowUp!;
                AppendText(hash, "follow-up " + followUp.TimeColumn + " event " + followUp.EventColumn);
                hash.AppendData(MemoryMarshal.AsBytes(followUp.Times));
                hash.AppendData(MemoryMarshal.AsBytes(followUp.Events));
                break;
            default:
                // Unchanged for classes, so digests of class panels (and their checkpoints) stay valid.
                var outcome = panel.Outcome;
                AppendNames(hash, "outcome " + outcome.ColumnName, outcome.ClassNames);
                hash.AppendData(MemoryMarshal.AsBytes(outcome.SampleClasses));
                AppendInt(hash, outcome.PositiveClass);
                break;
        }
        AppendGrouping(hash, "cohort", panel.Cohort);
        AppendGrouping(hash, "subject", panel.Subject);
        return hash.GetHashAndReset();
    }

    private static void AppendGrouping(IncrementalHash hash, string role, SampleGrouping? grouping)
    {
        if (grouping is null)
        {
            AppendText(hash, "no " + role);
            return;
        }
        AppendNames(hash, role + " " + grouping.ColumnName, grouping.LevelNames);
        hash.AppendData(MemoryMarshal.AsBytes(grouping.SampleLevels));
    }

    /// <summary>Each name with its length in front, so no two different lists hash alike.</summary>
    private static void AppendNames(IncrementalHash hash, string role, IReadOnlyList<string> names)
    {
        AppendText(hash, role);
        AppendInt(hash, names.Count);
        foreach (var name in names) AppendText(hash, name);
    }

    private static void AppendText(IncrementalHash hash, string text)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        AppendInt(hash, bytes.Length);
        hash.AppendData(bytes);
    }

    private static void AppendInt(IncrementalHash hash, int value)
    {
        Span<byte> bytes = stackalloc byte[4];
        BinaryPrimitives.WriteInt32LittleEndian(bytes, value);
        hash.AppendData(bytes);
    }
}
