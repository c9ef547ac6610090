using System.Globalization;

namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// The trained state of a Gaussian process with m outputs sharing one covariance function: training inputs,
/// hyperparameters, α_j = K⁻¹y_j per standardized output, the output standardization and, optionally, the Cholesky
/// factor L of K = K_f + σ_n² I (needed for predictive variances).
/// </summary>
/// <remarks>
/// Everything is exposed as plain arrays and <see cref="FromArrays"/> rebuilds an identical model from them, so a
/// file layer can save and load it bit-exactly. Immutable and safe to share between threads; predictions go through
/// <see cref="CreatePredictor"/>, one predictor per thread.
/// </remarks>
public sealed class GaussianProcessModel
{
    private readonly double[] _inputs;
    private readonly double[] _alpha;
    private readonly double[] _outputMean;
    private readonly double[] _outputScale;
    private readonly double[]? _cholesky;

    /// <summary>Wraps arrays without copying: the caller has just built them and must not touch them again.</summary>
    internal GaussianProcessModel(
        KernelKind kernel,
        GaussianProcessHyperparameters hyperparameters,
        double[] inputs,
        double[] alpha,
        double[] outputMean,
        double[] outputScale,
        double[]? cholesky,
        double logMarginalLikelihood)
    {
        Kernel = kernel;
        Hyperparameters = hyperparameters;
        _inputs = inputs;
        _alpha = alpha;
        _outputMean = outputMean;
        _outputScale = outputScale;
        _cholesky = cholesky;
        LogMarginalLikelihood = logMarginalLikelihood;

        // Derived layout for the predictor: inputs divided by their length scales, stored dimension by dimension and
        // padded to whole SIMD vectors; α is padded with zeros so that padding points contribute nothing.
        int n = TrainingCount, d = InputCount, m = OutputCount;
        PaddedCount = (n + PointBlock - 1) / PointBlock * PointBlock;
        InverseLengthScales = new double[d];
        for (int q = 0; q < d; q++)
        {
            InverseLengthScales[q] = 1.0 / hyperparameters.LengthScales[q];
        }

        ScaledInputsByDimension = new double[d * PaddedCount];
        for (int i = 0; i < n; i++)
        {
            for (int q = 0; q < d; q++)
            {
                ScaledInputsByDimension[(q * PaddedCount) + i] = inputs[(i * d) + q] * InverseLengthScales[q];
            }
        }

        PaddedAlpha = new double[m * PaddedCount];
        for (int j = 0; j < m; j++)
        {
            alpha.AsSpan(j * n, n).CopyTo(PaddedAlpha.AsSpan(j * PaddedCount));
        }
    }

    /// <summary>The covariance function.</summary>
    public KernelKind Kernel { get; }

    /// <summary>The hyperparameters, in standardized output units and unit-box input units.</summary>
    public GaussianProcessHyperparameters Hyperparameters { get; }

    /// <summary>Number of training points n.</summary>
    public int TrainingCount => _inputs.Length / InputCount;

    /// <summary>Number of input dimensions d.</summary>
    public int InputCount => Hyperparameters.Dimension;

    /// <summary>Number of outputs m.</summary>
    public int OutputCount => _outputMean.Length;

    /// <summary>Training inputs in the unit box, n × d row-major.</summary>
    public ReadOnlySpan<double> TrainingInputs => _inputs;

    /// <summary>α_j = K⁻¹ỹ_j for each standardized output ỹ_j = (y_j − mean_j)/scale_j, m × n output-major.</summary>
    public ReadOnlySpan<double> Alpha => _alpha;

    /// <summary>Mean of each output over the training data, in output units.</summary>
    public ReadOnlySpan<double> OutputMean => _outputMean;

    /// <summary>Scale of each output (its root-mean-square deviation over the training data, or 1 if that is zero), in output units.</summary>
    public ReadOnlySpan<double> OutputScale => _outputScale;

    /// <summary>Whether <see cref="CholeskyFactor"/> is kept, so that predictive variances are available.</summary>
    public bool HasCholeskyFactor => _cholesky is not null;

    /// <summary>Lower-triangular L with L Lᵀ = K_f + σ_n² I, n × n row-major (zeros above the diagonal); empty when not kept.</summary>
    public ReadOnlySpan<double> CholeskyFactor => _cholesky;

