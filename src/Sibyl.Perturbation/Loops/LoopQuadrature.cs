namespace Sibyl.Perturbation.Loops;

/// <summary>
/// A precomputed, cosmology-independent plan that evaluates the nine one-loop momentum integrals — J_S for the
/// three <see cref="P22Structure"/>s and I_s for the six <see cref="P13Structure"/>s — at a fixed ascending
/// grid of output wavenumbers, for one spectrum or for two at once (a linear spectrum and its no-wiggle
/// partner share every pass over the precomputed weights).
/// </summary>
/// <remarks>
/// <para>
/// Method: product integration. At run time each spectrum is resampled on the plan's own grid of a few hundred
/// nodes in ln q (≤ 0.1 apart in ln q, ≤ 0.007 h/Mpc apart below q = 0.7 h/Mpc to resolve baryon wiggles).
/// The plan holds, for every output k, the integrals of each structure against the piecewise-cubic basis
/// functions of that grid, computed once by nested Gauss–Legendre quadrature (graded towards the P_13 kernel
/// kink at q = k; split at every grid node and at q = k/2 for P_22). A cosmology then costs only dot products:
/// I_s(k) = Σ_i W_s,i(k) P_i and J_S(k) = Σ_i P_i Σ_j W_S,ij(k) P_j over a band of j.
/// </para>
/// <para>
/// Both integrals are truncated to the spectrum's table range, exactly as if P were zero outside it.
/// Evaluation allocates nothing and is thread-safe; the plan is immutable after construction.
/// </para>
/// </remarks>
public sealed class LoopQuadrature
{
    /// <summary>Each output k must lie at least this factor inside both ends of the table range (dimensionless).</summary>
    public const double RangeMargin = 10.0;

    private readonly double[] _k;
    private readonly ProductGrid _grid;
    private readonly P13WeightTable _p13;
    private readonly P22BandTable _p22;

    /// <summary>Builds the plan for output wavenumbers <paramref name="k"/> and a table range [qMin, qMax].</summary>
    /// <param name="k">Output wavenumbers in h/Mpc: finite, positive, strictly increasing, and within
    /// [qMin·<see cref="RangeMargin"/>, qMax/<see cref="RangeMargin"/>]. Copied.</param>
    /// <param name="qMin">Lower end of the spectra's tables, h/Mpc.</param>
    /// <param name="qMax">Upper end of the spectra's tables, h/Mpc.</param>
    /// <exception cref="ArgumentException">A wavenumber or the range is invalid; the message names the value.</exception>
    public LoopQuadrature(
        ReadOnlySpan<double> k,
        double qMin = LogSampledSpectrum.DefaultQMin,
        double qMax = LogSampledSpectrum.DefaultQMax)
    {
        PlanArguments.ValidateRange(qMin, qMax);
        PlanArguments.ValidateWavenumbers(k, qMin, qMax);
        QMin = qMin;
        QMax = qMax;
        _k = k.ToArray();
        _grid = new ProductGrid(qMin, qMax);
        _p13 = new P13WeightTable(_grid, _k, P13Kernels.Count, P13Kernels.Evaluate);
        _p22 = new P22BandTable(_grid, _k);
    }

    /// <summary>The output wavenumbers, h/Mpc.</summary>
    public ReadOnlySpan<double> K => _k;

    /// <summary>Number of output wavenumbers.</summary>
    public int KCount => _k.Length;

    /// <summary>Lower end of the table range the plan expects, h/Mpc.</summary>
    public double QMin { get; }

    /// <summary>Upper end of the table range the plan expects, h/Mpc.</summary>
    public double QMax { get; }

    /// <summary>Number of nodes of the resampling grid (a measure of the plan's cost).</summary>
    public int GridCount => _grid.Count;

    /// <summary>Number of stored P_22 weight pairs per structure, summed over k (a measure of the plan's cost).</summary>
    public int P22PairCount => _p22.PairCount;

    /// <summary>Computes all nine integrals of one spectrum at every output k.</summary>
    /// <param name="spectrum">Linear spectrum whose table spans exactly [<see cref="QMin"/>, <see cref="QMax"/>].</param>
    /// <param name="result">Destination with <see cref="KCount"/> wavenumbers; overwritten.</param>
    /// <exception cref="ArgumentException">The spectrum's range or the result's size does not match the plan.</exception>
    public void Compute(LogSampledSpectrum spectrum, MomentumIntegrals result)
    {
        ValidateInputs(spectrum, result, nameof(spectrum), nameof(result));
        Span<double> resampled = stackalloc double[_grid.Count + P22BandTable.Padding];
        Resample(spectrum, resampled);
        _p13.Accumulate(resampled[.._grid.Count], result.AllP13);
        _p22.Accumulate(resampled, result.AllP22);
    }

    /// <summary>Computes all nine integrals of two spectra (for example with and without wiggles) in shared passes.</summary>
    /// <param name="first">First spectrum, table spanning exactly [<see cref="QMin"/>, <see cref="QMax"/>].</param>
    /// <param name="second">Second spectrum, same range.</param>
    /// <param name="firstResult">Destination for <paramref name="first"/>; overwritten.</param>
    /// <param name="secondResult">Destination for <paramref name="second"/>; overwritten; must differ from <paramref name="firstResult"/>.</param>
    /// <exception cref="ArgumentException">A range or size does not match the plan, or both results are the same object.</exception>
    public void Compute(LogSampledSpectrum first, LogSampledSpectrum second, MomentumIntegrals firstResult, MomentumIntegrals secondResult)
    {
        ValidateInputs(first, firstResult, nameof(first), nameof(firstResult));
        ValidateInputs(second, secondResult, nameof(second), nameof(secondResult));
        PlanArguments.RequireDistinct(firstResult, secondResult, nameof(secondResult));

        Span<double> resampledFirst = stackalloc double[_grid.Count + P22BandTable.Padding];
        Span<double> resampledSecond = stackalloc double[_grid.Count + P22BandTable.Padding];
        Resample(first, resampledFirst);
        Resample(second, resampledSecond);
        _p13.Accumulate(resampledFirst[.._grid.Count], resampledSecond[.._grid.Count], firstResult.AllP13, secondResult.AllP13);
        _p22.Accumulate(resampledFirst, resampledSecond, firstResult.AllP22, secondResult.AllP22);
    }

    private void Resample(LogSampledSpectrum spectrum, Span<double> destination) => _grid.Resample(spectrum, destination);

    private void ValidateInputs(LogSampledSpectrum spectrum, MomentumIntegrals result, string spectrumName, string resultName)
    {
        ArgumentNullException.ThrowIfNull(spectrum, spectrumName);
        ArgumentNullException.ThrowIfNull(result, resultName);
        PlanArguments.ValidateInputs(spectrum, result.KCount, QMin, QMax, KCount, spectrumName, resultName);
    }
}
