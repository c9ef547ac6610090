namespace Sibyl.Perturbation.Kernels;

/// <summary>
/// The mode-coupling functions of the fluid equations (Bernardeau et al. 2002, Phys. Rep. 367, 1, eq. 39)
/// and the Galileon coupling of the modified Poisson equation.
/// </summary>
public static class ModeCoupling
{
    /// <summary>α(k1, k2) = (k1 + k2)·k1 / k1².</summary>
    public static double Alpha(Wavevector k1, Wavevector k2) => Wavevector.Dot(k1 + k2, k1) / k1.LengthSquared;

    /// <summary>Symmetrised α: 1 + (μ/2)(k1/k2 + k2/k1).</summary>
    public static double AlphaSymmetric(Wavevector k1, Wavevector k2) => 0.5 * (Alpha(k1, k2) + Alpha(k2, k1));

    /// <summary>β(k1, k2) = |k1 + k2|² (k1·k2) / (2 k1² k2²).</summary>
    public static double Beta(Wavevector k1, Wavevector k2) =>
        (k1 + k2).LengthSquared * Wavevector.Dot(k1, k2) / (2.0 * k1.LengthSquared * k2.LengthSquared);

    /// <summary>γ(k1, k2) = 1 − (k̂1·k̂2)²; the tidal operator's kernel is S2 = −γ.</summary>
    public static double Gamma(Wavevector k1, Wavevector k2)
    {
        double dot = Wavevector.Dot(k1, k2);
        return 1.0 - dot * dot / (k1.LengthSquared * k2.LengthSquared);
    }
}
