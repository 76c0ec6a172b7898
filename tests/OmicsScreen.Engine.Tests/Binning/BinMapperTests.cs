using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Binning;

public class BinMapperTests
{
    private static FeatureMatrix Matrix(params float[][] columns)
    {
        var names = Enumerable.Range(0, columns.Length).Select(i => $"f{i}").ToArray();
        var ids = Enumerable.Range(0, columns[0].Length).Select(i => $"s{i}").ToArray();
        return new FeatureMatrix(names, ids, columns, new CellState[]?[columns.Length]);
    }

    [Fact]
    public void Few_distinct_values_get_one_exact_bin_each_in_value_order()
    {
        var binned = new BinMapper().Bin(Matrix([3f, 1f, 2f, 3f, 1f, 10f]));
        var bins = binned.Bins(0);
        Assert.True(bins.IsExact);
        Assert.Equal(4, bins.ValueBinCount);
        Assert.Equal(new byte[] { 2, 0, 1, 2, 0, 3 }, binned.Codes(0).ToArray());
        // Thresholds are midpoints between adjacent distinct values (common practice in CART).
        Assert.Equal([1.5f, 2.5f, 6.5f, float.PositiveInfinity], bins.UpperBounds.ToArray());
    }

    [Fact]
    public void Many_distinct_values_get_quantile_bins_that_keep_order_and_agree_with_bounds()
    {
        var generator = new Engine.Randomness.Xoshiro256StarStar(3);
        var values = new float[5000];
        for (int i = 0; i < values.Length; i++) values[i] = (float)Math.Exp(generator.NextGaussian());
        for (int i = 0; i < 500; i++) values[i] = 1f; // a heavy tie
        var binned = new BinMapper().Bin(Matrix(values));
        var bins = binned.Bins(0);
        Assert.False(bins.IsExact);
        Assert.InRange(bins.ValueBinCount, 100, BinMapper.MaxValueBins);
        var codes = binned.Codes(0);
        var counts = new int[bins.ValueBinCount];
        for (int i = 0; i < values.Length; i++)
        {
            int code = codes[i];
            counts[code]++;
            Assert.True(values[i] <= bins.UpperBound(code));
            if (code > 0) Assert.True(values[i] > bins.UpperBound(code - 1));
        }
        // Quantile bins: apart from the tie's bin, none holds much more than its share n/B.
        Assert.True(counts.Count(c => c > 3 * values.Length / BinMapper.MaxValueBins) <= 1);
    }

    [Fact]
    public void Missing_and_below_detection_cells_get_their_own_codes()
    {
        var builder = new FeatureMatrixBuilder(["f"], ["a", "b", "c", "d"]);
        builder.SetMeasured(0, 0, 2f);
        builder.SetMissing(0, 1);
        builder.SetBelowDetection(0, 2, 0.1f);
        builder.SetMeasured(0, 3, 5f);
        var binned = new BinMapper().Bin(builder.Build());
        var bins = binned.Bins(0);
        Assert.Equal(2, bins.ValueBinCount);
        Assert.Equal(new byte[] { 0, bins.MissingCode, bins.BelowDetectionCode, 1 }, binned.Codes(0).ToArray());
    }

    [Fact]
    public void A_bound_between_adjacent_floats_stays_below_the_upper_value()
    {
        float lower = 1f, upper = MathF.BitIncrement(1f);
        float bound = BinMapper.Midpoint(lower, upper);
        Assert.True(lower <= bound && bound < upper);
        Assert.Equal(1f, BinMapper.Midpoint(1f, float.PositiveInfinity));
    }

