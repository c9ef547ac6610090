using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Evaluates a <see cref="GaussianProcessModel"/> at one input point without allocating: the kernel vector k* against
/// the n training points (n kernel evaluations, shared by all outputs), then one dot product per output for the mean,
/// and on request the predictive variance and the gradient of every output's mean with respect to every input.
/// </summary>
/// <remarks>
/// Owns scratch buffers, so it is not thread-safe: create one per thread with
/// <see cref="GaussianProcessModel.CreatePredictor"/> (cheap: about 3n doubles; the model itself is shared).
/// The kernel vector uses 256-bit SIMD for the scaled squared distances and <see cref="Vector256.Exp(Vector256{double})"/>.
/// </remarks>
public sealed class GaussianProcessPredictor
{
    private readonly GaussianProcessModel _model;
    private readonly double[] _kernel;
    private readonly double[] _slope;
    private readonly double[] _work;

    internal GaussianProcessPredictor(GaussianProcessModel model)
    {
        _model = model;
        _kernel = new double[model.PaddedCount];
        _slope = new double[model.PaddedCount];
        _work = new double[model.PaddedCount];
    }

    /// <summary>Posterior mean of every output (R&amp;W 2006 eq. 2.25: k*ᵀα, unstandardized), in output units.</summary>
    /// <param name="input">The point, length d, in the unit box of the training inputs; all finite.</param>
    /// <param name="mean">Receives the m means.</param>
    /// <exception cref="ArgumentException">A length is wrong or the input is not finite.</exception>
    public void PredictMean(ReadOnlySpan<double> input, Span<double> mean) => Predict(input, mean, [], []);

    /// <summary>
    /// Posterior mean of every output and, on request, the predictive variance of the latent function and the
    /// gradient of the mean with respect to the inputs.
    /// </summary>
    /// <remarks>
    /// Variance: V[f*] = scale_j² (σ_f² − vᵀv) with v = L⁻¹k* (R&amp;W eq. 2.26 via their Algorithm 2.1), clamped at
    /// zero against round-off; it costs O(n²), far more than the mean. Gradient: ∂mean_j/∂x_q = scale_j Σ_i α_ji
    /// ∂k(x, x_i)/∂x_q, analytic for both kernels.
    /// </remarks>
    /// <param name="input">The point, length d, in the unit box of the training inputs; all finite.</param>
    /// <param name="mean">Receives the m means, in output units.</param>
    /// <param name="variance">Empty, or length m to receive each output's latent variance, in output units squared.</param>
    /// <param name="gradient">Empty, or length m × d to receive ∂mean_j/∂x_q at [j·d + q], in output units per unit-box unit.</param>
    /// <exception cref="ArgumentException">A length is wrong or the input is not finite.</exception>
    /// <exception cref="InvalidOperationException">A variance is asked of a model without its Cholesky factor.</exception>
    public void Predict(ReadOnlySpan<double> input, Span<double> mean, Span<double> variance, Span<double> gradient)
    {
        int d = _model.InputCount, m = _model.OutputCount;
        Arguments.RequireLength(input.Length, d, nameof(input));
        Arguments.RequireFinite(input, nameof(input));
        Arguments.RequireLength(mean.Length, m, nameof(mean));
        if (!variance.IsEmpty)
        {
            Arguments.RequireLength(variance.Length, m, nameof(variance));
            if (!_model.HasCholeskyFactor)
            {
                throw new InvalidOperationException("This model was stored without its Cholesky factor, so it has no predictive variance.");
            }
        }

        if (!gradient.IsEmpty)
        {
            Arguments.RequireLength(gradient.Length, m * d, nameof(gradient));
        }

        Span<double> scaled = stackalloc double[d];
        for (int q = 0; q < d; q++)
        {
            scaled[q] = input[q] * _model.InverseLengthScales[q];
        }

        KernelVector(scaled, withSlope: !gradient.IsEmpty);
        int padded = _model.PaddedCount;
        ReadOnlySpan<double> outputMean = _model.OutputMean, outputScale = _model.OutputScale;
        for (int j = 0; j < m; j++)
        {
            mean[j] = outputMean[j] + (outputScale[j] * SpanArithmetic.Dot(_kernel, _model.PaddedAlpha.AsSpan(j * padded, padded)));
        }

        if (!variance.IsEmpty)
        {
            double latent = LatentVariance();
            for (int j = 0; j < m; j++)
            {
                variance[j] = outputScale[j] * outputScale[j] * latent;
            }
        }

        if (!gradient.IsEmpty)
        {
            MeanGradient(scaled, gradient);
        }
    }

