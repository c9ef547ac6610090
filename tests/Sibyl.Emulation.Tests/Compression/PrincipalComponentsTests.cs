using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Compression;

namespace Sibyl.Emulation.Tests.Compression;

public sealed class PrincipalComponentsTests
{
    /// <summary>
    /// Invented smooth "spectra": n samples over p features, each a mix of a few smooth shapes with sample-dependent
    /// amplitudes plus a small seeded ripple, so the singular values fall off quickly but never reach zero.
    /// </summary>
    private static Matrix<double> Spectra(int n, int p, int seed)
    {
        var random = new Random(seed);
        var amplitudes = Matrix<double>.Build.Dense(n, 4, (_, _) => random.NextDouble() - 0.5);
        return Matrix<double>.Build.Dense(n, p, (i, f) =>
        {
            double t = f / (double)(p - 1);
            return 5.0 + (2.0 * t) + (amplitudes[i, 0] * Math.Sin(3.0 * t)) + (0.3 * amplitudes[i, 1] * Math.Cos(7.0 * t))
                + (0.05 * amplitudes[i, 2] * t * t) + (0.01 * amplitudes[i, 3] * Math.Sin(20.0 * t))
                + (1e-4 * Math.Sin((i * 1.7) + (f * 0.9)));
        });
    }

    private static Matrix<double> Centred(Matrix<double> data)
    {
        var mean = Vector<double>.Build.Dense(data.ColumnCount, f => data.Column(f).Average());
        return Matrix<double>.Build.Dense(data.RowCount, data.ColumnCount, (i, f) => data[i, f] - mean[f]);
    }

    [Theory]
    [InlineData(60, 25)]
    [InlineData(12, 40)]
    public void Basis_and_reconstruction_agree_with_a_direct_singular_value_decomposition(int n, int p)
    {
        var data = Spectra(n, p, seed: 2);
        var pca = PrincipalComponents.Fit(data, new PrincipalComponentsOptions { MaximumCount = 5 });
        Assert.Equal(5, pca.Count);

        // Referee: MathNet's full SVD of the centred data (Jolliffe 2002, ch. 3), which never forms a QR factor.
        var svd = Centred(data).Svd(computeVectors: true);
        double largest = svd.S[0];
        for (int c = 0; c < pca.Count; c++)
        {
            // Singular values to 1e-12 of the largest: both are backward stable.
            Assert.Equal(svd.S[c], pca.SingularValues[c], 1e-12 * largest);
            // Components agree up to sign; |v·v'| = 1 to 1e-10 because the gaps between these singular values are
            // at least 1e-3 of the largest, and the error of a singular vector is round-off over the gap.
            var reference = svd.VT.Row(c);
            double overlap = 0.0;
            for (int f = 0; f < p; f++)
            {
                overlap += reference[f] * pca.Component(c)[f];
            }

            Assert.Equal(1.0, Math.Abs(overlap), 1e-10);
        }

        // Reconstruction of every training sample equals mean + V_k V_kᵀ (x − mean) from the referee's V.
        var vk = svd.VT.SubMatrix(0, 5, 0, p).Transpose();
        var centred = Centred(data);
        var expected = centred * vk * vk.Transpose();
        var coefficients = new double[5];
        var reconstructed = new double[p];
        double maxError = 0.0;
        for (int i = 0; i < n; i++)
        {
            pca.Project(data.Row(i).ToArray(), coefficients);
            pca.Reconstruct(coefficients, reconstructed);
            for (int f = 0; f < p; f++)
            {
                // Data of size ~7: 1e-12 absolute is ~1e4 ulps, round-off of two projections and a sum of five terms.
                Assert.Equal(expected[i, f] + pca.Mean[f], reconstructed[f], 1e-12);
                maxError = Math.Max(maxError, Math.Abs(reconstructed[f] - data[i, f]));
            }
        }

        // The reported training error is the one a caller measures (scale 1 here).
        Assert.Equal(maxError, pca.MaximumError, 1e-12);
        // Explained fraction: Σ kept σ² / Σ all σ² from the referee.
        double total = svd.S.Sum(s => s * s);
        double kept = svd.S.Take(5).Sum(s => s * s);
        Assert.Equal(kept / total, pca.ExplainedFraction, 1e-12);
    }

