namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The seven functions of (k, q, p) that span every φ-averaged product ⟨S_a S_b⟩_φ of the redshift-space P_22
/// structures: α_s², α_sγ, γ², α_s, γ, 1 and β² = γ (p² − q²)²/(4q²p²), all symmetric under q ↔ p.
/// </summary>
/// <remarks>
/// <para>
/// In the frame of k̂ write q = a k̂ + h(cos φ ê1 + sin φ ê2) with a = k̂·q = (k² + q² − p²)/(2k), so p = b k̂ − (…)
/// with b = k − a, and t = ν cos φ, ν = √(1 − μ²). Then q_z = aμ + h t, p_z = bμ − h t, and
/// L1 = Aμ² + Bμt, L2 = μ²(Cμ² + Bμt + E t²), with
/// A = (k/2)(a/q² + b/p²), B = (k h/2)(1/q² − 1/p²), C = k²ab/(2q²p²), E = −k²h²/(2q²p²).
/// Three identities collapse these onto α_s and γ: h² = q²p²γ/k² (|q × k̂| = |q × p|/k), so E = −γ/2 and
/// B² = γ(p² − q²)²/(4q²p²) = β²; 2k(ap² + bq²) = k²(q² + p²) − (p² − q²)², so A = α_s; and
/// 8q²p²C = k⁴ − (p² − q²)² = 4q²p²(2α_s − γ), so C = α_s − γ/2. Only even powers of B survive the φ average.
/// </para>
/// <para>
/// Small factors are formed directly: with Δ = p − q and σ = q + p,
/// 4q²p²α_s = k²(q² + p²) − Δ²σ² and 4q²p²γ = (k² − Δ²)(σ² − k²), as in the real-space weights.
/// </para>
/// </remarks>
internal sealed class RedshiftP22BaseFunctions : IPairStructureFunctions
{
    /// <summary>Index of α_s².</summary>
    public const int AlphaAlpha = 0;

    /// <summary>Index of α_sγ.</summary>
    public const int AlphaGamma = 1;

    /// <summary>Index of γ².</summary>
    public const int GammaGamma = 2;

    /// <summary>Index of α_s.</summary>
    public const int Alpha = 3;

    /// <summary>Index of γ.</summary>
    public const int Gamma = 4;

    /// <summary>Index of the constant 1.</summary>
    public const int One = 5;

    /// <summary>Index of β² = γ(p² − q²)²/(4q²p²), the square of the transverse part of L1.</summary>
    public const int BetaSquared = 6;

    /// <summary>Number of base functions.</summary>
    public const int FunctionCount = 7;

    /// <summary>The single instance (the functions carry no state).</summary>
    public static readonly RedshiftP22BaseFunctions Instance = new();

    private RedshiftP22BaseFunctions()
    {
    }

    /// <inheritdoc/>
    public int Count => FunctionCount;

    /// <inheritdoc/>
    public void Evaluate(double k, double q, double p, Span<double> values)
    {
        double difference = p - q;
        double sum = q + p;
        double quarterInverse = 0.25 / (q * q * p * p);
        double alpha = ((k * k * ((q * q) + (p * p))) - (difference * difference * sum * sum)) * quarterInverse;
        double gamma = (k - difference) * (k + difference) * (sum - k) * (sum + k) * quarterInverse;
        double squares = difference * sum;
        values[AlphaAlpha] = alpha * alpha;
        values[AlphaGamma] = alpha * gamma;
        values[GammaGamma] = gamma * gamma;
        values[Alpha] = alpha;
        values[Gamma] = gamma;
        values[One] = 1.0;
        values[BetaSquared] = gamma * squares * squares * quarterInverse;
    }
}
