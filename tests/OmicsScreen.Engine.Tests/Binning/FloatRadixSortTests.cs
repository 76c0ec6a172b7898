using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.Engine.Tests.Binning;

public class FloatRadixSortTests
{
    [Theory]
    [InlineData(0, 1UL)]
    [InlineData(1, 2UL)]
    [InlineData(7, 3UL)]
    [InlineData(200, 4UL)]
    [InlineData(5000, 5UL)]
    public void Sorts_like_a_comparison_sort_and_keeps_each_sample_with_its_value(int count, ulong seed)
    {
        var generator = new Xoshiro256StarStar(seed);
        var values = new float[count];
        for (int i = 0; i < count; i++)
        {
            double u = generator.NextDouble();
            // Log-normal abundances, negatives, zeros of both signs, ties, tiny and infinite values.
            values[i] = u switch
            {
                < 0.05 => 0f,
                < 0.07 => -0f,
                < 0.10 => 3.5f,
                < 0.12 => float.PositiveInfinity,
                < 0.13 => float.NegativeInfinity,
                < 0.15 => float.Epsilon * (1 + generator.NextInt(5)),
                < 0.30 => -(float)Math.Exp(10 * generator.NextDouble() - 5),
                _ => (float)Math.Exp(20 * generator.NextDouble() - 5),
            };
        }
        var samples = Enumerable.Range(0, count).ToArray();
        var sorted = (float[])values.Clone();
        new FloatRadixSort(count).Sort(sorted, samples);

        var expected = (float[])values.Clone();
        Array.Sort(expected);
        // Numeric order (common practice: IEEE 754 total order on non-NaN floats, -0 == +0).
        Assert.Equal(expected, sorted);
        Assert.Equal(Enumerable.Range(0, count), samples.Order());
        for (int i = 0; i < count; i++) Assert.Equal(BitConverter.SingleToInt32Bits(values[samples[i]]), BitConverter.SingleToInt32Bits(sorted[i]));
    }

    [Fact]
    public void A_column_sorted_in_parts_reuses_the_buffers()
    {
        var sorter = new FloatRadixSort(10);
        var first = new float[] { 5, 1, 4 };
        var firstSamples = new[] { 0, 1, 2 };
        sorter.Sort(first, firstSamples);
        var second = new float[] { -2, 9, -7, 0, 1 };
        var secondSamples = new[] { 0, 1, 2, 3, 4 };
        sorter.Sort(second, secondSamples);
        Assert.Equal(new float[] { 1, 4, 5 }, first);
        Assert.Equal(new[] { 1, 2, 0 }, firstSamples);
        Assert.Equal(new float[] { -7, -2, 0, 1, 9 }, second);
        Assert.Equal(new[] { 2, 0, 3, 4, 1 }, secondSamples);
    }
}
