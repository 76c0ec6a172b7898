using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Tests.Trees;

public class NodeHistogramTests
{
    [Theory]
    [InlineData(2, 5, 200)]
    [InlineData(2, 300, 200)]
    [InlineData(3, 40, 254)]
    [InlineData(4, 1000, 30)]
    public void Dense_sparse_and_naive_counting_agree(int classCount, int rowCount, int valueBinCount)
    {
        var generator = new Xoshiro256StarStar((ulong)(rowCount + valueBinCount));
        const int sampleCount = 2000;
        var codes = new byte[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            double u = generator.NextDouble();
            codes[s] = (byte)(u < 0.05 ? valueBinCount : u < 0.08 ? valueBinCount + 1 : generator.NextInt(valueBinCount));
        }
        var rows = new int[rowCount];
        var classes = new int[rowCount];
        var weights = new double[rowCount];
        for (int i = 0; i < rowCount; i++)
        {
            rows[i] = generator.NextInt(sampleCount);
            classes[i] = generator.NextInt(classCount);
            weights[i] = 1 + generator.NextInt(3);
        }
        // Naive count: one pass over the rows into a plain array indexed by code.
        var expected = new double[(valueBinCount + 2) * (classCount + 1)];
        for (int i = 0; i < rowCount; i++)
        {
            expected[codes[rows[i]] * (classCount + 1) + classes[i]] += weights[i];
            expected[codes[rows[i]] * (classCount + 1) + classCount] += 1;
        }
        var expectedCodes = Enumerable.Range(0, valueBinCount).Where(c => expected[c * (classCount + 1) + classCount] > 0).ToArray();

        var histogram = new NodeHistogram(classCount, valueBinCount + 2);
        foreach (var fill in new Action[]
        {
            () => histogram.Fill(codes, rows, classes, weights, valueBinCount),
            () => histogram.FillDense(codes, rows, classes, weights, valueBinCount),
            () => histogram.FillSparse(codes, rows, classes, weights, valueBinCount),
        })
        {
            // A different fill in between checks that stale entries of the previous fill are cleared.
            histogram.Fill(codes, rows.AsSpan(rowCount / 2), classes.AsSpan(rowCount / 2), weights.AsSpan(rowCount / 2), valueBinCount);
            fill();
            Assert.Equal(expectedCodes, histogram.ValueCodes.ToArray().Select(c => (int)c).ToArray());
            foreach (int code in expectedCodes.Append(valueBinCount).Append(valueBinCount + 1))
                Assert.Equal(expected.AsSpan(code * (classCount + 1), classCount + 1).ToArray(), histogram.Entry(code).ToArray());
        }
    }

    [Theory]
    [InlineData(5, 200)]
    [InlineData(300, 200)]
    [InlineData(1000, 30)]
    [InlineData(60, 254)]
    public void Packed_two_class_counts_equal_the_double_histogram(int rowCount, int valueBinCount)
    {
        var generator = new Xoshiro256StarStar((ulong)(7 * rowCount + valueBinCount));
        const int sampleCount = 2000;
        var codes = new byte[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            double u = generator.NextDouble();
            codes[s] = (byte)(u < 0.05 ? valueBinCount : u < 0.08 ? valueBinCount + 1 : generator.NextInt(valueBinCount));
        }
        var rows = new int[rowCount];
        var classes = new int[rowCount];
        var weights = new double[rowCount];
        var increments = new ulong[rowCount];
        for (int i = 0; i < rowCount; i++)
        {
            rows[i] = generator.NextInt(sampleCount);
            classes[i] = generator.NextInt(2);
            weights[i] = 1 + generator.NextInt(4); // bootstrap-like counts
            increments[i] = PackedBinaryHistogram.Increment(classes[i], (ulong)weights[i]);
        }
        var plain = new NodeHistogram(2, 256);
        plain.Fill(codes, rows, classes, weights, valueBinCount);
        var packed = new PackedBinaryHistogram();
        // A fill of other rows first: stale words of the previous fill must be cleared.
        packed.Fill(codes, rows.AsSpan(rowCount / 3), increments.AsSpan(rowCount / 3), valueBinCount);
        packed.Fill(codes, rows, increments, valueBinCount);

        Assert.Equal(plain.ValueCodes.ToArray(), packed.ValueCodes.ToArray());
        Assert.Equal(plain.IsConstant, packed.IsConstant);
        for (int code = 0; code < valueBinCount + 2; code++)
        {
            int listed = packed.ValueCodes.IndexOf((byte)code);
            ulong word = code == valueBinCount ? packed.Missing
                : code == valueBinCount + 1 ? packed.BelowDetection
                : listed >= 0 ? packed.ValueEntry(listed) : 0;
            Assert.Equal(plain.Entry(code).ToArray(),
                new[] { PackedBinaryHistogram.Class0(word), PackedBinaryHistogram.Class1(word), PackedBinaryHistogram.Rows(word) });
        }
    }

    [Fact]
    public void A_packed_field_holds_its_largest_sum_without_carrying()
    {
        ulong word = PackedBinaryHistogram.Increment(0, (ulong)PackedBinaryHistogram.MaxFieldValue - 1)
            + PackedBinaryHistogram.Increment(1, (ulong)PackedBinaryHistogram.MaxFieldValue - 1);
        Assert.Equal(PackedBinaryHistogram.MaxFieldValue - 1, PackedBinaryHistogram.Class0(word));
        Assert.Equal(PackedBinaryHistogram.MaxFieldValue - 1, PackedBinaryHistogram.Class1(word));
        Assert.Equal(2, PackedBinaryHistogram.Rows(word));
    }
}
