using System.Globalization;
using System.Numerics;
using OmicsScreen.Data.Text;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Columnar;

/// <summary>Decodes typed column values into feature cells, the same way for Parquet and Arrow.</summary>
internal static class ColumnCells
{
    /// <summary>
    /// A stored number as a cell: NaN is missing (as the NaN token is in text); infinities and
    /// doubles beyond float32 range are errors, exactly as their text forms are.
    /// </summary>
    public static CellKind FromNumber(double number, out float value)
    {
        value = (float)number;
        if (double.IsNaN(number)) return CellKind.Missing;
        return float.IsFinite(value) ? CellKind.Measured : CellKind.Infinite;
    }

    /// <summary>Stores one decoded cell; returns false (with the failure) for an input error.</summary>
    public static bool Store(int row, CellKind kind, float value, Span<float> values, Span<CellState> states,
        string? text, out CellFailure failure)
    {
        failure = default;
        switch (kind)
        {
            case CellKind.Measured:
                values[row] = value;
                states[row] = CellState.Measured;
                return true;
            case CellKind.Missing:
                values[row] = float.NaN;
                states[row] = CellState.Missing;
                return true;
            case CellKind.BelowDetection:
                values[row] = value;
                states[row] = CellState.BelowDetection;
                return true;
            default:
                failure = new CellFailure(row, text ?? value.ToString("R", CultureInfo.InvariantCulture), kind);
                return false;
        }
    }

    /// <summary>Decodes a run of numbers with a null mask (null mask empty when the column has no nulls).</summary>
    public static bool StoreNumbers<T>(ReadOnlySpan<T> numbers, Func<int, bool>? isNull, int firstRow,
        Span<float> values, Span<CellState> states, out CellFailure failure)
        where T : struct, INumberBase<T>
    {
        for (int i = 0; i < numbers.Length; i++)
        {
            int row = firstRow + i;
            CellKind kind;
            float value;
            if (isNull is not null && isNull(i))
            {
                kind = CellKind.Missing;
                value = float.NaN;
            }
            else
            {
                double number = double.CreateTruncating(numbers[i]);
                kind = FromNumber(number, out value);
                if (kind == CellKind.Infinite)
                {
                    failure = new CellFailure(row, number.ToString("R", CultureInfo.InvariantCulture), kind);
                    return false;
                }
            }
            Store(row, kind, value, values, states, null, out failure);
        }
        failure = default;
        return true;
    }

    /// <summary>Decodes a run of text cells by the token rules.</summary>
    public static bool StoreTexts(IReadOnlyList<string?> texts, int firstRow, Span<float> values, Span<CellState> states,
        ReadOnlySpan<bool> skipRows, out CellFailure failure)
    {
        for (int i = 0; i < texts.Count; i++)
        {
            int row = firstRow + i;
            if (!skipRows.IsEmpty && skipRows[row]) continue;
            string? text = texts[i];
            var kind = CellText.Classify(text, out float value);
            if (!Store(row, kind, value, values, states, text, out failure)) return false;
        }
        failure = default;
        return true;
    }

    /// <summary>A number as text, the same way for every format: invariant, shortest round-trip.</summary>
    public static string FormatNumber<T>(T number) where T : INumberBase<T>, IFormattable =>
        number.ToString(typeof(T) == typeof(float) || typeof(T) == typeof(double) ? "R" : null, CultureInfo.InvariantCulture);
}
