using OmicsScreen.Screening.Statistics;
using MathNetStatistics = MathNet.Numerics.Statistics.Statistics;

namespace OmicsScreen.Screening.Tests.Statistics;

public class SampleMomentsTests
{
    private static readonly double[] Sample = [0.31, -1.2, 4.75, 2.5, 0.0, 9.125, -3.5];

    [Fact]
    public void Mean_and_sd_match_mathnet()
    {
        // Reference library: MathNet.Numerics 5.0.0 Statistics.Mean and Statistics.StandardDeviation
        // (the sample SD, divisor n - 1).
        var (mean, sd) = SampleMoments.Of(Sample);
        Assert.Equal(MathNetStatistics.Mean(Sample), mean, 12);
        Assert.Equal(MathNetStatistics.StandardDeviation(Sample), sd, 12);
    }

    [Fact]
    public void Sd_of_a_worked_example()
    {
        // Worked example, common practice: 2, 4, 4, 4, 5, 5, 7, 9 has mean 5 and squared deviations
        // summing to 32, so the sample SD is sqrt(32 / 7).
        var (mean, sd) = SampleMoments.Of([2.0, 4, 4, 4, 5, 5, 7, 9]);
        Assert.Equal(5, mean);
        Assert.Equal(Math.Sqrt(32.0 / 7), sd, 14);
    }

    [Fact]
    public void A_column_of_a_row_major_matrix_equals_the_column_copied_out()
    {
        const int columnCount = 3;
        var matrix = new double[Sample.Length * columnCount];
        for (int row = 0; row < Sample.Length; row++)
            for (int column = 0; column < columnCount; column++)
                matrix[row * columnCount + column] = column == 1 ? Sample[row] : 1000 * (column + 1) + row;
        // Bit for bit: the summaries are views of the kept matrix, read in the same order.
        Assert.Equal(SampleMoments.Of(Sample), SampleMoments.OfColumn(matrix, columnCount, 1));
    }

    [Fact]
    public void A_skipped_row_is_left_out_of_both_moments()
    {
        var rectangular = new double[Sample.Length, 2];
        for (int row = 0; row < Sample.Length; row++)
        {
            rectangular[row, 0] = -row;
            rectangular[row, 1] = Sample[row];
        }
        double[] withoutThird = [.. Sample[..2], .. Sample[3..]];
        Assert.Equal(SampleMoments.Of(withoutThird), SampleMoments.OfColumn(rectangular, 1, skippedRow: 2));
        Assert.Equal(SampleMoments.Of(Sample), SampleMoments.OfColumn(rectangular, 1));
    }

    [Fact]
    public void Too_few_values_give_nan_rather_than_a_number()
    {
        Assert.True(double.IsNaN(SampleMoments.Of([]).Mean));
        var (mean, sd) = SampleMoments.Of([2.5]);
        Assert.Equal(2.5, mean);
        Assert.True(double.IsNaN(sd));
        var (skippedMean, skippedSd) = SampleMoments.OfColumn(new double[,] { { 1 } }, 0, skippedRow: 0);
        Assert.True(double.IsNaN(skippedMean));
        Assert.True(double.IsNaN(skippedSd));
    }

    [Fact]
    public void A_matrix_of_partial_rows_is_refused()
    {
        Assert.Throws<ArgumentException>(() => SampleMoments.OfColumn(new double[7], 3, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => SampleMoments.OfColumn(new double[6], 3, 3));
    }
}