    /// <summary>Σ_j log p(ỹ_j | X, θ) of the standardized outputs at these hyperparameters (R&amp;W eq. 2.30), dimensionless.</summary>
    public double LogMarginalLikelihood { get; }

    /// <summary>Training points handled together by the predictor: four 256-bit vectors.</summary>
    internal const int PointBlock = 16;

    internal int PaddedCount { get; }

    internal double[] InverseLengthScales { get; }

    internal double[] ScaledInputsByDimension { get; }

    internal double[] PaddedAlpha { get; }

    /// <summary>Rebuilds a model from the arrays exposed by a trained one; the arrays are copied.</summary>
    /// <param name="kernel">The covariance function.</param>
    /// <param name="hyperparameters">Hyperparameters with d length scales.</param>
    /// <param name="trainingInputs">n × d row-major, n ≥ 2, all finite.</param>
    /// <param name="alpha">m × n output-major, all finite.</param>
    /// <param name="outputMean">m output means, all finite, m ≥ 1.</param>
    /// <param name="outputScale">m output scales, all finite and positive.</param>
    /// <param name="choleskyFactor">Null, or n × n row-major lower-triangular with a positive finite diagonal.</param>
    /// <param name="logMarginalLikelihood">The trained model's <see cref="LogMarginalLikelihood"/>.</param>
    /// <returns>A model whose predictions are bit-identical to the original's.</returns>
    /// <exception cref="ArgumentNullException">A required argument is null.</exception>
    /// <exception cref="ArgumentException">Sizes disagree or a value is invalid; the message names the argument.</exception>
    public static GaussianProcessModel FromArrays(
        KernelKind kernel,
        GaussianProcessHyperparameters hyperparameters,
        double[] trainingInputs,
        double[] alpha,
        double[] outputMean,
        double[] outputScale,
        double[]? choleskyFactor,
        double logMarginalLikelihood)
    {
        ArgumentNullException.ThrowIfNull(hyperparameters);
        ArgumentNullException.ThrowIfNull(trainingInputs);
        ArgumentNullException.ThrowIfNull(alpha);
        ArgumentNullException.ThrowIfNull(outputMean);
        ArgumentNullException.ThrowIfNull(outputScale);
        if (!Enum.IsDefined(kernel))
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture, $"kernel = {(int)kernel} is not a known kernel."), nameof(kernel));
        }

        int d = hyperparameters.Dimension;
        if (trainingInputs.Length < 2 * d || trainingInputs.Length % d != 0)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"trainingInputs has {trainingInputs.Length} values; expected at least 2 rows of {d}."),
                nameof(trainingInputs));
        }

        int n = trainingInputs.Length / d;
        Arguments.RequireFinite(trainingInputs, nameof(trainingInputs));
        if (outputMean.Length == 0)
        {
            throw new ArgumentException("At least one output is needed.", nameof(outputMean));
        }

        Arguments.RequireFinite(outputMean, nameof(outputMean));
        Arguments.RequireLength(outputScale.Length, outputMean.Length, nameof(outputScale));
        Arguments.RequirePositive(outputScale, nameof(outputScale));
        Arguments.RequireLength(alpha.Length, outputMean.Length * n, nameof(alpha));
        Arguments.RequireFinite(alpha, nameof(alpha));
        if (choleskyFactor is not null)
        {
            Arguments.RequireLength(choleskyFactor.Length, n * n, nameof(choleskyFactor));
            Arguments.RequireFinite(choleskyFactor, nameof(choleskyFactor));
            for (int i = 0; i < n; i++)
            {
                if (!(choleskyFactor[(i * n) + i] > 0.0))
                {
                    throw new ArgumentException(
                        string.Create(CultureInfo.InvariantCulture, $"choleskyFactor[{i}, {i}] = {choleskyFactor[(i * n) + i]:R} must be positive."),
                        nameof(choleskyFactor));
                }
            }
        }

        return new GaussianProcessModel(
            kernel, hyperparameters, (double[])trainingInputs.Clone(), (double[])alpha.Clone(), (double[])outputMean.Clone(),
            (double[])outputScale.Clone(), (double[]?)choleskyFactor?.Clone(), logMarginalLikelihood);
    }

    /// <summary>A new predictor with its own scratch buffers (about 3n doubles); make one per thread.</summary>
    /// <returns>A predictor bound to this model.</returns>
    public GaussianProcessPredictor CreatePredictor() => new(this);
}
