namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The mode-coupling structures S of the P_22 momentum integrals J_S(k) = 2∫d³q/(2π)³ S(q, k−q) P(q) P(|k−q|),
/// built from α_s(k1,k2) = 1 + (μ/2)(k1/k2 + k2/k1) and γ(k1,k2) = 1 − μ², μ = k̂1·k̂2.
/// </summary>
public enum P22Structure
{
    /// <summary>S = α_s².</summary>
    AlphaAlpha = 0,

    /// <summary>S = α_s·γ.</summary>
    AlphaGamma = 1,

    /// <summary>S = γ².</summary>
    GammaGamma = 2,
}
