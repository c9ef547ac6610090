namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The φ-averaged coefficients ⟨S_a S_b⟩_φ = Σ_n c_{ab,n} μ^{2n}: which (a, b, n) are distinct and non-zero, where
/// each is stored, and each one as a combination of the seven <see cref="RedshiftP22BaseFunctions"/>.
/// </summary>
/// <remarks>
/// <para>
/// Every structure is μ^{2m} times one of five bases: α_s, γ, 1 (m = 0 or 1), L1 and L2 (m = 0), so
/// c_{ab,n} = c_{base(a) base(b), n − m_a − m_b}; J_{Mu2AlphaS,Gamma,1} is the same integral as J_{AlphaS,Gamma,0}.
/// </para>
/// <para>
/// With L1 = α_sμ² + Bμt and L2 = μ²[(α_s − γ/2)μ² + Bμt − (γ/2)t²] (t = ν cos φ, see
/// <see cref="RedshiftP22BaseFunctions"/>), ⟨t²⟩ = ν²/2, ⟨t⁴⟩ = 3ν⁴/8, odd powers 0 and ν² = 1 − μ²:
/// R·L1 → Rα_s μ²; R·L2 → −(Rγ/4)μ² + R(α_s − γ/4)μ⁴ for R ∈ {α_s, γ, 1};
/// L1² → (β²/2)μ² + (α_s² − β²/2)μ⁴; L1·L2 → (β²/2 − α_sγ/4)μ⁴ + (α_s² − α_sγ/4 − β²/2)μ⁶;
/// L2² → (3γ²/32)μ⁴ + (β²/2 − α_sγ/2 + γ²/16)μ⁶ + (α_s² − α_sγ/2 + 3γ²/32 − β²/2)μ⁸.
/// Every other (base pair, n) vanishes identically. 22 rows remain, spanned by 7 functions.
/// </para>
/// </remarks>
internal static class RedshiftP22Layout
{
    /// <summary>Number of powers μ^{2n}, n = 0..4.</summary>
    public const int PowerCount = 5;

    private const int AlphaBase = 0;
    private const int GammaBase = 1;
    private const int OneBase = 2;
    private const int L1Base = 3;
    private const int L2Base = 4;
    private const int BaseCount = 5;

    private const int AA = RedshiftP22BaseFunctions.AlphaAlpha;
    private const int AG = RedshiftP22BaseFunctions.AlphaGamma;
    private const int GG = RedshiftP22BaseFunctions.GammaGamma;
    private const int A = RedshiftP22BaseFunctions.Alpha;
    private const int G = RedshiftP22BaseFunctions.Gamma;
    private const int O = RedshiftP22BaseFunctions.One;
    private const int BB = RedshiftP22BaseFunctions.BetaSquared;

    // The distinct rows (base a ≤ base b, power n), each Σ weight·(base function), from the remarks' expansions.
    private static readonly Row[] Rows =
    [
        new(AlphaBase, AlphaBase, 0, [(AA, 1.0)]),
        new(AlphaBase, GammaBase, 0, [(AG, 1.0)]),
        new(AlphaBase, OneBase, 0, [(A, 1.0)]),
        new(GammaBase, GammaBase, 0, [(GG, 1.0)]),
        new(GammaBase, OneBase, 0, [(G, 1.0)]),
        new(OneBase, OneBase, 0, [(O, 1.0)]),
        new(AlphaBase, L1Base, 1, [(AA, 1.0)]),
        new(GammaBase, L1Base, 1, [(AG, 1.0)]),
        new(OneBase, L1Base, 1, [(A, 1.0)]),
        new(AlphaBase, L2Base, 1, [(AG, -0.25)]),
        new(GammaBase, L2Base, 1, [(GG, -0.25)]),
        new(OneBase, L2Base, 1, [(G, -0.25)]),
        new(AlphaBase, L2Base, 2, [(AA, 1.0), (AG, -0.25)]),
        new(GammaBase, L2Base, 2, [(AG, 1.0), (GG, -0.25)]),
        new(OneBase, L2Base, 2, [(A, 1.0), (G, -0.25)]),
        new(L1Base, L1Base, 1, [(BB, 0.5)]),
        new(L1Base, L1Base, 2, [(AA, 1.0), (BB, -0.5)]),
        new(L1Base, L2Base, 2, [(BB, 0.5), (AG, -0.25)]),
        new(L1Base, L2Base, 3, [(AA, 1.0), (AG, -0.25), (BB, -0.5)]),
        new(L2Base, L2Base, 2, [(GG, 3.0 / 32.0)]),
        new(L2Base, L2Base, 3, [(BB, 0.5), (AG, -0.5), (GG, 1.0 / 16.0)]),
        new(L2Base, L2Base, 4, [(AA, 1.0), (AG, -0.5), (GG, 3.0 / 32.0), (BB, -0.5)]),
    ];

