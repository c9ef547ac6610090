namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The six structures M_s(x, r) of the P_13 momentum integrals I_s(k) = ∫d³q/(2π)³ M_s P(q), with r = q/k,
/// x = k̂·q̂ and p² = 1 + r² − 2rx. In terms of aA = x/r, aB = (1 − rx)/p², bO = (rx − r²)/(2r²p²),
/// gO = (1 − x²)/p², As = 1 − (x/2)(r + 1/r) and G = 1 − x².
/// </summary>
public enum P13Structure
{
    /// <summary>M = (aA + aB)·As.</summary>
    AlphaAlpha = 0,

    /// <summary>M = aB·G.</summary>
    AlphaGamma = 1,

    /// <summary>M = bO·As.</summary>
    BetaAlpha = 2,

    /// <summary>M = bO·G.</summary>
    BetaGamma = 3,

    /// <summary>M = gO·As.</summary>
    GammaAlpha = 4,

    /// <summary>M = gO·G.</summary>
    GammaGamma = 5,
}