    /// <summary>
    /// k_i = σ_f² c(r_i²) and, if <paramref name="withSlope"/>, slope_i = σ_f² h(r_i²) for every (padded) training
    /// point. Two passes, each with few live registers: one whose accumulators would otherwise be spilled to the stack
    /// inside the innermost loop costs several times more on processors that split 256-bit stores.
    /// </summary>
    private void KernelVector(ReadOnlySpan<double> scaled, bool withSlope)
    {
        SquaredDistances(scaled, _kernel);
        int padded = _model.PaddedCount;
        ref double kernel = ref MemoryMarshal.GetArrayDataReference(_kernel);
        ref double slope = ref MemoryMarshal.GetArrayDataReference(_slope);
        var signal = Vector256.Create(_model.Hyperparameters.SignalVariance);
        if (_model.Kernel == KernelKind.SquaredExponential)
        {
            for (int i = 0; i < padded; i += Vector256<double>.Count)
            {
                var k = signal * Vector256.Exp(Vector256.LoadUnsafe(ref kernel, (nuint)i) * -0.5);
                k.StoreUnsafe(ref kernel, (nuint)i);
                if (withSlope)
                {
                    k.StoreUnsafe(ref slope, (nuint)i);
                }
            }

            return;
        }

        for (int i = 0; i < padded; i += Vector256<double>.Count)
        {
            var r2 = Vector256.LoadUnsafe(ref kernel, (nuint)i);
            var sqrt5R = Vector256.Sqrt(r2) * Covariance.Sqrt5;
            var e = signal * Vector256.Exp(-sqrt5R);
            var linear = Vector256<double>.One + sqrt5R;
            (e * (linear + (r2 * (5.0 / 3.0)))).StoreUnsafe(ref kernel, (nuint)i);
            if (withSlope)
            {
                (e * linear * (5.0 / 3.0)).StoreUnsafe(ref slope, (nuint)i);
            }
        }
    }

    /// <summary>
    /// r_i² = Σ_q (x̃_q − x̃_iq)² for every (padded) training point, sixteen at a time: four independent accumulators
    /// keep the fused multiply-adds from waiting on each other, which is what limits a one-vector loop.
    /// </summary>
    private void SquaredDistances(ReadOnlySpan<double> scaled, double[] destination)
    {
        int d = scaled.Length, padded = _model.PaddedCount;
        ref double inputs = ref MemoryMarshal.GetArrayDataReference(_model.ScaledInputsByDimension);
        ref double result = ref MemoryMarshal.GetArrayDataReference(destination);
        ref double point = ref MemoryMarshal.GetReference(scaled);
        for (int i = 0; i < padded; i += GaussianProcessModel.PointBlock)
        {
            Vector256<double> r0 = Vector256<double>.Zero, r1 = r0, r2 = r0, r3 = r0;
            ref double column = ref Unsafe.Add(ref inputs, i);
            for (int q = 0; q < d; q++)
            {
                var x = Vector256.Create(Unsafe.Add(ref point, q));
                var e0 = x - Vector256.LoadUnsafe(ref column);
                var e1 = x - Vector256.LoadUnsafe(ref column, 4);
                var e2 = x - Vector256.LoadUnsafe(ref column, 8);
                var e3 = x - Vector256.LoadUnsafe(ref column, 12);
                r0 = Vector256.FusedMultiplyAdd(e0, e0, r0);
                r1 = Vector256.FusedMultiplyAdd(e1, e1, r1);
                r2 = Vector256.FusedMultiplyAdd(e2, e2, r2);
                r3 = Vector256.FusedMultiplyAdd(e3, e3, r3);
                column = ref Unsafe.Add(ref column, padded);
            }

            ref double target = ref Unsafe.Add(ref result, i);
            r0.StoreUnsafe(ref target);
            r1.StoreUnsafe(ref target, 4);
            r2.StoreUnsafe(ref target, 8);
            r3.StoreUnsafe(ref target, 12);
        }
    }

    /// <summary>σ_f² − vᵀv with L v = k* by forward substitution on the row-major factor.</summary>
    private double LatentVariance()
    {
        int n = _model.TrainingCount;
        ReadOnlySpan<double> factor = _model.CholeskyFactor;
        Span<double> v = _work.AsSpan(0, n);
        for (int i = 0; i < n; i++)
        {
            ReadOnlySpan<double> row = factor.Slice(i * n, i + 1);
            v[i] = (_kernel[i] - SpanArithmetic.Dot(row[..i], v[..i])) / row[i];
        }

        return Math.Max(0.0, _model.Hyperparameters.SignalVariance - SpanArithmetic.Dot(v, v));
    }

    /// <summary>∂mean_j/∂x_q = −(scale_j/ℓ_q) Σ_i α_ji slope_i (x̃_q − x̃_iq), with x̃ the inputs over their length scales.</summary>
    private void MeanGradient(ReadOnlySpan<double> scaled, Span<double> gradient)
    {
        int d = scaled.Length, m = _model.OutputCount, padded = _model.PaddedCount;
        ReadOnlySpan<double> outputScale = _model.OutputScale;
        ref double inputs = ref MemoryMarshal.GetArrayDataReference(_model.ScaledInputsByDimension);
        ref double slope = ref MemoryMarshal.GetArrayDataReference(_slope);
        ref double work = ref MemoryMarshal.GetArrayDataReference(_work);
        for (int q = 0; q < d; q++)
        {
            var point = Vector256.Create(scaled[q]);
            for (int i = 0; i < padded; i += Vector256<double>.Count)
            {
                var delta = point - Vector256.LoadUnsafe(ref inputs, (nuint)((q * padded) + i));
                (Vector256.LoadUnsafe(ref slope, (nuint)i) * delta).StoreUnsafe(ref work, (nuint)i);
            }

            double factor = -_model.InverseLengthScales[q];
            for (int j = 0; j < m; j++)
            {
                gradient[(j * d) + q] = factor * outputScale[j] * SpanArithmetic.Dot(_work, _model.PaddedAlpha.AsSpan(j * padded, padded));
            }
        }
    }
}
