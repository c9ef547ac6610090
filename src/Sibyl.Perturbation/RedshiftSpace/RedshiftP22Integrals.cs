namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// Preallocated results of <see cref="RedshiftP22Quadrature"/>: for every unordered pair of
/// <see cref="RedshiftP22Structure"/>s (a, b) and power n, the integral
/// J_{ab,n}(k) = 2∫d³q/(2π)³ c_{ab,n}(k, q, |k − q|) P(q) P(|k − q|), where ⟨S_a S_b⟩_φ = Σ_{n=0..4} c_{ab,n} μ^{2n}
/// is the product of the two structures averaged over the azimuth of q around k.
/// </summary>
/// <remarks>
/// <para>
/// Convention: for Z2 = Σ_a C_a S_a (C_a the cosmology- and bias-dependent coefficients),
/// P_22(k, μ) = Σ_a Σ_b C_a C_b Σ_n J_{ab,n}(k) μ^{2n} with the sum over ORDERED pairs: a cross pair a ≠ b
/// appears twice (as (a, b) and (b, a)), and <see cref="Get"/> returns the same row for both orders.
/// </para>
/// <para>
/// Units: J is in (Mpc/h)³ (two powers of P, one of d³q; the structures are dimensionless). Coefficients that
/// vanish identically are neither stored nor computed; <see cref="Get"/> returns zeros for them. Rows that are
/// the same integral (for example (Mu2AlphaS, Gamma, 1) and (AlphaS, Gamma, 0)) share storage.
/// </para>
/// </remarks>
public sealed class RedshiftP22Integrals
{
    private readonly double[] _rows;
    private readonly double[] _bases;
    private readonly double[] _zeros;

    /// <summary>Allocates storage for <paramref name="kCount"/> wavenumbers.</summary>
    /// <param name="kCount">Number of output wavenumbers, at least 1.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="kCount"/> is below 1.</exception>
    public RedshiftP22Integrals(int kCount)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(kCount, 1);
        KCount = kCount;
        _rows = new double[RedshiftP22Layout.RowCount * kCount];
        _bases = new double[RedshiftP22BaseFunctions.FunctionCount * kCount];
        _zeros = new double[kCount];
    }

    /// <summary>Number of output wavenumbers.</summary>
    public int KCount { get; }

    /// <summary>Storage of the base-function integrals, function-major, filled by the plan before <see cref="Rows"/>.</summary>
    internal Span<double> Bases => _bases;

    /// <summary>Storage of the distinct non-zero J_{ab,n}, row-major (row·KCount + k).</summary>
    internal Span<double> Rows => _rows;

    /// <summary>J_{ab,n}(k) over the output k grid, in (Mpc/h)³; zeros when c_{ab,n} vanishes identically.</summary>
    /// <param name="a">First structure (the order of a and b is irrelevant).</param>
    /// <param name="b">Second structure.</param>
    /// <param name="muPower">n of μ^{2n}, 0 to 4.</param>
    /// <exception cref="ArgumentOutOfRangeException">A structure is undefined or <paramref name="muPower"/> is outside 0..4.</exception>
    public ReadOnlySpan<double> Get(RedshiftP22Structure a, RedshiftP22Structure b, int muPower)
    {
        int row = RedshiftP22Layout.RowIndex(a, b, muPower);
        return row < 0 ? _zeros : _rows.AsSpan(row * KCount, KCount);
    }
}
