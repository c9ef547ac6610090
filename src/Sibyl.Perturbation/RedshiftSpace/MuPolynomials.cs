namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// Per-monomial polynomials in μ² at one k: coefficient of μ^{2n} for <see cref="GalaxyMonomial"/> m at
/// index m·<see cref="Powers"/> + n. One-loop redshift-space terms reach μ⁸.
/// </summary>
public static class MuPolynomials
{
    /// <summary>Powers n = 0..4 of μ².</summary>
    public const int Powers = 5;

    /// <summary>Number of monomials.</summary>
    public static readonly int Monomials = Enum.GetValues<GalaxyMonomial>().Length;

    /// <summary>Size of one k's block.</summary>
    public static int BlockSize => Monomials * Powers;

    /// <summary>Adds <paramref name="value"/> to the μ^{2n} coefficient of monomial <paramref name="m"/>.</summary>
    public static void Add(Span<double> block, GalaxyMonomial m, int n, double value) => block[((int)m * Powers) + n] += value;

    /// <summary>Evaluates monomial <paramref name="m"/>'s polynomial at μ².</summary>
    public static double Evaluate(ReadOnlySpan<double> block, GalaxyMonomial m, double mu2)
    {
        var c = block.Slice((int)m * Powers, Powers);
        return c[0] + (mu2 * (c[1] + (mu2 * (c[2] + (mu2 * (c[3] + (mu2 * c[4])))))));
    }
}