    [Fact]
    public void Kept_count_is_the_smallest_that_meets_the_tolerance()
    {
        var data = Spectra(50, 30, seed: 3);
        var reference = Centred(data).Svd(computeVectors: true);
        foreach (double tolerance in new[] { 1e-1, 1e-2, 1e-3 })
        {
            var pca = PrincipalComponents.Fit(data, new PrincipalComponentsOptions { Tolerance = tolerance });
            Assert.InRange(pca.MaximumError, 0.0, tolerance);
            Assert.True(pca.RmsError <= pca.MaximumError);
            // One component fewer, measured with the referee's basis, does not meet the tolerance.
            int fewer = pca.Count - 1;
            var vk = reference.VT.SubMatrix(0, fewer, 0, 30).Transpose();
            var residual = Centred(data) - (Centred(data) * vk * vk.Transpose());
            Assert.True(residual.Enumerate().Max(Math.Abs) > tolerance, $"{fewer} components already meet {tolerance}");
        }
    }

    [Fact]
    public void Rank_r_matrix_is_reproduced_with_exactly_r_components()
    {
        const int n = 30, p = 20, r = 4;
        var random = new Random(5);
        var a = Matrix<double>.Build.Dense(n, r, (_, _) => random.NextDouble() - 0.5);
        var b = Matrix<double>.Build.Dense(p, r, (_, _) => random.NextDouble() - 0.5);
        var offset = Vector<double>.Build.Dense(p, f => 3.0 + f);
        // Centred factors make the centred data exactly rank r.
        var data = Centred(a) * b.Transpose();
        for (int i = 0; i < n; i++)
        {
            data.SetRow(i, data.Row(i) + offset);
        }

        var pca = PrincipalComponents.Fit(data, new PrincipalComponentsOptions { Tolerance = 1e-10 });
        Assert.Equal(r, pca.Count);
        // Round-off of values of size ~20 (the offset): 1e-13 absolute is a few hundred ulps.
        Assert.InRange(pca.MaximumError, 0.0, 1e-13);
    }

    [Fact]
    public void Scale_divides_each_feature_before_the_decomposition()
    {
        var data = Spectra(40, 10, seed: 6);
        double[] scale = [1.0, 2.0, 0.5, 4.0, 1.0, 3.0, 1.0, 0.25, 1.0, 8.0];
        var scaled = PrincipalComponents.Fit(data, new PrincipalComponentsOptions { MaximumCount = 3, Scale = scale });
        var divided = Matrix<double>.Build.Dense(40, 10, (i, f) => data[i, f] / scale[f]);
        var plain = PrincipalComponents.Fit(divided, new PrincipalComponentsOptions { MaximumCount = 3 });
        // The same decomposition of the same numbers, reached by two routes: round-off only.
        for (int c = 0; c < 3; c++)
        {
            Assert.Equal(plain.SingularValues[c], scaled.SingularValues[c], 1e-12 * plain.SingularValues[0]);
        }

        Assert.Equal(plain.MaximumError, scaled.MaximumError, 1e-12);
        var coefficients = new double[3];
        var back = new double[10];
        scaled.Project(data.Row(7).ToArray(), coefficients);
        scaled.Reconstruct(coefficients, back);
        for (int f = 0; f < 10; f++)
        {
            // Reconstruction is in the original units: error at most the standardized error times the scale.
            Assert.InRange(Math.Abs(back[f] - data[7, f]), 0.0, (scaled.MaximumError * scale[f]) + 1e-12);
        }
    }

    [Fact]
    public void Basis_rebuilt_from_its_plain_arrays_reconstructs_bit_identically_without_allocating()
    {
        var data = Spectra(30, 16, seed: 7);
        var pca = PrincipalComponents.Fit(data, new PrincipalComponentsOptions { Tolerance = 1e-3 });
        var copy = PrincipalComponents.FromArrays(
            pca.Mean.ToArray(), pca.Scale.ToArray(), pca.Basis.ToArray(), pca.SingularValues.ToArray(),
            pca.MaximumError, pca.RmsError, pca.ExplainedFraction);
        var coefficients = new double[pca.Count];
        pca.Project(data.Row(4).ToArray(), coefficients);
        var first = new double[16];
        var second = new double[16];
        pca.Reconstruct(coefficients, first);
        long before = GC.GetAllocatedBytesForCurrentThread();
        copy.Reconstruct(coefficients, second);
        Assert.Equal(before, GC.GetAllocatedBytesForCurrentThread());
        Assert.Equal(first, second);
    }
}
