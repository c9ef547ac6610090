using MathNet.Numerics.Integration;
using Sibyl.Cosmology.Linear;

namespace Sibyl.Perturbation.Resummation;

/// <summary>
/// Damping of the baryon acoustic wiggles by large-scale displacements, the input of IR resummation
/// (Baldauf, Mirbabayi, Simonović &amp; Zaldarriaga 2015, PRD 92, 043514; Blas, Garny, Ivanov &amp;
/// Sibiryakov 2016, JCAP 07, 028):
/// Σ² = (1/6π²) ∫_0^{k_S} dq P_nw(q) [1 − j0(q ℓ) + 2 j2(q ℓ)], with ℓ the sound horizon at the drag epoch of
/// the cosmology, and for redshift space δΣ² = (1/2π²) ∫_0^{k_S} dq P_nw(q) j2(q ℓ)
/// (Ivanov &amp; Sibiryakov 2018, JCAP 07, 053).
/// </summary>
public static class BaoDamping
{
    /// <summary>
    /// Separation scale k_S in h/Mpc between the long modes that are resummed and the short ones kept in
    /// the loop; 0.2 h/Mpc is a common choice (the result depends on it only at two loops).
    /// </summary>
    public const double SeparationScale = 0.2;

    /// <summary>Σ² in (Mpc/h)² for a spectrum in growth units (multiply by D² for a redshift).</summary>
    /// <param name="noWiggle">No-wiggle spectrum, covering (0, k_S] at least from its first point.</param>
    /// <param name="baoScale">ℓ in Mpc/h, positive.</param>
    public static double Sigma2(LogGridFunction noWiggle, double baoScale) =>
        Integrate(noWiggle, baoScale, x => 1.0 - SphericalBessel0(x) + 2.0 * SphericalBessel2(x)) / (6.0 * Math.PI * Math.PI);

    /// <summary>δΣ² in (Mpc/h)² for a spectrum in growth units.</summary>
    public static double DeltaSigma2(LogGridFunction noWiggle, double baoScale) =>
        Integrate(noWiggle, baoScale, SphericalBessel2) / (2.0 * Math.PI * Math.PI);

    /// <summary>j0(x) = sin x / x.</summary>
    public static double SphericalBessel0(double x) => x < 1e-4 ? 1.0 - x * x / 6.0 : Math.Sin(x) / x;

    /// <summary>j2(x) = (3/x² − 1) sin x / x − 3 cos x / x², with its series x²/15 below x = 1e-2.</summary>
    public static double SphericalBessel2(double x)
    {
        if (x < 1e-2)
        {
            return x * x / 15.0 * (1.0 - x * x / 14.0);
        }

        return (3.0 / (x * x) - 1.0) * Math.Sin(x) / x - 3.0 * Math.Cos(x) / (x * x);
    }

    private static double Integrate(LogGridFunction noWiggle, double baoScale, Func<double, double> window)
    {
        ArgumentNullException.ThrowIfNull(noWiggle);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(baoScale);
        // Below q = 1e-3 h/Mpc the window is ≲ (qℓ)² ~ 1e-2 on a P(q) that is itself small: done in ln q.
        // Above it the window oscillates with period 2π/ℓ ≈ 0.06 h/Mpc, so a linear-q rule with 128
        // nodes over [1e-3, k_S] samples each period about 40 times.
        double qMin = noWiggle.KMin, split = Math.Max(1e-3, qMin);
        double low = split > qMin
            ? GaussLegendreRule.Integrate(u => { double q = Math.Exp(u); return q * noWiggle.Evaluate(q) * window(q * baoScale); }, Math.Log(qMin), Math.Log(split), 64)
            : 0.0;
        double high = GaussLegendreRule.Integrate(q => noWiggle.Evaluate(q) * window(q * baoScale), split, SeparationScale, 128);
        return low + high;
    }
}