    // Row of (base a, base b, n) for both orders of a, b; −1 where the coefficient vanishes identically.
    private static readonly int[] BaseIndex = BuildBaseIndex();

    /// <summary>Number of distinct, non-vanishing rows.</summary>
    public static int RowCount => Rows.Length;

    /// <summary>The row of c_{ab,n}, or −1 when it vanishes identically; a, b in either order.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A structure is undefined or n is outside 0..4.</exception>
    public static int RowIndex(RedshiftP22Structure a, RedshiftP22Structure b, int muPower)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(muPower);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(muPower, PowerCount);
        (int baseA, int shiftA) = BaseOf(a);
        (int baseB, int shiftB) = BaseOf(b);
        int power = muPower - shiftA - shiftB;
        return power < 0 ? -1 : BaseIndex[(((baseA * BaseCount) + baseB) * PowerCount) + power];
    }

    /// <summary>Every row = Σ weight·base, over k; rows and bases are function-major (index·kCount + k).</summary>
    public static void Assemble(ReadOnlySpan<double> bases, Span<double> rows, int kCount)
    {
        for (int r = 0; r < Rows.Length; r++)
        {
            Span<double> target = rows.Slice(r * kCount, kCount);
            target.Clear();
            foreach ((int function, double weight) in Rows[r].Terms)
            {
                ReadOnlySpan<double> source = bases.Slice(function * kCount, kCount);
                for (int k = 0; k < kCount; k++)
                {
                    target[k] += weight * source[k];
                }
            }
        }
    }

    /// <summary>c_{ab,n} at one (k, q, p) from the base-function values there (zero where it vanishes identically).</summary>
    public static double Coefficient(ReadOnlySpan<double> baseValues, RedshiftP22Structure a, RedshiftP22Structure b, int muPower)
    {
        int row = RowIndex(a, b, muPower);
        if (row < 0)
        {
            return 0.0;
        }

        double sum = 0.0;
        foreach ((int function, double weight) in Rows[row].Terms)
        {
            sum += weight * baseValues[function];
        }

        return sum;
    }

    private static (int Base, int Shift) BaseOf(RedshiftP22Structure structure) => structure switch
    {
        RedshiftP22Structure.AlphaS => (AlphaBase, 0),
        RedshiftP22Structure.Gamma => (GammaBase, 0),
        RedshiftP22Structure.One => (OneBase, 0),
        RedshiftP22Structure.Mu2AlphaS => (AlphaBase, 1),
        RedshiftP22Structure.Mu2Gamma => (GammaBase, 1),
        RedshiftP22Structure.L1 => (L1Base, 0),
        RedshiftP22Structure.L2 => (L2Base, 0),
        _ => throw new ArgumentOutOfRangeException(nameof(structure), structure, "Not a redshift-space P_22 structure."),
    };

    private static int[] BuildBaseIndex()
    {
        var index = new int[BaseCount * BaseCount * PowerCount];
        Array.Fill(index, -1);
        for (int r = 0; r < Rows.Length; r++)
        {
            Row row = Rows[r];
            index[(((row.BaseA * BaseCount) + row.BaseB) * PowerCount) + row.Power] = r;
            index[(((row.BaseB * BaseCount) + row.BaseA) * PowerCount) + row.Power] = r;
        }

        return index;
    }

    private sealed record Row(int BaseA, int BaseB, int Power, (int Function, double Weight)[] Terms);
}
