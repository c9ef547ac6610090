namespace Sibyl.Perturbation.TimeDependence;

/// <summary>
/// The momentum structures of the third-order density and velocity kernels that survive in P_13, named
/// (outer vertex)(inner second-order kernel): alpha, beta are the fluid mode couplings, gamma = 1 − μ² the
/// Galileon one. The last, <see cref="AlphaGammaOdd"/>, integrates to zero over angles in every P_13-type
/// term (its integrand is odd in k̂·q̂) but belongs to the full kernel F3(k1, k2, k3).
/// Derivation in DEVELOPERS.md ("Perturbation theory").
/// </summary>
public enum ThirdOrderStructure
{
    /// <summary>Continuity vertices of both orientations on the alpha part of the second-order kernel.</summary>
    AlphaAlpha,

    /// <summary>Continuity vertex alpha(k−q, q) on the gamma part of Θ2.</summary>
    AlphaGamma,

    /// <summary>Euler vertex beta on the alpha part of Θ2.</summary>
    BetaAlpha,

    /// <summary>Euler vertex beta on the gamma part of Θ2.</summary>
    BetaGamma,

    /// <summary>Galileon vertex gamma on the alpha part of δ2 (modified gravity only).</summary>
    GammaAlpha,

    /// <summary>Galileon vertex gamma on the gamma part of δ2 and the cubic vertex (modified gravity only).</summary>
    GammaGamma,

    /// <summary>Continuity vertex alpha(k1, k23) on the gamma part of δ2; zero in P_13.</summary>
    AlphaGammaOdd,
}
