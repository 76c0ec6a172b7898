using OmicsScreen.Engine.Randomness;
using OmicsScreen.Engine.Trees;

namespace OmicsScreen.Engine.Tests.Trees;

public class SplitScannerTests
{
    /// <summary>
    /// The packed two-class scan (four cuts at a time) must choose exactly the split the double
    /// histogram's scan chooses: same threshold, routing and score bits, the first of tied
    /// candidates included. Small integer weights make exact ties common.
    /// </summary>
    [Theory]
    [InlineData(1UL, 40, 30, 1)]
    [InlineData(2UL, 300, 200, 1)]
    [InlineData(3UL, 500, 254, 5)]
    [InlineData(4UL, 25, 12, 2)]
    [InlineData(5UL, 1000, 60, 20)]
    [InlineData(6UL, 9, 254, 1)]
    public void Packed_scan_chooses_the_split_of_the_double_scan(ulong seed, int rowCount, int valueBinCount, int minLeafSize)
    {
        var generator = new Xoshiro256StarStar(seed);
        for (int trial = 0; trial < 50; trial++)
        {
            const int sampleCount = 2000;
            var codes = new byte[sampleCount];
            double unmeasured = trial % 3 == 0 ? 0 : 0.1;
            for (int s = 0; s < sampleCount; s++)
            {
                double u = generator.NextDouble();
                codes[s] = (byte)(u < unmeasured / 2 ? valueBinCount : u < unmeasured ? valueBinCount + 1 : generator.NextInt(valueBinCount));
            }
            var rows = new int[rowCount];
            var classes = new int[rowCount];
            var weights = new double[rowCount];
            var increments = new ulong[rowCount];
            var totals = new double[3];
            for (int i = 0; i < rowCount; i++)
            {
                rows[i] = generator.NextInt(sampleCount);
                classes[i] = generator.NextInt(2);
                weights[i] = 1 + generator.NextInt(3);
                increments[i] = PackedBinaryHistogram.Increment(classes[i], (ulong)weights[i]);
                totals[classes[i]] += weights[i];
            }
            totals[2] = rowCount;

            var plain = new NodeHistogram(2, 256);
            plain.Fill(codes, rows, classes, weights, valueBinCount);
            var packed = new PackedBinaryHistogram();
            packed.Fill(codes, rows, increments, valueBinCount);
            var scanner = new SplitScanner(2);
            var expected = SplitCandidate.None;
            var actual = SplitCandidate.None;
            scanner.Scan(plain, 7, valueBinCount, totals, minLeafSize, ref expected);
            scanner.ScanPacked(packed, 7, valueBinCount, totals, minLeafSize, ref actual);

            Assert.Equal(expected.Feature, actual.Feature);
            Assert.Equal(expected.BinThreshold, actual.BinThreshold);
            Assert.Equal(expected.Routing, actual.Routing);
            Assert.Equal(BitConverter.DoubleToInt64Bits(expected.Score), BitConverter.DoubleToInt64Bits(actual.Score));
            Assert.Equal(expected.LeftRowCount, actual.LeftRowCount);
        }
    }
}
