using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The two angular kernels that redshift space adds to P_13, from the term k_z² (q_z/q²) f (p_z/p²) V2(k, −q)
/// of Z3 (p = k − q) after the azimuthal average: in units k = 1 with r = q/k, x = k̂·q̂, p² = 1 + r² − 2rx,
/// K_DisplacementAlpha(r) = ∫_{−1}^{1} (x/r)(1 − r x)/p² · [1 − (x/2)(r + 1/r)] dx and
/// K_DisplacementGamma(r) = ∫_{−1}^{1} (x/r)(1 − r x)/p² · (1 − x²) dx.
/// Both are N(x)/p² with N a cubic or quartic polynomial: far from r = 1 Gauss–Legendre with 48 nodes is exact
/// to rounding (the pole at x0 = (1 + r²)/2r lies ≥ 1/4 outside [−1, 1], so the error falls like 4^{−48});
/// for 1/2 &lt; r &lt; 2 the pole is subtracted exactly, ∫N/p² = (N(x0)/r) ln|(1+r)/(1−r)| − (1/2r)∫Q, with
/// N(x) = N(x0) + (x − x0) Q(x).
/// </summary>
internal static class DisplacementKernels
{
    /// <summary>Number of kernels.</summary>
    public const int Count = 2;

    /// <summary>Index of K_DisplacementAlpha.</summary>
    public const int Alpha = 0;

    /// <summary>Index of K_DisplacementGamma.</summary>
    public const int Gamma = 1;

    private static readonly GaussLegendreRule Rule = GaussLegendreRule.Create(48);

    /// <summary>Writes both kernels at r = q/k &gt; 0.</summary>
    public static void Evaluate(double r, Span<double> kernels)
    {
        kernels[Alpha] = Integral(r, Numerator(r, alpha: true));
        kernels[Gamma] = Integral(r, Numerator(r, alpha: false));
    }

    private static Func<double, double> Numerator(double r, bool alpha) => alpha
        ? x => x / r * (1.0 - r * x) * (1.0 - 0.5 * x * (r + 1.0 / r))
        : x => x / r * (1.0 - r * x) * (1.0 - x * x);

    private static double Integral(double r, Func<double, double> numerator)
    {
        double sum = 0.0;
        if (r <= 0.5 || r >= 2.0)
        {
            for (int n = 0; n < Rule.Count; n++)
            {
                double x = Rule.Nodes[n];
                sum += Rule.Weights[n] * numerator(x) / (1.0 + r * r - 2.0 * r * x);
            }

            return sum;
        }

        double x0 = (1.0 + r * r) / (2.0 * r);
        double atPole = numerator(x0);
        for (int n = 0; n < Rule.Count; n++)
        {
            double x = Rule.Nodes[n];
            sum += Rule.Weights[n] * (numerator(x) - atPole) / (x - x0);
        }

        // N(x0) vanishes at r = 1 (x0 = 1, 1 − r x0 = 0) faster than the logarithm grows.
        double logarithm = Math.Abs(1.0 - r) < 1e-15 ? 0.0 : atPole / r * Math.Log(Math.Abs((1.0 + r) / (1.0 - r)));
        return logarithm - sum / (2.0 * r);
    }
}
