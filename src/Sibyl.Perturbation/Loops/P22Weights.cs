namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The P_22 integrands q²p²·S(q, p) in the variables q = |q|, p = |k − q|, written so that the small factors
/// 1 ± μ are formed directly rather than by cancellation.
/// </summary>
/// <remarks>
/// With μ = (k² − q² − p²)/(2qp), Δ = p − q and σ = q + p:
/// 4q²p²·α_s = k²(q² + p²) − Δ²σ² and 4q²p²·γ = (k² − Δ²)(σ² − k²), because 1 + μ = (k² − Δ²)/(2qp) and
/// 1 − μ = (σ² − k²)/(2qp). So q²p²α_s² = A²/(16q²p²), q²p²α_sγ = AΓ/(16q²p²), q²p²γ² = Γ²/(16q²p²).
/// </remarks>
internal static class P22Weights
{
    /// <summary>Number of structures.</summary>
    public const int Count = MomentumIntegrals.P22StructureCount;

    /// <summary>Writes q²p²S for the three <see cref="P22Structure"/>s.</summary>
    public static void Evaluate(double k, double q, double p, Span<double> values)
    {
        double difference = p - q;
        double sum = q + p;
        double alphaTimes = (k * k * ((q * q) + (p * p))) - (difference * difference * sum * sum);
        double gammaTimes = (k - difference) * (k + difference) * (sum - k) * (sum + k);
        double inverse = 1.0 / (16.0 * q * q * p * p);
        values[0] = alphaTimes * alphaTimes * inverse;
        values[1] = alphaTimes * gammaTimes * inverse;
        values[2] = gammaTimes * gammaTimes * inverse;
    }
}
