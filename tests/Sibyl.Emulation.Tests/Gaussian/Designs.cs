using MathNet.Numerics.LinearAlgebra;

namespace Sibyl.Emulation.Tests.Gaussian;

/// <summary>Seeded random designs and the smooth test functions the Gaussian-process tests learn.</summary>
internal static class Designs
{
    /// <summary>n points uniform in the unit box [0, 1]^d, reproducible from <paramref name="seed"/>.</summary>
    public static Matrix<double> UnitBox(int seed, int n, int d)
    {
        var random = new Random(seed);
        return Matrix<double>.Build.Dense(n, d, (_, _) => random.NextDouble());
    }

    /// <summary>Two smooth outputs of two inputs with features on the scale of the design (invented for the tests).</summary>
    public static Matrix<double> TwoWaves(Matrix<double> x) => Matrix<double>.Build.Dense(
        x.RowCount,
        2,
        (i, j) => j == 0
            ? Math.Sin(3.0 * x[i, 0]) + (0.5 * Math.Cos(2.0 * x[i, 1]))
            : 10.0 + (4.0 * x[i, 0] * x[i, 1]) - Math.Exp(x[i, 1]));

    /// <summary>
    /// An entire (analytic everywhere) function of five inputs in the unit box, with one interaction, one nearly
    /// inactive input and a range of about 3: f = sin(2x₁ + x₂) + ½cos(3x₃)·x₄ + x₅²/4 + 0.05 x₁x₅.
    /// </summary>
    public static double Smooth5(ReadOnlySpan<double> x) =>
        Math.Sin((2.0 * x[0]) + x[1]) + (0.5 * Math.Cos(3.0 * x[2]) * x[3]) + (0.25 * x[4] * x[4]) + (0.05 * x[0] * x[4]);

    /// <summary>Row <paramref name="i"/> of <paramref name="x"/> as an array.</summary>
    public static double[] Row(Matrix<double> x, int i) => x.Row(i).ToArray();
}
