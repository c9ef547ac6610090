using MathNet.Numerics;

namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>
/// Closed forms of the momentum integrals for a power law P = A (q/q0)ⁿ, following the method of
/// Simonović, Baldauf, Zaldarriaga, Carrasco &amp; Kollmeier 2018, JCAP 04, 030: expand each structure into monomials
/// k^(2a) q^(2b) p^(2c) and use the one-loop master integral
/// ∫d³q/(2π)³ q^(−2ν1)|k − q|^(−2ν2) = k^(3−2ν12) Γ(3/2−ν1)Γ(3/2−ν2)Γ(ν12−3/2)/(8π^(3/2)Γ(ν1)Γ(ν2)Γ(3−ν12))
/// (normalisation checked here against the elementary case ν1 = ν2 = 1, ∫d³q/(q²|k−q|²) = π³/k).
/// Monomials with ν at a non-positive integer are scaleless and vanish (1/Γ = 0), as in dimensional
/// regularisation; the sum equals the convergent integral where it converges.
/// </summary>
internal static class PowerLawClosedForms
{
    private static readonly RationalMonomials One = RationalMonomials.Term(1.0, 0, 0, 0);

    /// <summary>J_S(k)/(A² (k/q0)^(2n) k³) for the P_22 structure index s.</summary>
    public static double P22Coefficient(int structure, double n)
    {
        // With K − Q − R = 2 q·(k − q): 4QR·α_s = 4QR + (K − Q − R)(Q + R), 4QR·γ = 4QR − (K − Q − R)².
        RationalMonomials d = K(1) - Q(1) - R(1);
        RationalMonomials fourQR = RationalMonomials.Term(4.0, 0, 1, 1);
        RationalMonomials alpha = fourQR + (d * (Q(1) + R(1)));
        RationalMonomials gamma = fourQR - (d * d);
        RationalMonomials numerator = structure switch { 0 => alpha * alpha, 1 => alpha * gamma, _ => gamma * gamma };
        // J = 2 ∫ S P(q) P(p) with S = numerator/(16 Q² R²).
        RationalMonomials integrand = numerator * RationalMonomials.Term(2.0 / 16.0, 0, -2, -2);
        return Sum(integrand, n, n);
    }

    /// <summary>I_s(k)/(A (k/q0)ⁿ k³) for the P_13 structure index s (convergent for −3 &lt; n &lt; −1 only for s = 1, 3, 4, 5).</summary>
    public static double P13Coefficient(int structure, double n)
    {
        // In units of k: r x = (K + Q − R)/(2K), x/r = (K + Q − R)/(2Q), x² = (K + Q − R)²/(4KQ), p̂² = R/K,
        // (x/2)(r + 1/r) = (K + Q − R)(K + Q)/(4KQ).
        RationalMonomials e = K(1) + Q(1) - R(1);
        RationalMonomials rx = e * RationalMonomials.Term(0.5, -1, 0, 0);
        RationalMonomials r2 = RationalMonomials.Term(1.0, -1, 1, 0);
        RationalMonomials x2 = e * e * RationalMonomials.Term(0.25, -1, -1, 0);
        RationalMonomials inverseP2 = RationalMonomials.Term(1.0, 1, 0, -1);
        RationalMonomials aA = e * RationalMonomials.Term(0.5, 0, -1, 0);
        RationalMonomials aB = (One - rx) * inverseP2;
        RationalMonomials bO = (rx - r2) * RationalMonomials.Term(0.5, 1, -1, 0) * inverseP2;
        RationalMonomials gO = (One - x2) * inverseP2;
        RationalMonomials aS = One - (e * (K(1) + Q(1)) * RationalMonomials.Term(0.25, -1, -1, 0));
        RationalMonomials g = One - x2;
        RationalMonomials structureTerms = structure switch
        {
            0 => (aA + aB) * aS,
            1 => aB * g,
            2 => bO * aS,
            3 => bO * g,
            4 => gO * aS,
            _ => gO * g,
        };
        return Sum(structureTerms, n, 0.0);
    }

    /// <summary>The master integral's coefficient G(ν1, ν2) (measure d³q/(2π)³).</summary>
    public static double Master(double nu1, double nu2)
    {
        double nu12 = nu1 + nu2;
        return Gamma(1.5 - nu1) * Gamma(1.5 - nu2) * Gamma(nu12 - 1.5) * InverseGamma(nu1) * InverseGamma(nu2) * InverseGamma(3.0 - nu12)
            / (8.0 * Math.Pow(Math.PI, 1.5));
    }

    private static double Sum(RationalMonomials integrand, double nQ, double nP)
    {
        // Each term c K^a Q^b R^c times q^nQ p^nP is k^(2a) q^(−2ν1) p^(−2ν2) with ν1 = −b − nQ/2, ν2 = −c − nP/2.
        double sum = 0.0;
        foreach (var ((_, b, c), coefficient) in integrand.Terms)
        {
            double nu1 = -b - (nQ / 2.0);
            double nu2 = -c - (nP / 2.0);
            if (IsNonPositiveInteger(nu1) || IsNonPositiveInteger(nu2) || IsNonPositiveInteger(3.0 - nu1 - nu2))
            {
                continue;
            }

            sum += coefficient * Master(nu1, nu2);
        }

        return sum;
    }

    private static RationalMonomials K(int power) => RationalMonomials.Term(1.0, power, 0, 0);

    private static RationalMonomials Q(int power) => RationalMonomials.Term(1.0, 0, power, 0);

    private static RationalMonomials R(int power) => RationalMonomials.Term(1.0, 0, 0, power);

    private static bool IsNonPositiveInteger(double x) => x <= 0.0 && x == Math.Round(x);

    private static double InverseGamma(double x) => IsNonPositiveInteger(x) ? 0.0 : 1.0 / Gamma(x);

    private static double Gamma(double x)
    {
        if (IsNonPositiveInteger(x))
        {
            throw new ArgumentException(FormattableString.Invariant($"Γ({x}) diverges: choose a power-law slope away from the poles."));
        }

        return SpecialFunctions.Gamma(x);
    }
}
