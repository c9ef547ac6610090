using MathNet.Numerics.Integration;
using GaussLegendreRule = MathNet.Numerics.Integration.GaussLegendreRule;
using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Tests.Loops;

/// <summary>
/// Slow, independent referee for the nine momentum integrals: MathNet adaptive Gauss–Kronrod outside,
/// MathNet Gauss–Legendre (or Gauss–Kronrod near the P_13 pole) inside, structures taken literally from
/// their definitions in the natural variables (q, x), and P from <see cref="LogSampledSpectrum.Evaluate"/>
/// (zero outside the table), so it integrates exactly what the engine integrates.
/// </summary>
internal sealed class BruteForceReferee(LogSampledSpectrum spectrum)
{
    // Asked-for relative accuracy of the outer adaptive integrals; the tests compare at 1e-3, 1000× looser.
    private const double OuterTolerance = 1e-8;

    private readonly LogSampledSpectrum _spectrum = spectrum;

    /// <summary>I_s(k) = (1/4π²)∫du q³ P(q) ∫dx M_s(x, q/k), u = ln q.</summary>
    public double P13(P13Structure structure, double k)
    {
        double Outer(double u)
        {
            double q = Math.Exp(u);
            return q * q * q * _spectrum.Evaluate(q) * Kernel((int)structure, q / k);
        }

        return OuterIntegral(Outer, [Math.Log(_spectrum.QMin), Math.Log(k), Math.Log(_spectrum.QMax)]) / (4.0 * Math.PI * Math.PI);
    }

    /// <summary>
    /// J_S(k) = 2∫d³q/(2π)³ S P(q)P(p) for the three structures: by the q ↔ k − q symmetry, twice the part with
    /// p ≥ q, i.e. x ≤ k/(2q): J = (1/π²)∫du q³ P(q) ∫_{−1}^{min(1, k/2q)} dx S P(p). One adaptive outer integral
    /// per structure; the inner integrals of all three are computed together and remembered per outer node.
    /// </summary>
    public double[] P22(double k)
    {
        var inner = new Dictionary<double, double[]>();
        double[] InnerAll(double u)
        {
            if (!inner.TryGetValue(u, out double[]? values))
            {
                values = new double[3];
                double q = Math.Exp(u);
                double top = Math.Min(1.0, k / (2.0 * q));
                // Split where p crosses the table's end, where P jumps to zero.
                double cut = ((k * k) + (q * q) - (_spectrum.QMax * _spectrum.QMax)) / (2.0 * k * q);
                double span = 2.0 * Math.Min(k, q);
                double weight = q * q * q * _spectrum.Evaluate(q);
                for (int s = 0; s < 3; s++)
                {
                    int structure = s;
                    double Inner(double x)
                    {
                        double p = Math.Sqrt((k * k) + (q * q) - (2.0 * k * q * x));
                        double mu = ((k * q * x) - (q * q)) / (q * p);
                        return DefinitionStructures.P22(structure, q, p, mu) * _spectrum.Evaluate(p);
                    }

                    double integral = cut > -1.0 && cut < top
                        ? Panels(Inner, -1.0, cut, span) + Panels(Inner, cut, top, span)
                        : Panels(Inner, -1.0, top, span);
                    values[s] = weight * integral;
                }

                inner[u] = values;
            }

            return values;
        }

        var result = new double[3];
        double[] breakpoints = [Math.Log(_spectrum.QMin), Math.Log(0.5 * k), Math.Log(_spectrum.QMax)];
        for (int s = 0; s < 3; s++)
        {
            int structure = s;
            result[s] = OuterIntegral(u => InnerAll(u)[structure], breakpoints) / (Math.PI * Math.PI);
        }

        return result;
    }

    /// <summary>K_s(r) = ∫dx M_s(x, r) from the literal definition.</summary>
    public static double Kernel(int structure, double r)
    {
        double gap = Math.Abs(1.0 - r);
        if (gap > 0.3)
        {
            // The integrand is analytic on [−1, 1] with its pole ≥ 1.04 away: 64 nodes reach rounding.
            return GaussLegendreRule.Integrate(x => DefinitionStructures.P13(structure, x, r), -1.0, 1.0, 64);
        }

        // Near the pole use t = ln p² (dx = −p² dt/(2r)): M_s·p²/(2r) is then a polynomial in e^t, with no peak.
        // Panels of width ≤ 1 in t, 16 Gauss–Legendre nodes each; below p² = 1e-30(1 + r)² the integrand is < 1e-30.
        double lower = Math.Log(Math.Max(gap * gap, 1e-30 * (1.0 + r) * (1.0 + r)));
        double upper = 2.0 * Math.Log(1.0 + r);
        double Integrand(double t)
        {
            double p2 = Math.Exp(t);
            double x = (1.0 + (r * r) - p2) / (2.0 * r);
            return DefinitionStructures.P13(structure, x, r) * p2 / (2.0 * r);
        }

        int panels = (int)Math.Ceiling(upper - lower);
        double width = (upper - lower) / panels;
        double sum = 0.0;
        for (int i = 0; i < panels; i++)
        {
            sum += GaussLegendreRule.Integrate(Integrand, lower + (i * width), lower + ((i + 1) * width), 16);
        }

        return sum;
    }

    /// <summary>Adaptive Gauss–Kronrod over consecutive pieces (breakpoints at kinks of the integrand).</summary>
    public static double OuterIntegral(Func<double, double> f, double[] breakpoints)
    {
        double sum = 0.0;
        for (int i = 0; i + 1 < breakpoints.Length; i++)
        {
            if (breakpoints[i + 1] > breakpoints[i])
            {
                sum += GaussKronrodRule.Integrate(f, breakpoints[i], breakpoints[i + 1], out _, out _, OuterTolerance, 15, 31);
            }
        }

        return sum;
    }

    /// <summary>
    /// Gauss–Legendre panels, 16 nodes each, one panel per 0.04 h/Mpc of the span of p = |k − q| (at least two):
    /// ≥ 24 nodes per wiggle period of 0.06 h/Mpc.
    /// </summary>
    private static double Panels(Func<double, double> f, double a, double b, double pSpan)
    {
        int panelCount = Math.Max(2, (int)Math.Ceiling(pSpan / 0.04));
        double width = (b - a) / panelCount;
        double sum = 0.0;
        for (int i = 0; i < panelCount; i++)
        {
            sum += GaussLegendreRule.Integrate(f, a + (i * width), a + ((i + 1) * width), 16);
        }

        return sum;
    }
}
