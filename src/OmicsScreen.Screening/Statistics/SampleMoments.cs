using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace OmicsScreen.Screening.Statistics;

/// <summary>
/// Mean and sample standard deviation (divisor n - 1) of a sample, or of one column of a row-major
/// matrix (repeats x features, folds x panel sizes) read in place, so summaries stay views of the
/// kept matrices.
/// </summary>
/// <remarks>
/// Plain two-pass: the sum in row order, then the squared deviations from that mean in row order.
/// The screen's tables were written with exactly these sums, so they stay byte-identical; the
/// corrected two-pass of <see cref="WelchTest"/> would move their last digits.
/// </remarks>
public static class SampleMoments
{
    /// <summary>Mean and sample SD of <paramref name="values"/>; the mean is NaN for an empty sample, the SD NaN below two values.</summary>
    public static (double Mean, double StandardDeviation) Of(ReadOnlySpan<double> values) =>
        OfColumn(values, columnCount: 1, column: 0);

    /// <summary>
    /// Mean and sample SD of column <paramref name="column"/> of a row-major matrix with
    /// <paramref name="columnCount"/> columns, leaving out row <paramref name="skippedRow"/>
    /// (-1 for none); the mean is NaN when no row is used, the SD NaN below two rows.
    /// </summary>
    public static (double Mean, double StandardDeviation) OfColumn(ReadOnlySpan<double> rowMajor, int columnCount, int column, int skippedRow = -1)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(columnCount);
        if ((uint)column >= (uint)columnCount) throw new ArgumentOutOfRangeException(nameof(column));
        if (rowMajor.Length % columnCount != 0)
            throw new ArgumentException("The matrix must hold whole rows of the given column count.", nameof(rowMajor));
        int rowCount = rowMajor.Length / columnCount;
        double sum = 0;
        int used = 0;
        for (int row = 0; row < rowCount; row++)
        {
            if (row == skippedRow) continue;
            sum += rowMajor[row * columnCount + column];
            used++;
        }
        double mean = sum / used; // 0 / 0 = NaN when no row is used
        if (used < 2) return (mean, double.NaN);
        double squares = 0;
        for (int row = 0; row < rowCount; row++)
        {
            if (row == skippedRow) continue;
            double deviation = rowMajor[row * columnCount + column] - mean;
            squares += deviation * deviation;
        }
        return (mean, Math.Sqrt(squares / (used - 1)));
    }

    /// <summary>The same for a rectangular array (rows first, as .NET stores it).</summary>
    public static (double Mean, double StandardDeviation) OfColumn(double[,] matrix, int column, int skippedRow = -1)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int columnCount = matrix.GetLength(1);
        if (columnCount == 0) throw new ArgumentOutOfRangeException(nameof(column));
        // A rectangular array's elements are contiguous in row-major order, so it reads as one span.
        var rowMajor = MemoryMarshal.CreateReadOnlySpan(
            ref Unsafe.As<byte, double>(ref MemoryMarshal.GetArrayDataReference(matrix)), matrix.Length);
        return OfColumn(rowMajor, columnCount, column, skippedRow);
    }
}
