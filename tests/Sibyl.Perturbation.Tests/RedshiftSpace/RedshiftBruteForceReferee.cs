using MathNet.Numerics.Integration;
using GaussLegendreRule = MathNet.Numerics.Integration.GaussLegendreRule;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>
/// Slow, independent referee for the redshift-space P_22 integrals at fixed (k, μ):
/// I_ab(k, μ) = 2∫d³q/(2π)³ S_a S_b P(q) P(|k − q|) over the WHOLE q domain (no q ↔ p symmetry, no φ average done
/// by hand), with the structures taken from 3-D vectors (<see cref="VectorStructures"/>), nested MathNet adaptive
/// Gauss–Kronrod in ln q and ln p (standing for x = k̂·q̂) and a MathNet Gauss–Legendre rule in φ.
/// Compare with Σ_n J_{ab,n}(k) μ^{2n}.
/// </summary>
/// <remarks>
/// <para>
/// P is the analytic function itself, set to zero outside [qMin, qMax] as the engine does, not the engine's
/// interpolated table: the table's cubic interpolant has derivative jumps at its nodes that would stall the
/// adaptive rules, and its error (≲ 1e-5 of P for 5 % wiggles, see <see cref="LogSampledSpectrum"/>) is far below
/// the 1e-3 of the comparisons.
/// </para>
/// <para>
/// The middle variable is v = ln p, dx = −p² dv/(kq): near q ≈ k, x ≈ 1 the 1/p² of L1 and L2 is then cancelled by
/// the Jacobian, and 1 − x = (p² − (k − q)²)/(2kq) is formed without the cancellation that would leave only ~7 digits
/// in x itself (and stall the adaptive rule on rounding noise).
/// </para>
/// <para>
/// In φ the product of two structures is a trigonometric polynomial of degree ≤ 4 (q_z and p_z are linear in
/// cos φ), which 32-point Gauss–Legendre on [0, π] integrates to rounding (its error term ∝ 4^64/64! ≈ 1e-50). An
/// adaptive rule there adds nothing and stalls: where a φ-independent product such as α_s² crosses zero its
/// rounding noise is large relative to ∫|f|, and the relative criterion recurses to full depth.
/// </para>
/// </remarks>
internal sealed class RedshiftBruteForceReferee(Func<double, double> spectrum, double qMin, double qMax)
{
    // Asked-for relative accuracies (MathNet: of the error estimate against ∫|f|), the inner one 100× tighter than
    // the outer so that the outer integrand is smooth to the outer tolerance; the tests compare at 1e-3.
    private const double OuterTolerance = 1e-6;
    private const double MiddleTolerance = 1e-8;
    private const int AzimuthNodes = 32;
    private const int MaximumDepth = 20;

    // Below |q − k| = 1e-10 k the outer integrand (bounded) contributes < 1e-10 of the total.
    private const double ClosestApproach = 1e-10;

    /// <summary>I_ab(k, μ) in (Mpc/h)³; k in h/Mpc.</summary>
    public double Integral(RedshiftP22Structure a, RedshiftP22Structure b, double k, double mu)
    {
        int ia = (int)a, ib = (int)b;
        var values = new double[VectorStructures.Count];
        double Outer(double q)
        {
            double gap = Math.Abs(k - q);
            double Middle(double v)
            {
                double p = Math.Exp(v);
                double oneMinusX = (p - gap) * (p + gap) / (2.0 * k * q);
                double onePlusX = (k + q - p) * (k + q + p) / (2.0 * k * q);
                double x = 1.0 - oneMinusX;
                double s = Math.Sqrt(Math.Max(0.0, oneMinusX * onePlusX));
                double Azimuth(double phi)
                {
                    (var kv, var qv) = VectorStructures.Configuration(k, mu, q, x, s, phi);
                    VectorStructures.Evaluate(kv, qv, values);
                    return values[ia] * values[ib];
                }

                // The structures depend on q only through q_z, p_z, q·p and lengths, all even under φ → −φ
                // (reflection y → −y), so ∫_0^{2π} = 2∫_0^π.
                double azimuth = GaussLegendreRule.Integrate(Azimuth, 0.0, Math.PI, AzimuthNodes);
                return 2.0 * azimuth * Spectrum(p) * p * p / (k * q);
            }

            // P vanishes outside the table: integrate only p ∈ [max(|k − q|, qMin), min(k + q, qMax)].
            double lower = Math.Log(Math.Max(gap, qMin));
            double upper = Math.Log(Math.Min(k + q, qMax));
            double inner = upper > lower
                ? GaussKronrodRule.Integrate(Middle, lower, upper, out _, out _, MiddleTolerance, MaximumDepth, 15)
                : 0.0;
            return q * q * Spectrum(q) * inner;
        }

        // Outside [k/2, 2k] in u = ln q (dq = q du). Inside, in w = ln|q − k| (dq = e^w dw), because the outer
        // integrand has a logarithmic kink at q = k (where p → 0) that w turns into a smooth tail.
        double low = Math.Log(ClosestApproach * k);
        double sum = GaussKronrodRule.Integrate(u => Math.Exp(u) * Outer(Math.Exp(u)), Math.Log(qMin), Math.Log(0.5 * k), out _, out _, OuterTolerance, MaximumDepth, 15)
            + GaussKronrodRule.Integrate(w => Math.Exp(w) * Outer(k - Math.Exp(w)), low, Math.Log(0.5 * k), out _, out _, OuterTolerance, MaximumDepth, 15)
            + GaussKronrodRule.Integrate(w => Math.Exp(w) * Outer(k + Math.Exp(w)), low, Math.Log(k), out _, out _, OuterTolerance, MaximumDepth, 15)
            + GaussKronrodRule.Integrate(u => Math.Exp(u) * Outer(Math.Exp(u)), Math.Log(2.0 * k), Math.Log(qMax), out _, out _, OuterTolerance, MaximumDepth, 15);

        // 2∫d³q/(2π)³ = (2/(2π)³)∫q² dq dx dφ.
        return 2.0 * sum / (8.0 * Math.PI * Math.PI * Math.PI);
    }

    private double Spectrum(double q) => q >= qMin && q <= qMax ? spectrum(q) : 0.0;
}
