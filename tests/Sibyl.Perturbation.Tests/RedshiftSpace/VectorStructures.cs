using Sibyl.Perturbation.Kernels;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>
/// The seven redshift-space P_22 structures written literally with 3-D vectors (project lead's definitions),
/// independent of the engine's φ-averaged decomposition; line of sight +z.
/// </summary>
internal static class VectorStructures
{
    /// <summary>Number of structures.</summary>
    public const int Count = 7;

    /// <summary>
    /// k = k(ν, 0, μ) and q = q[x k̂ + s(cos φ ê1 + sin φ ê2)] with ê1 = (μ, 0, −ν), ê2 = ŷ, ν = √(1 − μ²);
    /// s = √(1 − x²) is passed in so that callers near x = ±1 can form it without cancellation.
    /// </summary>
    public static (Wavevector K, Wavevector Q) Configuration(double k, double mu, double q, double x, double s, double phi)
    {
        double nu = Math.Sqrt(Math.Max(0.0, 1.0 - (mu * mu)));
        double c = Math.Cos(phi), sn = Math.Sin(phi);
        var kv = new Wavevector(k * nu, 0.0, k * mu);
        var qv = new Wavevector(
            q * ((x * nu) + (s * c * mu)),
            q * s * sn,
            q * ((x * mu) - (s * c * nu)));
        return (kv, qv);
    }

    /// <summary>As the other overload, with s = √(1 − x²) formed here.</summary>
    public static (Wavevector K, Wavevector Q) Configuration(double k, double mu, double q, double x, double phi) =>
        Configuration(k, mu, q, x, Math.Sqrt(Math.Max(0.0, 1.0 - (x * x))), phi);

    /// <summary>S_a(q, k − q) for all seven structures, in <see cref="RedshiftP22Structure"/> order.</summary>
    public static void Evaluate(Wavevector k, Wavevector q, Span<double> values)
    {
        var p = k + (-q);
        double mu2 = k.Z * k.Z / k.LengthSquared;
        double alpha = ModeCoupling.AlphaSymmetric(q, p);
        double gamma = ModeCoupling.Gamma(q, p);
        double q2 = q.LengthSquared, p2 = p.LengthSquared;
        values[(int)RedshiftP22Structure.AlphaS] = alpha;
        values[(int)RedshiftP22Structure.Gamma] = gamma;
        values[(int)RedshiftP22Structure.One] = 1.0;
        values[(int)RedshiftP22Structure.Mu2AlphaS] = mu2 * alpha;
        values[(int)RedshiftP22Structure.Mu2Gamma] = mu2 * gamma;
        values[(int)RedshiftP22Structure.L1] = 0.5 * k.Z * ((q.Z / q2) + (p.Z / p2));
        values[(int)RedshiftP22Structure.L2] = 0.5 * k.Z * k.Z * q.Z * p.Z / (q2 * p2);
    }
}
