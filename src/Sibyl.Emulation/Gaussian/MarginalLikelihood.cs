using System.Globalization;
using MathNet.Numerics.LinearAlgebra;

namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// The log marginal likelihood of several outputs that share one covariance function, and its analytic gradient
/// with respect to the log hyperparameters θ = (ln σ_f², ln ℓ_1, …, ln ℓ_d, ln σ_n²).
/// </summary>
/// <remarks>
/// <para>
/// With K = K_f(θ) + σ_n² I and α_j = K⁻¹ y_j for output j = 1…m, the value is the sum over outputs of
/// Rasmussen &amp; Williams (2006) eq. 2.30, log p(y_j | X, θ) = −½ y_jᵀα_j − ½ ln|K| − (n/2) ln 2π, and the gradient
/// is the sum of their eq. 5.9, ½ tr((Σ_j α_jα_jᵀ − m K⁻¹) ∂K/∂θ_i). Everything goes through one Cholesky
/// factorisation of K (R&amp;W Algorithm 2.1), so the cost is O(n³) per evaluation whatever the number of outputs:
/// n³/6 multiply-adds for the value, n³/2 more for K⁻¹ in the gradient.
/// </para>
/// <para>
/// The outputs are used as given: <see cref="GaussianProcessRegression"/> standardizes them first. The object holds
/// no mutable state, so one instance may serve several threads; each evaluation allocates its n × n work matrices.
/// </para>
/// </remarks>
public sealed class MarginalLikelihood
{
    private static readonly double LnTwoPi = Math.Log(2.0 * Math.PI);

    private readonly double[] _inputs;
    private readonly double[] _outputs;

    /// <summary>Prepares the likelihood of <paramref name="outputs"/> observed at <paramref name="inputs"/>.</summary>
    /// <param name="inputs">n × d training inputs, one point per row, scaled to the unit box by the caller; n ≥ 2, all finite.</param>
    /// <param name="outputs">n × m outputs, one column per output, all finite.</param>
    /// <param name="kernel">Covariance function.</param>
    /// <exception cref="ArgumentNullException">A matrix is null.</exception>
    /// <exception cref="ArgumentException">Fewer than 2 points, mismatched row counts or a non-finite value; the message names the argument.</exception>
    public MarginalLikelihood(Matrix<double> inputs, Matrix<double> outputs, KernelKind kernel)
    {
        ValidateTrainingData(inputs, outputs);
        _inputs = inputs.ToRowMajorArray();
        _outputs = outputs.ToColumnMajorArray();
        TrainingCount = outputs.RowCount;
        OutputCount = outputs.ColumnCount;
        Kernel = kernel;
    }

    /// <summary>The covariance function.</summary>
    public KernelKind Kernel { get; }

    /// <summary>Number of training points n.</summary>
    public int TrainingCount { get; }

    /// <summary>Number of input dimensions d.</summary>
    public int InputCount => _inputs.Length / TrainingCount;

    /// <summary>Number of outputs m.</summary>
    public int OutputCount { get; }

    /// <summary>Number of log hyperparameters, d + 2.</summary>
    public int ParameterCount => InputCount + 2;

    /// <summary>Σ_j log p(y_j | X, θ) (natural log, dimensionless) at <paramref name="hyperparameters"/>.</summary>
    /// <param name="hyperparameters">One length scale per input dimension.</param>
    /// <returns>The value, or −∞ when the covariance matrix is not numerically positive definite.</returns>
    /// <exception cref="ArgumentException">The dimension of <paramref name="hyperparameters"/> is wrong.</exception>
    public double Evaluate(GaussianProcessHyperparameters hyperparameters)
    {
        ArgumentNullException.ThrowIfNull(hyperparameters);
        return Evaluate(hyperparameters.ToLogParameters(), []);
    }

    /// <summary>Σ_j log p(y_j | X, θ) and, if <paramref name="gradient"/> is not empty, its gradient with respect to θ.</summary>
    /// <param name="logParameters">θ = (ln σ_f², ln ℓ_1, …, ln ℓ_d, ln σ_n²), length <see cref="ParameterCount"/>, all finite.</param>
    /// <param name="gradient">Empty, or length <see cref="ParameterCount"/> to receive ∂/∂θ (NaN when the value is −∞).</param>
    /// <returns>The value, or −∞ when the covariance matrix is not numerically positive definite.</returns>
    /// <exception cref="ArgumentException">A length is wrong or a parameter is not finite.</exception>
    public double Evaluate(ReadOnlySpan<double> logParameters, Span<double> gradient)
    {
        Arguments.RequireLength(logParameters.Length, ParameterCount, nameof(logParameters));
        Arguments.RequireFinite(logParameters, nameof(logParameters));
        if (!gradient.IsEmpty)
        {
            Arguments.RequireLength(gradient.Length, ParameterCount, nameof(gradient));
        }

        var state = Factor(logParameters);
        if (state is null)
        {
            gradient.Fill(double.NaN);
            return double.NegativeInfinity;
        }

        if (!gradient.IsEmpty)
        {
            Gradient(logParameters, state.Value, gradient);
        }

        return state.Value.Value;
    }

