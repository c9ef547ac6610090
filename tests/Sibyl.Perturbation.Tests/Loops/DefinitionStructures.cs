namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>
/// The mode-coupling structures evaluated literally from their definitions (derivation in DEVELOPERS.md),
/// independent of the engine's rewritten forms; used by the brute-force referees.
/// </summary>
internal static class DefinitionStructures
{
    /// <summary>M_s(x, r) for P_13, structure index as in P13Structure.</summary>
    public static double P13(int structure, double x, double r)
    {
        // p² = 1 + r² − 2rx, grouped so that rounding cannot make it vanish or go negative near x = r = 1.
        double p2 = ((1.0 - r) * (1.0 - r)) + (2.0 * r * (1.0 - x));
        if (p2 == 0.0)
        {
            // Only the single point x = r = 1, reached by rounding; it has zero measure.
            return 0.0;
        }

        double aA = x / r;
        double aB = (1.0 - (r * x)) / p2;
        double bO = ((r * x) - (r * r)) / (2.0 * r * r * p2);
        double gO = (1.0 - (x * x)) / p2;
        double aS = 1.0 - (x / 2.0 * (r + (1.0 / r)));
        double g = 1.0 - (x * x);
        return structure switch
        {
            0 => (aA + aB) * aS,
            1 => aB * g,
            2 => bO * aS,
            3 => bO * g,
            4 => gO * aS,
            5 => gO * g,
            _ => throw new ArgumentOutOfRangeException(nameof(structure)),
        };
    }

    /// <summary>S(k1, k2) for P_22 from |k1|, |k2| and μ = k̂1·k̂2, structure index as in P22Structure.</summary>
    public static double P22(int structure, double k1, double k2, double mu)
    {
        double alpha = 1.0 + (mu / 2.0 * ((k1 / k2) + (k2 / k1)));
        double gamma = 1.0 - (mu * mu);
        return structure switch
        {
            0 => alpha * alpha,
            1 => alpha * gamma,
            2 => gamma * gamma,
            _ => throw new ArgumentOutOfRangeException(nameof(structure)),
        };
    }

    /// <summary>Einstein–de Sitter coefficients X_s of the P_13 structures (DEVELOPERS.md; checked in TimeCoefficientSolverTests).</summary>
    public static readonly double[] EdsP13Coefficients = [7.0 / 18.0, -2.0 / 9.0, 2.0 / 9.0, -8.0 / 63.0, 0.0, 0.0];

    /// <summary>Einstein–de Sitter weights of J_S in P22: F2 = α_s − (2/7)γ squared.</summary>
    public static readonly double[] EdsP22Coefficients = [1.0, -4.0 / 7.0, 4.0 / 49.0];
}
