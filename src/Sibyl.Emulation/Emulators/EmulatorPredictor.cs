using Sibyl.Emulation.Gaussian;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Emulation.Emulators;

/// <summary>
/// Evaluates a <see cref="SpectrumEmulator"/> at one parameter point without allocating: map the point into the
/// unit box, evaluate each Gaussian process of the slice (one kernel vector each) and its trend, rebuild every term
/// from its principal components, undo the transform. Optionally the predictive variance of every value (the
/// processes' latent variances propagated linearly through the components and the transform) and the exact gradient
/// with respect to every parameter. Owns its buffers, so it is not thread-safe: one per thread.
/// </summary>
public sealed class EmulatorPredictor
{
    private readonly SpectrumEmulator _emulator;
    private readonly GaussianProcessPredictor[] _processes;
    private readonly double[][] _mean, _variance, _gradient;
    private readonly double[][] _coefficients, _coefficientVariance, _coefficientGradient;
    private readonly double[] _unit, _features, _values, _min, _inverseWidth, _warpSlope;
    private readonly int[][] _processesOfSlice;
    private readonly BasisSpectra _spectra;
    private readonly int _d, _nk, _terms;

    internal EmulatorPredictor(SpectrumEmulator emulator)
    {
        _emulator = emulator;
        _d = emulator.ParameterNames.Count;
        _nk = emulator.K.Count;
        _terms = emulator.Layout.Terms.Count;
        _processes = [.. emulator.Processes.Select(p => p.CreatePredictor())];
        _mean = [.. emulator.Processes.Select(p => new double[p.OutputCount])];
        _variance = [.. emulator.Processes.Select(p => new double[p.OutputCount])];
        _gradient = [.. emulator.Processes.Select(p => new double[p.OutputCount * _d])];
        _coefficients = [.. emulator.Blocks.Select(b => new double[b.Count])];
        _coefficientVariance = [.. emulator.Blocks.Select(b => new double[b.Count])];
        _coefficientGradient = [.. emulator.Blocks.Select(b => new double[b.Count * _d])];
        _unit = new double[_d];
        _warpSlope = new double[_d];
        _features = new double[_nk];
        _values = new double[_terms * _nk];
        _min = [.. emulator.Min];
        _inverseWidth = [.. Enumerable.Range(0, _d).Select(q => 1.0 / (emulator.Max[q] - emulator.Min[q]))];
        _processesOfSlice = [.. Enumerable.Range(0, emulator.SliceCount).Select(s =>
            Enumerable.Range(0, emulator.Processes.Length).Where(p => emulator.Contract.Processes[p].OutputBlocks[0] / _terms == s).ToArray())];
        _spectra = new BasisSpectra(emulator.Layout, [.. emulator.K], _values);
    }

    /// <summary>
    /// The mean basis spectra at <paramref name="parameters"/> (in <see cref="SpectrumEmulator.ParameterNames"/> order),
    /// redshift slice <paramref name="slice"/>. The returned object is this predictor's buffer, overwritten by the next call.
    /// </summary>
    /// <exception cref="Cosmology.Parameters.ParameterOutOfRangeException">A parameter is not finite or outside the box.</exception>
    public BasisSpectra Predict(ReadOnlySpan<double> parameters, int slice = 0)
    {
        _emulator.CheckInBox(parameters, allowExtrapolation: false);
        CheckSlice(slice);
        Core(parameters, slice, _values, [], []);
        return _spectra;
    }

    /// <summary>
    /// Values of every term (term-major over k, <c>terms × nk</c>), and on request their variances (same layout) and
    /// gradients with respect to the parameters (<c>[(t·nk + i)·d + q]</c>, per unit of each parameter).
    /// </summary>
    /// <returns>False when the point lies outside the box and <paramref name="allowExtrapolation"/> let it through.</returns>
    /// <exception cref="Cosmology.Parameters.ParameterOutOfRangeException">A parameter is not finite, or outside the box without permission.</exception>
    /// <exception cref="ArgumentException">A span has the wrong length, or variances are asked of an emulator saved without them.</exception>
    public bool Predict(ReadOnlySpan<double> parameters, int slice, Span<double> values, Span<double> variance, Span<double> gradient, bool allowExtrapolation = false)
    {
        bool inside = _emulator.CheckInBox(parameters, allowExtrapolation);
        CheckSlice(slice);
        int size = _terms * _nk;
        if (values.Length != size || (!variance.IsEmpty && variance.Length != size) || (!gradient.IsEmpty && gradient.Length != size * _d))
        {
            throw new ArgumentException($"values and variance need {size} numbers, gradient {size * _d} (or empty)");
        }

        if (!variance.IsEmpty && !_emulator.HasVariance)
        {
            throw new ArgumentException("this emulator was saved without the factors that variances need; refit it with variances", nameof(variance));
        }

        Core(parameters, slice, values, variance, gradient);
        return inside;
    }