    /// <summary>
    /// The Cholesky factor L (n × n row-major), α (m × n output-major) and the value at θ; null when K is not
    /// numerically positive definite.
    /// </summary>
    internal (double[] Factor, double[] Alpha, double Value)? Factor(ReadOnlySpan<double> theta)
    {
        int n = TrainingCount, m = OutputCount;
        double[] factor = Covariances(theta);
        if (!CholeskyFactor.TryFactor(factor, n))
        {
            return null;
        }

        double[] alpha = (double[])_outputs.Clone();
        double fit = 0.0;
        for (int j = 0; j < m; j++)
        {
            Span<double> column = alpha.AsSpan(j * n, n);
            CholeskyFactor.Solve(factor, n, column);
            fit += SpanArithmetic.Dot(_outputs.AsSpan(j * n, n), column);
        }

        double value = (-0.5 * fit) - (0.5 * m * CholeskyFactor.LogDeterminant(factor, n)) - (0.5 * n * m * LnTwoPi);
        return double.IsFinite(value) ? (factor, alpha, value) : null;
    }

    internal static void ValidateTrainingData(Matrix<double> inputs, Matrix<double> outputs)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(outputs);
        if (inputs.RowCount < 2 || inputs.ColumnCount < 1)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"inputs is {inputs.RowCount} × {inputs.ColumnCount}; at least 2 points and 1 dimension are needed."),
                nameof(inputs));
        }

        if (outputs.RowCount != inputs.RowCount || outputs.ColumnCount < 1)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"outputs is {outputs.RowCount} × {outputs.ColumnCount}; expected {inputs.RowCount} rows and at least 1 column."),
                nameof(outputs));
        }

        Arguments.RequireFinite(inputs, nameof(inputs));
        Arguments.RequireFinite(outputs, nameof(outputs));
    }

    /// <summary>K = σ_f² c(r²) + σ_n² I, n × n row-major.</summary>
    private double[] Covariances(ReadOnlySpan<double> theta)
    {
        int n = TrainingCount, d = InputCount;
        double signal = Math.Exp(theta[0]), noise = Math.Exp(theta[^1]);
        Span<double> inverseScale = stackalloc double[d];
        for (int q = 0; q < d; q++)
        {
            inverseScale[q] = Math.Exp(-theta[q + 1]);
        }

        var values = new double[n * n];
        for (int a = 0; a < n; a++)
        {
            values[(a * n) + a] = signal + noise;
            for (int b = 0; b < a; b++)
            {
                double k = signal * Covariance.Profile(Kernel, ScaledDistanceSquared(a, b, inverseScale));
                values[(a * n) + b] = k;
                values[(b * n) + a] = k;
            }
        }

        return values;
    }

    private double ScaledDistanceSquared(int a, int b, ReadOnlySpan<double> inverseScale)
    {
        int d = inverseScale.Length;
        double sum = 0.0;
        for (int q = 0; q < d; q++)
        {
            double delta = (_inputs[(a * d) + q] - _inputs[(b * d) + q]) * inverseScale[q];
            sum += delta * delta;
        }

        return sum;
    }

    /// <summary>R&amp;W eq. 5.9 summed over outputs, with W = Σ_j α_jα_jᵀ − m K⁻¹ formed pair by pair.</summary>
    private void Gradient(ReadOnlySpan<double> theta, (double[] Factor, double[] Alpha, double Value) state, Span<double> gradient)
    {
        int n = TrainingCount, d = InputCount, m = OutputCount;
        double signal = Math.Exp(theta[0]), noise = Math.Exp(theta[^1]);
        Span<double> inverseScale = stackalloc double[d];
        for (int q = 0; q < d; q++)
        {
            inverseScale[q] = Math.Exp(-theta[q + 1]);
        }

        double[] inverse = CholeskyFactor.Inverse(state.Factor, n);
        // α point-major, so that Σ_j α_ja α_jb is a contiguous dot product.
        var alpha = new double[n * m];
        for (int j = 0; j < m; j++)
        {
            for (int a = 0; a < n; a++)
            {
                alpha[(a * m) + j] = state.Alpha[(j * n) + a];
            }
        }

        Span<double> lengthTerms = stackalloc double[d];
        lengthTerms.Clear();
        double signalTerm = 0.0, noiseTerm = 0.0;
        for (int a = 0; a < n; a++)
        {
            ReadOnlySpan<double> alphaA = alpha.AsSpan(a * m, m);
            double diagonal = SpanArithmetic.Dot(alphaA, alphaA) - (m * inverse[(a * n) + a]);
            signalTerm += diagonal * signal;
            noiseTerm += diagonal * noise;
            for (int b = 0; b < a; b++)
            {
                // Off-diagonal pairs appear twice in the trace; the factor 2 cancels the ½ of eq. 5.9.
                double w = 2.0 * (SpanArithmetic.Dot(alphaA, alpha.AsSpan(b * m, m)) - (m * inverse[(a * n) + b]));
                double r2 = ScaledDistanceSquared(a, b, inverseScale);
                signalTerm += w * signal * Covariance.Profile(Kernel, r2);
                double slope = w * signal * Covariance.Slope(Kernel, r2);
                for (int q = 0; q < d; q++)
                {
                    double delta = (_inputs[(a * d) + q] - _inputs[(b * d) + q]) * inverseScale[q];
                    lengthTerms[q] += slope * delta * delta;
                }
            }
        }

        gradient[0] = 0.5 * signalTerm;
        for (int q = 0; q < d; q++)
        {
            gradient[q + 1] = 0.5 * lengthTerms[q];
        }

        gradient[^1] = 0.5 * noiseTerm;
    }
}
