using Sibyl.Demo.Numerics;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Demo.Survey;

/// <summary>
/// The Gaussian covariance of power-spectrum multipoles in one k bin (Grieb et al. 2016, MNRAS 457, 1577, their
/// eq. 15 in the thin-shell limit):
/// C_ℓℓ'(k) = (2/N_k) (2ℓ+1)(2ℓ'+1)/2 ∫_{−1}^{1} dμ L_ℓ(μ) L_ℓ'(μ) [P(k, μ) + 1/n̄]²,
/// with N_k = V k² Δk / (2π²) modes in the bin (both k and −k counted). Different bins are uncorrelated.
/// Approximations, stated: P(k, μ) is rebuilt from its ℓ = 0, 2, 4 multipoles (exact for a polynomial of degree 4 in
/// μ such as linear theory; the one-loop and damping corrections at higher ℓ are left out); P is evaluated at the bin
/// centre rather than averaged over the bin; no window function, no non-Gaussian (trispectrum) or super-sample terms.
/// </summary>
public static class GaussianCovariance
{
    /// <summary>
    /// Nodes of the μ integral: P(k, μ) of degree 4 squared times L4² is a polynomial of degree 16, integrated exactly
    /// by 9 Gauss–Legendre nodes; 10 leave a margin.
    /// </summary>
    private const int MuNodes = 10;

    private static readonly (double[] Nodes, double[] Weights) Rule = GaussLegendre.Rule(MuNodes);

    /// <summary>Number of Fourier modes N_k = V k² Δk / (2π²) in a thin shell.</summary>
    /// <param name="volume">Survey volume, (Mpc/h)³.</param>
    /// <param name="k">Bin centre, h/Mpc.</param>
    /// <param name="width">Bin width Δk, h/Mpc.</param>
    public static double ModeCount(double volume, double k, double width) => volume * k * k * width / (2.0 * Math.PI * Math.PI);

    /// <summary>
    /// The block C_ℓℓ' of one bin, in (Mpc/h)⁶, for the multipoles <paramref name="ells"/> (from 0, 2, 4).
    /// </summary>
    /// <param name="ells">Multipoles of the block's rows and columns.</param>
    /// <param name="p0">Monopole P0(k), (Mpc/h)³.</param>
    /// <param name="p2">Quadrupole P2(k).</param>
    /// <param name="p4">Hexadecapole P4(k).</param>
    /// <param name="shotNoise">Poisson shot noise 1/n̄, (Mpc/h)³.</param>
    /// <param name="modes">N_k, the number of modes in the bin.</param>
    public static double[,] Block(IReadOnlyList<int> ells, double p0, double p2, double p4, double shotNoise, double modes)
    {
        ArgumentNullException.ThrowIfNull(ells);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(modes);
        int n = ells.Count;
        var block = new double[n, n];
        for (int j = 0; j < MuNodes; j++)
        {
            double mu = Rule.Nodes[j];
            double total = (p0 * Multipoles.Legendre(0, mu)) + (p2 * Multipoles.Legendre(2, mu)) + (p4 * Multipoles.Legendre(4, mu)) + shotNoise;
            double weighted = Rule.Weights[j] * total * total;
            for (int a = 0; a < n; a++)
            {
                for (int b = 0; b < n; b++)
                {
                    block[a, b] += weighted * Multipoles.Legendre(ells[a], mu) * Multipoles.Legendre(ells[b], mu);
                }
            }
        }

        for (int a = 0; a < n; a++)
        {
            for (int b = 0; b < n; b++)
            {
                block[a, b] *= (2.0 / modes) * ((2 * ells[a]) + 1) * ((2 * ells[b]) + 1) / 2.0;
            }
        }

        return block;
    }
}
