using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>Recombination coefficients and the Saha phase-space factor, all in SI units.</summary>
internal static class AtomicRates
{
    /// <summary>
    /// Fudge factor F on the hydrogen case-B coefficient that makes the effective three-level atom follow the
    /// multi-level calculation (Seager, Sasselov &amp; Scott 1999, ApJ 523, L1).
    /// </summary>
    public const double HydrogenFudge = 1.14;

    /// <summary>(2π m_e k_B / h²)^{3/2} in m⁻³ K^{−3/2}.</summary>
    private static readonly double PhaseSpacePerKelvin =
        Math.Pow(2.0 * Math.PI * ElectronMass * BoltzmannConstant / (PlanckConstant * PlanckConstant), 1.5);

    private static readonly double HeliumScale = Math.Pow(10.0, -16.744), HeliumT1 = Math.Pow(10.0, 5.114);

    /// <summary>(2π m_e k_B T / h²)^{3/2} in m⁻³, the free-electron phase-space density of the Saha equation.</summary>
    public static double PhaseSpaceDensity(double temperature) =>
        PhaseSpacePerKelvin * temperature * Math.Sqrt(temperature);

    /// <summary>
    /// Case-B recombination coefficient of hydrogen times <see cref="HydrogenFudge"/>, in m³/s: the fit of
    /// Péquignot, Petitjean &amp; Boisson (1991, A&amp;A 251, 680), α = 10⁻¹⁹ a t^b / (1 + c t^d) with t = T / 10⁴ K,
    /// as used by Seager, Sasselov &amp; Scott (1999).
    /// </summary>
    public static double HydrogenCaseB(double temperature)
    {
        double lnT = Math.Log(temperature * 1e-4);
        return HydrogenFudge * 1e-19 * 4.309 * Math.Exp(-0.6166 * lnT) / (1.0 + 0.6703 * Math.Exp(0.5300 * lnT));
    }

    /// <summary>
    /// Recombination coefficient of He II to the singlet states of He I in m³/s: the fit of Verner &amp; Ferland
    /// (1996, ApJS 103, 467) with the singlet parameters of Seager, Sasselov &amp; Scott (1999),
    /// α = q / [√(T/T₂) (1 + √(T/T₂))^{1−p} (1 + √(T/T₁))^{1+p}], q = 10^−16.744 m³/s, p = 0.711,
    /// T₁ = 10^5.114 K, T₂ = 3 K.
    /// </summary>
    public static double HeliumSinglet(double temperature)
    {
        const double p = 0.711;
        double s2 = Math.Sqrt(temperature / 3.0), s1 = Math.Sqrt(temperature / HeliumT1);
        return HeliumScale / (s2 * Math.Pow(1.0 + s2, 1.0 - p) * Math.Pow(1.0 + s1, 1.0 + p));
    }
}
