using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Tests.Work;

/// <summary>The unit file format keeps values bit for bit and refuses any file that is not a whole, unedited unit of the run.</summary>
public sealed class WorkUnitCodecTests
{
    private static readonly byte[] Identity = Enumerable.Range(0, 32).Select(i => (byte)i).ToArray();
    private static readonly WorkUnit Repeat3 = new(WorkUnitKind.Repeat, 3);

    private static RepeatUnitResult SampleRepeat()
    {
        var row = new RepeatImportances(1, 4, 2);
        double[] awkward = [0.1, -0.0, double.Epsilon, 1e308];
        awkward.CopyTo(row.Corrected, 0);
        new[] { double.NaN, 2.5, -3.25, 0 }.CopyTo(row.Permutation, 0);
        new[] { 1.0, 2, 3, 4 }.CopyTo(row.Impurity, 0);
        new[] { 1.5, 1.5, 3, 4 }.CopyTo(row.CombinedRank, 0);
        row.Selected[0] = true;
        row.DecoyCorrected[1] = -7.5;
        row.DecoySelected[1] = true;
        row.TrainingSampleCounts[0] = 37;
        return new RepeatUnitResult(row);
    }

    [Fact]
    public void A_repeat_round_trips_with_every_bit_kept()
    {
        var original = SampleRepeat();
        var bytes = WorkUnitCodec.Encode(Identity, Repeat3, original);
        var decoded = Assert.IsType<RepeatUnitResult>(WorkUnitCodec.Decode(bytes, Identity, Repeat3, 4, 2, out var problem));
        Assert.Null(problem);
        // Bit patterns, so -0.0 and NaN are compared exactly (IEEE 754 doubles, common practice).
        Assert.Equal(original.Row.Corrected.Select(BitConverter.DoubleToInt64Bits), decoded.Row.Corrected.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(original.Row.Permutation.Select(BitConverter.DoubleToInt64Bits), decoded.Row.Permutation.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(original.Row.CombinedRank, decoded.Row.CombinedRank);
        Assert.Equal(original.Row.Selected, decoded.Row.Selected);
        Assert.Equal(original.Row.DecoyCorrected, decoded.Row.DecoyCorrected);
        Assert.Equal(original.Row.DecoySelected, decoded.Row.DecoySelected);
        Assert.Equal(37, decoded.Row.TrainingSampleCounts[0]);
    }

    [Fact]
    public void An_inner_screen_round_trips()
    {
        var unit = new WorkUnit(WorkUnitKind.CurveFold, 2);
        var original = new InnerScreenResult([2, 0, 1], [0.5, -1, 3], [2, 0]);
        var decoded = Assert.IsType<InnerScreenResult>(WorkUnitCodec.Decode(WorkUnitCodec.Encode(Identity, unit, original), Identity, unit, 3, 0, out _));
        Assert.Equal(original.Order, decoded.Order);
        Assert.Equal(original.MeanCorrected, decoded.MeanCorrected);
        Assert.Equal(original.Shortlist, decoded.Shortlist);
    }

    [Fact]
    public void Every_truncation_and_every_single_byte_change_is_refused()
    {
        var bytes = WorkUnitCodec.Encode(Identity, Repeat3, SampleRepeat());
        for (int length = 0; length < bytes.Length; length++)
            Assert.Null(WorkUnitCodec.Decode(bytes.AsSpan(0, length), Identity, Repeat3, 4, 2, out _));
        for (int i = 0; i < bytes.Length; i++)
        {
            var changed = (byte[])bytes.Clone();
            changed[i] ^= 0x01;
            Assert.Null(WorkUnitCodec.Decode(changed, Identity, Repeat3, 4, 2, out var problem));
            Assert.False(string.IsNullOrEmpty(problem));
        }
    }

    [Fact]
    public void A_unit_of_another_run_or_another_index_or_shape_is_refused_with_the_reason()
    {
        var bytes = WorkUnitCodec.Encode(Identity, Repeat3, SampleRepeat());
        var otherRun = (byte[])Identity.Clone();
        otherRun[0] ^= 0xFF;
        Assert.Null(WorkUnitCodec.Decode(bytes, otherRun, Repeat3, 4, 2, out var reason));
        Assert.Contains("different run", reason);
        Assert.Null(WorkUnitCodec.Decode(bytes, Identity, new WorkUnit(WorkUnitKind.Repeat, 4), 4, 2, out reason));
        Assert.Contains("repeat-0003", reason);
        Assert.Null(WorkUnitCodec.Decode(bytes, Identity, Repeat3, 5, 2, out reason));
        Assert.Contains("number of features", reason);
    }
}
