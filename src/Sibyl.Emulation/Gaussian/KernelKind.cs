namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Stationary covariance functions with automatic relevance determination (one length scale ℓ_q per input
/// dimension), written in terms of the scaled squared distance r² = Σ_q (x_q − x'_q)²/ℓ_q² and the signal
/// variance σ_f² (Rasmussen &amp; Williams 2006, "Gaussian Processes for Machine Learning", MIT Press, §4.2).
/// </summary>
public enum KernelKind
{
    /// <summary>k = σ_f² exp(−r²/2): infinitely differentiable sample functions (R&amp;W eq. 4.9 with ARD, eq. 5.2).</summary>
    SquaredExponential,

    /// <summary>
    /// Matérn ν = 5/2: k = σ_f² (1 + √5 r + 5r²/3) exp(−√5 r), twice mean-square differentiable sample functions
    /// (R&amp;W eq. 4.17 with ν = 5/2, ARD distance).
    /// </summary>
    Matern52,
}