    [Fact]
    public void Permuted_copy_columns_are_seeded_permutations_of_their_source_codes()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 300, FeatureCount = 6 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var withCopies = binned.WithPermutedCopies([1, 4], runSeed: 9, repeat: 0);
        Assert.Equal(8, withCopies.FeatureCount);
        Assert.True(withCopies.IsPermutedCopy(7) && !withCopies.IsPermutedCopy(4));
        Assert.Equal(4, withCopies.SourceFeature(7));
        Assert.Equal("copy:" + binned.FeatureNames[4], withCopies.FeatureNames[7]);
        var source = binned.Codes(4).ToArray();
        var permutedCopy = withCopies.Codes(7).ToArray();
        Assert.Equal(source.Order(), permutedCopy.Order());
        Assert.NotEqual(source, permutedCopy);
        Assert.Equal(permutedCopy, binned.WithPermutedCopies([1, 4], 9, 0).Codes(7).ToArray());
        Assert.NotEqual(permutedCopy, binned.WithPermutedCopies([1, 4], 10, 0).Codes(7).ToArray());
    }

    [Fact]
    public void Permuted_copy_columns_are_the_same_whatever_the_thread_count()
    {
        // More columns than one building chunk (256), so several threads share the work.
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 60, FeatureCount = 700 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var all = Enumerable.Range(0, binned.FeatureCount).ToArray();
        var one = binned.WithPermutedCopies(all, runSeed: 3, repeat: 2, threadCount: 1);
        var four = binned.WithPermutedCopies(all, runSeed: 3, repeat: 2, threadCount: 4);
        Assert.Equal(one.FeatureNames, four.FeatureNames);
        for (int f = 0; f < one.FeatureCount; f++)
        {
            Assert.True(one.Codes(f).SequenceEqual(four.Codes(f)), $"column {f} differs");
            Assert.Equal(one.SourceFeature(f), four.SourceFeature(f));
        }
    }

    [Fact]
    public void Selecting_features_keeps_codes_bins_and_the_source_index()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 50, FeatureCount = 5 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var picked = binned.SelectFeatures([3, 0]);
        Assert.Equal(binned.Codes(3).ToArray(), picked.Codes(0).ToArray());
        Assert.Same(binned.Bins(0), picked.Bins(1));
        Assert.Equal(3, picked.SourceFeature(0));
        Assert.Equal([binned.FeatureNames[3], binned.FeatureNames[0]], picked.FeatureNames);
    }

    [Fact]
    public void Placing_two_matrices_side_by_side_keeps_each_column_and_numbers_the_second_after_the_first()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 50, FeatureCount = 5 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var left = binned.SelectFeatures([4, 1]);
        var right = binned.SelectFeatures([2]);
        var both = left.Beside(right);
        Assert.Equal([binned.FeatureNames[4], binned.FeatureNames[1], binned.FeatureNames[2]], both.FeatureNames);
        Assert.Equal(binned.Codes(2).ToArray(), both.Codes(2).ToArray());
        Assert.Same(binned.Bins(1), both.Bins(1));
        Assert.Equal([4, 1, 2 + 2], new[] { both.SourceFeature(0), both.SourceFeature(1), both.SourceFeature(2) });
        Assert.Throws<ArgumentException>(() => left.Beside(new BinMapper().Bin(panel.Matrix.SelectSamples([0, 1, 2]))));
    }

    [Fact]
    public void Encoding_the_training_matrix_reproduces_its_codes()
    {
        var panel = SyntheticPanel.Generate(new SyntheticPanelSpec { SampleCount = 400, FeatureCount = 4, MissingFraction = 0.1 });
        var binned = new BinMapper().Bin(panel.Matrix);
        var encoded = binned.Encode(panel.Matrix);
        for (int f = 0; f < binned.FeatureCount; f++) Assert.Equal(binned.Codes(f).ToArray(), encoded.Codes(f).ToArray());
    }

    [Theory]
    [InlineData(300, 4, 0.0)]    // few distinct values: exact bins, many ties
    [InlineData(600, 1000, 0.1)] // many distinct values: quantile bins, with unmeasured cells
    [InlineData(600, 100_000, 0.3)]
    public void Codes_read_from_the_sorted_walk_equal_a_bound_search_of_every_cell(int sampleCount, int levels, double unmeasured)
    {
        // The plain definition (FeatureBins.CodeOf: the first bin whose upper bound is at least the
        // value, reserved codes for unmeasured cells) is the reference the sorted walk must match.
        var generator = new Engine.Randomness.Xoshiro256StarStar((ulong)levels);
        var builder = new FeatureMatrixBuilder(["a", "b", "c"], Enumerable.Range(0, sampleCount).Select(s => $"s{s}").ToArray());
        for (int f = 0; f < 3; f++)
            for (int s = 0; s < sampleCount; s++)
            {
                double u = generator.NextDouble();
                if (u < unmeasured / 3) builder.SetMissing(f, s);
                else if (u < 2 * unmeasured / 3) builder.SetBelowDetection(f, s, 0.5f);
                else if (u < unmeasured) builder.SetMeasured(f, s, float.NaN);
                else builder.SetMeasured(f, s, generator.NextInt(levels) * (f == 2 ? -0.25f : 1.5f));
            }
        var matrix = builder.Build();
        var binned = new BinMapper().Bin(matrix, threadCount: 2);
        for (int f = 0; f < 3; f++)
        {
            var bins = binned.Bins(f);
            for (int s = 0; s < sampleCount; s++)
                Assert.Equal(bins.CodeOf(matrix.Value(f, s), matrix.State(f, s)), binned.Codes(f)[s]);
        }
    }
    [Theory]
    [InlineData(1, 0.0)]
    [InlineData(7, 0.0)]
    [InlineData(200, 0.0)]   // a wide panel's column: exact bins
    [InlineData(254, 0.2)]   // exactly the most exact bins, with unmeasured cells
    [InlineData(1000, 0.0)]  // quantile bins
    [InlineData(4000, 0.15)]
    public void Bounds_and_codes_equal_the_plain_binning_of_sort_and_search(int sampleCount, double unmeasured)
    {
        // ReferenceBinning is the engine's first binning, written for clarity: a comparison sort of
        // each column and a binary search per cell. Columns mix log-normal values, negatives, zeros of
        // both signs, heavy ties, infinities and few-level columns, so both exact and quantile bins,
        // and the switch between them at 254 distinct values, are exercised.
        var generator = new Engine.Randomness.Xoshiro256StarStar((ulong)sampleCount);
        const int featureCount = 150; // more than two binning chunks of 64 features
        var builder = new FeatureMatrixBuilder(
            Enumerable.Range(0, featureCount).Select(f => $"f{f}").ToArray(),
            Enumerable.Range(0, sampleCount).Select(s => $"s{s}").ToArray());
        for (int f = 0; f < featureCount; f++)
        {
            // Few-level columns, among them 254 and 255 levels: either side of the last exact binning.
            int levels = (f % 10) switch { 0 => 1, 2 => 3, 4 => 254, 6 => 255, 8 => 40, _ => int.MaxValue };
            for (int s = 0; s < sampleCount; s++)
            {
                double u = generator.NextDouble();
                if (u < unmeasured / 3) builder.SetMissing(f, s);
                else if (u < 2 * unmeasured / 3) builder.SetBelowDetection(f, s, 0.5f);
                else if (u < unmeasured) builder.SetMeasured(f, s, float.NaN);
                else if (levels != int.MaxValue) builder.SetMeasured(f, s, generator.NextInt(levels) - 3);
                else builder.SetMeasured(f, s, (generator.NextDouble() * 1.2) switch
                {
                    < 0.05 => 0f,
                    < 0.08 => -0f,
                    < 0.15 => 2.5f,
                    < 0.16 => float.PositiveInfinity,
                    < 0.17 => float.NegativeInfinity,
                    < 0.30 => -(float)Math.Exp(3 * generator.NextGaussian()),
                    _ => (float)Math.Exp(generator.NextGaussian()),
                });
            }
        }
        var matrix = builder.Build();
        var (referenceCodes, referenceBins) = ReferenceBinning.Bin(matrix);
        var binned = new BinMapper().Bin(matrix, threadCount: 2);
        for (int f = 0; f < featureCount; f++)
        {
            var bins = binned.Bins(f);
            Assert.Equal(referenceBins[f].IsExact, bins.IsExact);
            // Float equality: -0 and +0 are one bound (the reference's comparison sort orders them arbitrarily).
            Assert.Equal(referenceBins[f].UpperBounds.ToArray(), bins.UpperBounds.ToArray());
            Assert.True(referenceCodes[f].AsSpan().SequenceEqual(binned.Codes(f)), $"codes of feature {f} differ");
        }
    }
}
