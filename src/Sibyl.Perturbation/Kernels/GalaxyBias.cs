namespace Sibyl.Perturbation.Kernels;

/// <summary>
/// Eulerian bias to third order in the basis of Assassi, Baumann, Green &amp; Zaldarriaga (2014, JCAP 08, 056):
/// δ_g = b1 δ + (b2/2) δ² + bG2 𝒢2(Φ) + bΓ3 Γ3 + …, with 𝒢2 the tidal operator (kernel S2 = μ12² − 1) and
/// Γ3 = 𝒢2(Φ_g) − 𝒢2(Φ_v). Operators that enter the one-loop spectrum only as constants times P_L
/// (b3, b𝒢3, b𝒢2δ, and b2 in P_13) renormalise b1 and are not carried.
/// </summary>
/// <param name="B1">Linear bias b1.</param>
/// <param name="B2">Second-order local bias b2.</param>
/// <param name="BG2">Tidal bias b𝒢2.</param>
/// <param name="BGamma3">Third-order nonlocal bias bΓ3.</param>
public readonly record struct GalaxyBias(double B1, double B2, double BG2, double BGamma3)
{
    /// <summary>Unbiased matter: b1 = 1, all others zero.</summary>
    public static GalaxyBias Matter => new(1.0, 0.0, 0.0, 0.0);
}
