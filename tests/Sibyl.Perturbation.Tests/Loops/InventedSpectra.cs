namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>Invented analytic stand-ins for linear spectra (not fits to any cosmology).</summary>
internal static class InventedSpectra
{
    // Turnover scale of the invented shape, h/Mpc.
    private const double Turnover = 0.03;

    // Peak of q^0.96/(1 + (q/q0)²)²: 0.96(1 + x²) = 4x², x = q/q0.
    private static readonly double PeakQ = Turnover * Math.Sqrt(0.96 / 3.04);

    private static readonly double Amplitude = 2e4 / Shape(PeakQ);

    /// <summary>
    /// INVENTED ΛCDM-like spectrum with wiggles: A q^0.96 / (1 + (q/0.03)²)² · [1 + 0.05 sin(105 q) e^{−(q/0.2)²}],
    /// peak ≈ 2e4 (Mpc/h)³ at q ≈ 0.017 h/Mpc, slope → −3.04 at high q like real ΛCDM (so that σ_v² converges
    /// as it does there), wiggle period 2π/105 ≈ 0.06 h/Mpc, damped like Silk damping.
    /// </summary>
    public static double Wiggly(double q) => Smooth(q) * (1.0 + (0.05 * Math.Sin(105.0 * q) * Math.Exp(-(q / 0.2) * (q / 0.2))));

    /// <summary>The same INVENTED spectrum without wiggles (its no-wiggle partner).</summary>
    public static double Smooth(double q) => Amplitude * Shape(q);

    /// <summary>INVENTED spectrum that vanishes fast at both ends: A (q/0.1)⁴ e^{−(q/0.1)²}, for low-k limits.</summary>
    public static double CutOff(double q)
    {
        double x = q / 0.1;
        return 1e4 * x * x * x * x * Math.Exp(-x * x);
    }

    private static double Shape(double q)
    {
        double x = q / Turnover;
        double denominator = 1.0 + (x * x);
        return Math.Pow(q, 0.96) / (denominator * denominator);
    }
}
