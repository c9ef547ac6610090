using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// A precomputed, cosmology-independent plan for the momentum integrals J_{ab,n}(k) of the one-loop P_22 term of the
/// redshift-space galaxy power spectrum (see <see cref="RedshiftP22Integrals"/> for the definition and the
/// ordered-pair convention), at a fixed ascending grid of output wavenumbers, for one spectrum or two at once.
/// </summary>
/// <remarks>
/// <para>
/// Every φ-averaged product of the seven <see cref="RedshiftP22Structure"/>s is an exact combination of seven
/// functions of (k, q, p) (α_s², α_sγ, γ², α_s, γ, 1 and β² = γ(p² − q²)²/(4q²p²)), so the plan integrates only
/// those seven, by the same product integration as <see cref="LoopQuadrature"/>: each spectrum is resampled on the
/// plan's grid in ln q and J(k) = Σ_i P_i Σ_j W_ij(k) P_j with weights exact for its cubic interpolant. The 22
/// distinct non-zero J_{ab,n} are then fixed rational combinations of the seven.
/// </para>
/// <para>
/// The integrals are truncated to the spectrum's table range, exactly as if P were zero outside it. Evaluation
/// allocates nothing and is thread-safe for distinct results; the plan is immutable after construction.
/// </para>
/// </remarks>
public sealed class RedshiftP22Quadrature
{
    private readonly double[] _k;
    private readonly ProductGrid _grid;
    private readonly BandedProductTable _table;

    /// <summary>Builds the plan for output wavenumbers <paramref name="k"/> and a table range [qMin, qMax].</summary>
    /// <param name="k">Output wavenumbers in h/Mpc: finite, positive, strictly increasing, and within
    /// [qMin·<see cref="LoopQuadrature.RangeMargin"/>, qMax/<see cref="LoopQuadrature.RangeMargin"/>]. Copied.</param>
    /// <param name="qMin">Lower end of the spectra's tables, h/Mpc.</param>
    /// <param name="qMax">Upper end of the spectra's tables, h/Mpc.</param>
    /// <exception cref="ArgumentException">A wavenumber or the range is invalid; the message names the value.</exception>
    public RedshiftP22Quadrature(
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
        _table = new BandedProductTable(_grid, _k, RedshiftP22BaseFunctions.Instance);
    }

    /// <summary>The output wavenumbers, h/Mpc.</summary>
    public ReadOnlySpan<double> K => _k;

    /// <summary>Number of output wavenumbers.</summary>
    public int KCount => _k.Length;

    /// <summary>Lower end of the table range the plan expects, h/Mpc.</summary>
    public double QMin { get; }

    /// <summary>Upper end of the table range the plan expects, h/Mpc.</summary>
    public double QMax { get; }

    /// <summary>Number of nodes of the resampling grid.</summary>
    public int GridCount => _grid.Count;

    /// <summary>Bytes held by the precomputed weights and their index (a measure of the plan's memory).</summary>
    public long WeightBytes => _table.Bytes;

    /// <summary>Computes every J_{ab,n} of one spectrum at every output k.</summary>
    /// <param name="spectrum">Linear spectrum whose table spans exactly [<see cref="QMin"/>, <see cref="QMax"/>].</param>
    /// <param name="result">Destination with <see cref="KCount"/> wavenumbers; overwritten.</param>
    /// <exception cref="ArgumentException">The spectrum's range or the result's size does not match the plan.</exception>
    public void Compute(LogSampledSpectrum spectrum, RedshiftP22Integrals result)
    {
        ValidateInputs(spectrum, result, nameof(spectrum), nameof(result));
        Span<double> resampled = stackalloc double[_grid.Count];
        Resample(spectrum, resampled);
        _table.Accumulate(resampled, result.Bases);
        RedshiftP22Layout.Assemble(result.Bases, result.Rows, KCount);
    }

    /// <summary>Computes every J_{ab,n} of two spectra (for example with and without wiggles) in shared passes.</summary>
    /// <param name="first">First spectrum, table spanning exactly [<see cref="QMin"/>, <see cref="QMax"/>].</param>
    /// <param name="second">Second spectrum, same range.</param>
    /// <param name="firstResult">Destination for <paramref name="first"/>; overwritten.</param>
    /// <param name="secondResult">Destination for <paramref name="second"/>; overwritten; must differ from <paramref name="firstResult"/>.</param>
    /// <exception cref="ArgumentException">A range or size does not match the plan, or both results are the same object.</exception>
    public void Compute(LogSampledSpectrum first, LogSampledSpectrum second, RedshiftP22Integrals firstResult, RedshiftP22Integrals secondResult)
    {
        ValidateInputs(first, firstResult, nameof(first), nameof(firstResult));
        ValidateInputs(second, secondResult, nameof(second), nameof(secondResult));
        PlanArguments.RequireDistinct(firstResult, secondResult, nameof(secondResult));

        Span<double> resampledFirst = stackalloc double[_grid.Count];
        Span<double> resampledSecond = stackalloc double[_grid.Count];
        Resample(first, resampledFirst);
        Resample(second, resampledSecond);
        _table.Accumulate(resampledFirst, resampledSecond, firstResult.Bases, secondResult.Bases);
        RedshiftP22Layout.Assemble(firstResult.Bases, firstResult.Rows, KCount);
        RedshiftP22Layout.Assemble(secondResult.Bases, secondResult.Rows, KCount);
    }

    private void Resample(LogSampledSpectrum spectrum, Span<double> destination)
    {
        ReadOnlySpan<double> lnQ = _grid.LnQ;
        for (int i = 0; i < destination.Length; i++)
        {
            destination[i] = spectrum.EvaluateInside(lnQ[i]);
        }
    }

    private void ValidateInputs(LogSampledSpectrum spectrum, RedshiftP22Integrals result, string spectrumName, string resultName)
    {
        ArgumentNullException.ThrowIfNull(spectrum, spectrumName);
        ArgumentNullException.ThrowIfNull(result, resultName);
        PlanArguments.ValidateInputs(spectrum, result.KCount, QMin, QMax, KCount, spectrumName, resultName);
    }
}
