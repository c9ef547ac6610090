using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class CholeskyFactorTests
{
    // n = 37 is not a multiple of the SIMD width, so every remainder loop runs.
    private const int N = 37;

    private static Matrix<double> SymmetricPositiveDefinite()
    {
        var random = new Random(41);
        var a = Matrix<double>.Build.Dense(N, N, (_, _) => random.NextDouble() - 0.5);
        return (a * a.Transpose()) + (0.1 * Matrix<double>.Build.DenseIdentity(N));
    }

    [Fact]
    public void Factor_solve_determinant_and_inverse_match_MathNet_dense_algebra()
    {
        var k = SymmetricPositiveDefinite();
        double[] factor = k.ToRowMajorArray();
        Assert.True(CholeskyFactor.TryFactor(factor, N));

        // Referee: MathNet's Cholesky, LU determinant and LU inverse. The matrix has condition number ~1e3, so
        // agreement to 1e-12 (relative to the largest entry) is round-off; any indexing error is of order 1.
        var expectedFactor = k.Cholesky().Factor;
        var inverse = k.Inverse();
        double[] computedInverse = CholeskyFactor.Inverse(factor, N);
        double inverseScale = inverse.Enumerate().Max(Math.Abs);
        for (int i = 0; i < N; i++)
        {
            for (int j = 0; j < N; j++)
            {
                Assert.Equal(expectedFactor[i, j], factor[(i * N) + j], 1e-12);
                Assert.Equal(inverse[i, j], computedInverse[(i * N) + j], 1e-12 * inverseScale);
            }
        }

        Assert.Equal(Math.Log(k.Determinant()), CholeskyFactor.LogDeterminant(factor, N), 1e-10);
        var b = Vector<double>.Build.Dense(N, i => Math.Sin(i));
        double[] solved = b.ToArray();
        CholeskyFactor.Solve(factor, N, solved);
        var expected = k.Solve(b);
        for (int i = 0; i < N; i++)
        {
            Assert.Equal(expected[i], solved[i], 1e-12 * inverseScale);
        }
    }

    [Fact]
    public void Indefinite_matrix_is_reported_not_factored()
    {
        var k = SymmetricPositiveDefinite();
        k[N - 1, N - 1] = -1.0;
        Assert.False(CholeskyFactor.TryFactor(k.ToRowMajorArray(), N));
    }
}
