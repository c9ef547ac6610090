using System.Globalization;
using MathNet.Numerics.LinearAlgebra;

namespace Sibyl.Emulation;

/// <summary>Argument checks shared by the public entry points, so that every message names the offending value.</summary>
internal static class Arguments
{
    public static void RequireFinite(ReadOnlySpan<double> values, string name)
    {
        for (int i = 0; i < values.Length; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                throw new ArgumentException(
                    string.Create(CultureInfo.InvariantCulture, $"{name}[{i}] = {values[i]:R} is not finite."), name);
            }
        }
    }

    public static void RequireFinite(Matrix<double> matrix, string name)
    {
        for (int row = 0; row < matrix.RowCount; row++)
        {
            for (int column = 0; column < matrix.ColumnCount; column++)
            {
                double value = matrix[row, column];
                if (!double.IsFinite(value))
                {
                    throw new ArgumentException(
                        string.Create(CultureInfo.InvariantCulture, $"{name}[{row}, {column}] = {value:R} is not finite."), name);
                }
            }
        }
    }

    public static void RequirePositive(ReadOnlySpan<double> values, string name)
    {
        for (int i = 0; i < values.Length; i++)
        {
            if (!(values[i] > 0.0) || !double.IsFinite(values[i]))
            {
                throw new ArgumentException(
                    string.Create(CultureInfo.InvariantCulture, $"{name}[{i}] = {values[i]:R} must be finite and positive."), name);
            }
        }
    }

    public static void RequireLength(int actual, int expected, string name)
    {
        if (actual != expected)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"{name} has length {actual}; expected {expected}."), name);
        }
    }
}