    private void CheckSlice(int slice)
    {
        if ((uint)slice >= (uint)_emulator.SliceCount)
        {
            throw new ArgumentOutOfRangeException(nameof(slice), slice, $"the emulator has {_emulator.SliceCount} redshift slice(s)");
        }
    }

    private void Core(ReadOnlySpan<double> parameters, int slice, Span<double> values, Span<double> variance, Span<double> gradient)
    {
        bool wantVariance = !variance.IsEmpty, wantGradient = !gradient.IsEmpty;
        for (int q = 0; q < _d; q++)
        {
            (_unit[q], _warpSlope[q]) = SpectrumEmulator.Warp(_emulator.Warps[q], (parameters[q] - _min[q]) * _inverseWidth[q]);
        }

        var contract = _emulator.Contract;
        foreach (int p in _processesOfSlice[slice])
        {
            var gradientBuffer = wantGradient ? _gradient[p].AsSpan() : [];
            if (wantGradient)
            {
                gradientBuffer.Clear();
            }

            _processes[p].Predict(_unit, _mean[p], wantVariance ? _variance[p] : [], gradientBuffer);
            _emulator.Trends[p].Add(_unit, _mean[p], gradientBuffer);
            var map = contract.Processes[p];
            for (int j = 0; j < _mean[p].Length; j++)
            {
                int b = map.OutputBlocks[j], c = map.OutputComponents[j];
                _coefficients[b][c] = _mean[p][j];
                if (wantVariance)
                {
                    _coefficientVariance[b][c] = _variance[p][j];
                }

                if (wantGradient)
                {
                    _gradient[p].AsSpan(j * _d, _d).CopyTo(_coefficientGradient[b].AsSpan(c * _d, _d));
                }
            }
        }

        for (int t = 0; t < _terms; t++)
        {
            int b = (slice * _terms) + t;
            var pca = _emulator.Blocks[b];
            var block = values.Slice(t * _nk, _nk);
            pca.Reconstruct(_coefficients[b], _features);
            bool log = _emulator.Transforms[b] == TargetTransform.Log;
            for (int i = 0; i < _nk; i++)
            {
                block[i] = log ? Math.Exp(_features[i]) : _features[i];
            }

            if (wantVariance)
            {
                Propagate(pca, _coefficientVariance[b], block, log, variance.Slice(t * _nk, _nk));
            }

            if (wantGradient)
            {
                Differentiate(pca, _coefficientGradient[b], block, log, gradient.Slice(t * _nk * _d, _nk * _d));
            }
        }
    }

    /// <summary>var(x_k) = s_k² Σ_c v_ck² var(a_c); for a log target var(P) ≈ P² var(ln P) (first order).</summary>
    private void Propagate(Compression.PrincipalComponents pca, double[] coefficientVariance, ReadOnlySpan<double> block, bool log, Span<double> variance)
    {
        var basis = pca.Basis;
        var scale = pca.Scale;
        for (int i = 0; i < _nk; i++)
        {
            double sum = 0.0;
            for (int c = 0; c < pca.Count; c++)
            {
                double v = basis[(c * _nk) + i];
                sum += v * v * coefficientVariance[c];
            }

            double featureVariance = scale[i] * scale[i] * sum;
            variance[i] = log ? block[i] * block[i] * featureVariance : featureVariance;
        }
    }

    /// <summary>∂x_k/∂θ_q = s_k Σ_c v_ck ∂a_c/∂w_q · w_q'(u) / (max_q − min_q) with w the input warp; for a log target ∂P/∂θ = P ∂ln P/∂θ.</summary>
    private void Differentiate(Compression.PrincipalComponents pca, double[] coefficientGradient, ReadOnlySpan<double> block, bool log, Span<double> gradient)
    {
        var basis = pca.Basis;
        var scale = pca.Scale;
        for (int i = 0; i < _nk; i++)
        {
            double factor = scale[i] * (log ? block[i] : 1.0);
            for (int q = 0; q < _d; q++)
            {
                double sum = 0.0;
                for (int c = 0; c < pca.Count; c++)
                {
                    sum += basis[(c * _nk) + i] * coefficientGradient[(c * _d) + q];
                }

                gradient[(i * _d) + q] = factor * sum * _warpSlope[q] * _inverseWidth[q];
            }
        }
    }
}
