using Sibyl.Demo.Survey;

namespace Sibyl.Demo.Tests.Survey;

/// <summary>
/// The Gaussian multipole covariance against closed forms. For the Kaiser (1987) spectrum P(k, μ) = (b + fμ²)² P_L the
/// multipoles are P0 = (b² + 2bf/3 + f²/5)P_L, P2 = (4bf/3 + 4f²/7)P_L, P4 = 8f²/35 P_L (DESIGN.md's list), and
/// without shot noise C_ℓℓ' = (2/N_k)(2ℓ+1)(2ℓ'+1) ⟨L_ℓ L_ℓ' (b + fμ²)⁴⟩ P_L², where ⟨·⟩ = ½∫_{−1}^{1}dμ and the
/// average follows from ⟨μ^{2n}⟩ = 1/(2n + 1), independently of the code's Gauss–Legendre quadrature.
/// </summary>
public sealed class GaussianCovarianceTests
{
    private const double B = 2.0, F = 0.8, LinearPower = 1.0e4, Modes = 1000.0;

    /// <summary>
    /// Both sides are exact for these polynomials (the quadrature integrates degree 19 exactly), so they differ only by
    /// rounding: a few ulps per term of sums of about ten terms.
    /// </summary>
    private const double Rounding = 1e-12;

    private static readonly double[] Kaiser =
    [
        ((B * B) + (2 * B * F / 3) + (F * F / 5)) * LinearPower,
        ((4 * B * F / 3) + (4 * F * F / 7)) * LinearPower,
        8 * F * F / 35 * LinearPower,
    ];

    [Fact]
    public void Monopole_variance_of_Kaiser_spectrum_is_two_over_modes_times_mean_of_P_squared()
    {
        var block = GaussianCovariance.Block([0], Kaiser[0], Kaiser[1], Kaiser[2], shotNoise: 0.0, Modes);

        // ⟨(b + fμ²)⁴⟩ = b⁴ + 4b³f/3 + 6b²f²/5 + 4bf³/7 + f⁴/9 (binomial expansion, ⟨μ^{2n}⟩ = 1/(2n+1)).
        double mean = Math.Pow(B, 4) + (4 * Math.Pow(B, 3) * F / 3) + (6 * B * B * F * F / 5) + (4 * B * Math.Pow(F, 3) / 7) + (Math.Pow(F, 4) / 9);
        double expected = 2.0 / Modes * mean * LinearPower * LinearPower;
        Assert.Equal(expected, block[0, 0], expected * Rounding);
    }

    [Fact]
    public void Kaiser_covariance_of_monopole_quadrupole_and_hexadecapole_matches_the_moment_sums()
    {
        var block = GaussianCovariance.Block([0, 2, 4], Kaiser[0], Kaiser[1], Kaiser[2], shotNoise: 0.0, Modes);

        // Legendre polynomials as coefficients of μ^0, μ^2, μ^4 (Abramowitz & Stegun 22.3).
        double[][] legendre = [[1, 0, 0], [-0.5, 1.5, 0], [3.0 / 8, -30.0 / 8, 35.0 / 8]];
        int[] ells = [0, 2, 4];
        for (int a = 0; a < 3; a++)
        {
            for (int b = 0; b < 3; b++)
            {
                double mean = 0.0;
                for (int j = 0; j <= 4; j++)
                {
                    double kaiser = Binomial(4, j) * Math.Pow(B, 4 - j) * Math.Pow(F, j);
                    for (int p = 0; p < 3; p++)
                    {
                        for (int q = 0; q < 3; q++)
                        {
                            mean += kaiser * legendre[a][p] * legendre[b][q] / ((2 * (j + p + q)) + 1);
                        }
                    }
                }

                double expected = 2.0 / Modes * ((2 * ells[a]) + 1) * ((2 * ells[b]) + 1) * mean * LinearPower * LinearPower;
                Assert.Equal(expected, block[a, b], Math.Abs(block[0, 0]) * Rounding);
            }
        }
    }

    [Fact]
    public void Pure_shot_noise_gives_diagonal_covariance_two_times_two_ell_plus_one_over_modes_nbar_squared()
    {
        const double shotNoise = 3000.0;
        var block = GaussianCovariance.Block([0, 2, 4], 0.0, 0.0, 0.0, shotNoise, Modes);

        // Orthogonality: ½∫L_ℓ L_ℓ' dμ = δ_ℓℓ'/(2ℓ + 1), so C_ℓℓ' = (2/N_k)(2ℓ + 1)/n̄² δ_ℓℓ'.
        int[] ells = [0, 2, 4];
        for (int a = 0; a < 3; a++)
        {
            for (int b = 0; b < 3; b++)
            {
                double expected = a == b ? 2.0 / Modes * ((2 * ells[a]) + 1) * shotNoise * shotNoise : 0.0;
                Assert.Equal(expected, block[a, b], 2.0 / Modes * shotNoise * shotNoise * Rounding);
            }
        }
    }

    [Fact]
    public void Mode_count_is_shell_volume_over_fundamental_cell()
    {
        // N_k = 4πk²Δk / (2π/L)³ for a cube of side L (both k and −k counted).
        const double side = 1000.0, k = 0.1, width = 0.01;
        double expected = 4 * Math.PI * k * k * width / Math.Pow(2 * Math.PI / side, 3);
        Assert.Equal(expected, GaussianCovariance.ModeCount(side * side * side, k, width), expected * Rounding);
    }

    private static double Binomial(int n, int k) => Enumerable.Range(1, k).Aggregate(1.0, (c, i) => c * (n - k + i) / i);
}
