using System.Buffers.Binary;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Writes a complete two-class panel in the plain binary layout the reference-library scripts in
/// reference/forest read (numpy's fromfile, R's readBin), so they see exactly our float32 values:
/// int32 sample count, int32 feature count, one int32 class code per sample, then every feature's
/// float32 values in sample order, all little-endian.
/// </summary>
public static class ReferencePanelFile
{
    public static void Write(Panel panel, string path)
    {
        ArgumentNullException.ThrowIfNull(panel);
        var matrix = panel.Matrix;
        int sampleCount = matrix.SampleCount, featureCount = matrix.FeatureCount;
        var buffer = new byte[4 * Math.Max(sampleCount, 2)];
        using var stream = new FileStream(path + ".tmp", FileMode.Create, FileAccess.Write);
        BinaryPrimitives.WriteInt32LittleEndian(buffer, sampleCount);
        BinaryPrimitives.WriteInt32LittleEndian(buffer.AsSpan(4), featureCount);
        stream.Write(buffer, 0, 8);
        var classes = panel.Outcome.SampleClasses;
        for (int s = 0; s < sampleCount; s++) BinaryPrimitives.WriteInt32LittleEndian(buffer.AsSpan(4 * s), classes[s]);
        stream.Write(buffer, 0, 4 * sampleCount);
        for (int f = 0; f < featureCount; f++)
        {
            if (matrix.HasUnmeasuredCells(f)) throw new ArgumentException("Reference panels must be complete.");
            var column = matrix.Column(f);
            for (int s = 0; s < sampleCount; s++) BinaryPrimitives.WriteSingleLittleEndian(buffer.AsSpan(4 * s), column[s]);
            stream.Write(buffer, 0, 4 * sampleCount);
        }
        stream.Close();
        File.Move(path + ".tmp", path, overwrite: true);
    }
}
