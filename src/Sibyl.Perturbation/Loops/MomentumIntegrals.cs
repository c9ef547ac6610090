namespace Sibyl.Perturbation.Loops;

/// <summary>
/// Preallocated results of the one-loop momentum integrals at every k of a <see cref="LoopQuadrature"/>:
/// the three P_22 integrals J_S(k) and the six P_13 integrals I_s(k), each an array over k.
/// </summary>
/// <remarks>J_S is in (Mpc/h)³ (it carries two powers of P and one of d³q); I_s is in (h/Mpc)³·(Mpc/h)³ = dimensionless.</remarks>
public sealed class MomentumIntegrals
{
    /// <summary>Number of P_22 structures.</summary>
    public const int P22StructureCount = 3;

    /// <summary>Number of P_13 structures.</summary>
    public const int P13StructureCount = 6;

    private readonly double[] _p22;
    private readonly double[] _p13;

    /// <summary>Allocates storage for <paramref name="kCount"/> wavenumbers.</summary>
    /// <param name="kCount">Number of output wavenumbers, at least 1.</param>
    public MomentumIntegrals(int kCount)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(kCount, 1);
        KCount = kCount;
        _p22 = new double[P22StructureCount * kCount];
        _p13 = new double[P13StructureCount * kCount];
    }

    /// <summary>Number of output wavenumbers.</summary>
    public int KCount { get; }

    /// <summary>J_S(k) over the output k grid, in (Mpc/h)³.</summary>
    /// <param name="structure">Which P_22 structure.</param>
    public ReadOnlySpan<double> this[P22Structure structure] => P22Row(structure);

    /// <summary>I_s(k) over the output k grid (dimensionless).</summary>
    /// <param name="structure">Which P_13 structure.</param>
    public ReadOnlySpan<double> this[P13Structure structure] => P13Row(structure);

    /// <summary>Writable row of J_S.</summary>
    internal Span<double> P22Row(P22Structure structure) =>
        _p22.AsSpan(CheckedIndex((int)structure, P22StructureCount) * KCount, KCount);

    /// <summary>Writable row of I_s.</summary>
    internal Span<double> P13Row(P13Structure structure) =>
        _p13.AsSpan(CheckedIndex((int)structure, P13StructureCount) * KCount, KCount);

    /// <summary>All J_S rows, structure-major (row S at S·KCount).</summary>
    internal Span<double> AllP22 => _p22;

    /// <summary>All I_s rows, structure-major (row s at s·KCount).</summary>
    internal Span<double> AllP13 => _p13;

    private static int CheckedIndex(int index, int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(index);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(index, count);
        return index;
    }
}
