using MathNet.Numerics.LinearAlgebra;

namespace Sibyl.Bench.Emulation;

/// <summary>
/// A seeded training set shaped like one emulator block: n points in the 8-dimensional unit box and 10 smooth
/// outputs (standing in for PCA coefficients), invented for timing only.
/// </summary>
internal static class EmulationData
{
    public const int Dimension = 8;
    public const int Outputs = 10;

    public static Matrix<double> Inputs(int n)
    {
        var random = new Random(2024);
        return Matrix<double>.Build.Dense(n, Dimension, (_, _) => random.NextDouble());
    }

    public static Matrix<double> Targets(Matrix<double> x) => Matrix<double>.Build.Dense(
        x.RowCount,
        Outputs,
        (i, j) => Math.Sin((1.5 * x[i, 0]) + (0.3 * j)) * (1.0 + (0.5 * x[i, 1])) + (0.2 * x[i, 2] * x[i, 3])
            + (0.1 * Math.Cos(2.0 * x[i, 4 + (j % 4)])));

    /// <summary>A fixed query point inside the box.</summary>
    public static double[] Point() => [0.31, 0.62, 0.18, 0.77, 0.45, 0.53, 0.29, 0.86];
}
