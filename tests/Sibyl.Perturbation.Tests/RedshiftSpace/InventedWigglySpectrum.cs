namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>INVENTED smooth spectrum with wiggles for the redshift-space tests (not a fit to any cosmology).</summary>
internal static class InventedWigglySpectrum
{
    // Turnover scale, h/Mpc, and the exponent of the turnover factor.
    private const double Turnover = 0.02;
    private const double TurnoverPower = 1.4;

    // Peak of q^0.96/(1 + x²)^1.4, x = q/q0: 0.96(1 + x²) = 2.8x².
    private static readonly double PeakQ = Turnover * Math.Sqrt(0.96 / (2.8 - 0.96));

    // Normalised so that the smooth peak is 2e4 (Mpc/h)³, a ΛCDM-like amplitude.
    private static readonly double Amplitude = 2e4 / Shape(PeakQ);

    /// <summary>
    /// INVENTED: P(q) = A q^0.96/(1 + (q/0.02)²)^1.4 · [1 + 0.05 sin(105 q) e^{−(q/0.2)²}], q in h/Mpc, P in (Mpc/h)³;
    /// wiggle period 2π/105 ≈ 0.06 h/Mpc, slope → −1.84 at high q.
    /// </summary>
    public static double Evaluate(double q) =>
        Amplitude * Shape(q) * (1.0 + (0.05 * Math.Sin(105.0 * q) * Math.Exp(-(q / 0.2) * (q / 0.2))));

    /// <summary>The same INVENTED spectrum without wiggles.</summary>
    public static double Smooth(double q) => Amplitude * Shape(q);

    private static double Shape(double q)
    {
        double x = q / Turnover;
        return Math.Pow(q, 0.96) / Math.Pow(1.0 + (x * x), TurnoverPower);
    }
}
