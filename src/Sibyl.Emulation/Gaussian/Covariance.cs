namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// The unit-variance kernel profile c(r²) of <see cref="KernelKind"/> and h(r²) = −2 dc/d(r²), from which every
/// derivative needed follows: ∂k/∂ln ℓ_q = σ_f² h Δ_q²/ℓ_q² and ∂k/∂x_q = −σ_f² h Δ_q/ℓ_q², with Δ = x − x'.
/// h stays finite at r = 0 for both kernels, so no case needs special treatment.
/// </summary>
internal static class Covariance
{
    public const double Sqrt5 = 2.2360679774997896964;

    public static double Profile(KernelKind kernel, double r2)
    {
        if (kernel == KernelKind.SquaredExponential)
        {
            return Math.Exp(-0.5 * r2);
        }

        double r = Math.Sqrt(r2);
        return (1.0 + (Sqrt5 * r) + (5.0 / 3.0 * r2)) * Math.Exp(-Sqrt5 * r);
    }

    public static double Slope(KernelKind kernel, double r2)
    {
        if (kernel == KernelKind.SquaredExponential)
        {
            return Math.Exp(-0.5 * r2);
        }

        double r = Math.Sqrt(r2);
        return 5.0 / 3.0 * (1.0 + (Sqrt5 * r)) * Math.Exp(-Sqrt5 * r);
    }
}
