namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The seven cosmology-independent momentum structures of the redshift-space second-order kernel
/// Z2(q, p) = b1·U + V + b2/2 + bG2·W at p = k − q, line of sight ẑ, μ = k̂·ẑ, k_z = kμ, with
/// U = α_s + b̃γ + f·L1, V = f μ²α_s + ṽ μ²γ + f²·L2, W = −γ (derivation in DEVELOPERS.md, "Redshift space").
/// </summary>
/// <remarks>
/// α_s = 1 + (μ_qp/2)(q/p + p/q) and γ = 1 − μ_qp² with μ_qp = q̂·p̂ (dimensionless);
/// L1 = (k_z/2)(q_z/q² + p_z/p²) and L2 = (k_z²/2) q_z p_z/(q²p²) (dimensionless).
/// </remarks>
public enum RedshiftP22Structure
{
    /// <summary>α_s(q, p).</summary>
    AlphaS = 0,

    /// <summary>γ(q, p) = 1 − μ_qp².</summary>
    Gamma = 1,

    /// <summary>The constant 1 (carries b2/2 and, with γ, the tidal bias).</summary>
    One = 2,

    /// <summary>μ²·α_s.</summary>
    Mu2AlphaS = 3,

    /// <summary>μ²·γ.</summary>
    Mu2Gamma = 4,

    /// <summary>L1 = (k_z/2)(q_z/q² + p_z/p²).</summary>
    L1 = 5,

    /// <summary>L2 = (k_z²/2) q_z p_z/(q²p²).</summary>
    L2 = 6,
}
