using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using Sibyl.Training.Design;

namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Gaussian-process regression of several outputs that share one ARD covariance function (Rasmussen &amp; Williams
/// 2006, "Gaussian Processes for Machine Learning", MIT Press): each output is standardized, the hyperparameters
/// maximise the sum of the outputs' log marginal likelihoods, and one Cholesky factor serves every output.
/// </summary>
/// <remarks>
/// Inputs must already be scaled to the unit box [0, 1]^d by the caller: the default starting point, restart range
/// and length-scale bounds are stated in those units. A single-output regression is the case of one output column.
/// </remarks>
public static class GaussianProcessRegression
{
    // Defaults of GaussianProcessOptions.Initial, in unit-box and standardized units.
    private const double DefaultLengthScale = 0.5;
    private const double DefaultNoiseVariance = 1e-6;

    /// <summary>
    /// Standardizes the outputs, maximises Σ_j log p(ỹ_j | X, θ) over the log hyperparameters with L-BFGS and
    /// analytic gradients (R&amp;W eqs. 2.30 and 5.9) from the initial point and the seeded restarts, and conditions
    /// the process on the data at the best hyperparameters found. Deterministic for a given seed.
    /// </summary>
    /// <remarks>
    /// Bounds are enforced in log space: the likelihood is evaluated at the point clamped into the box and a quadratic
    /// penalty (weight n·m per unit of log parameter squared) pulls the iterate back, so the objective stays continuous;
    /// the answer is the clamped point. A start at which K does not factor numerically has its nugget raised a
    /// hundredfold at a time until it does. Cost: one O(n³) factorisation and inverse per likelihood evaluation.
    /// </remarks>
    /// <param name="inputs">n × d training inputs in the unit box, one point per row; n ≥ 2, all finite.</param>
    /// <param name="outputs">n × m training outputs, one column per output, all finite.</param>
    /// <param name="options">Kernel, restarts, seed and bounds; null for the defaults.</param>
    /// <returns>The trained model.</returns>
    /// <exception cref="ArgumentNullException">A matrix is null.</exception>
    /// <exception cref="ArgumentException">Bad data or options; the message names the argument.</exception>
    public static GaussianProcessModel Fit(Matrix<double> inputs, Matrix<double> outputs, GaussianProcessOptions? options = null)
    {
        MarginalLikelihood.ValidateTrainingData(inputs, outputs);
        options ??= new GaussianProcessOptions();
        int d = inputs.ColumnCount;
        (double[] lower, double[] upper) = Bounds(options, d);
        (Matrix<double> standardized, double[] outputMean, double[] outputScale) = Standardize(outputs);
        var likelihood = new MarginalLikelihood(inputs, standardized, options.Kernel);
        double penalty = inputs.RowCount * outputs.ColumnCount;

        var clamped = new double[d + 2];
        var inner = new double[d + 2];
        double Objective(ReadOnlySpan<double> theta, Span<double> gradient)
        {
            Clamp(theta, lower, upper, clamped);
            double value = likelihood.Evaluate(clamped, inner);
            if (!double.IsFinite(value))
            {
                return double.PositiveInfinity;
            }

            double result = -value;
            for (int i = 0; i < theta.Length; i++)
            {
                double excess = theta[i] - clamped[i];
                result += penalty * excess * excess;
                gradient[i] = excess == 0.0 ? -inner[i] : 2.0 * penalty * excess;
            }

            return result;
        }

        var optimiser = new LimitedMemoryBfgs();
        var random = new SeededRandom(options.Seed);
        double[]? best = null;
        double bestValue = double.NegativeInfinity;
        for (int start = 0; start <= options.Restarts; start++)
        {
            double[] initial = start == 0 ? InitialPoint(options, d) : RandomPoint(random, d);
            Clamp(initial, lower, upper, initial);
            RaiseNoiseUntilDefined(likelihood, initial, upper[^1]);
            (double[] x, _, _) = optimiser.Minimize(Objective, initial, options.MaximumIterations);
            Clamp(x, lower, upper, x);
            double value = likelihood.Evaluate(x, []);
            if (best is null || value > bestValue)
            {
                best = x;
                bestValue = value;
            }
        }

        var hyperparameters = GaussianProcessHyperparameters.FromLogParameters(best!);
        return Build(likelihood, inputs, hyperparameters, outputMean, outputScale, options.KeepCholeskyFactor);
    }

    /// <summary>
    /// Conditions the process on the data at fixed hyperparameters (no optimisation): standardizes the outputs and
    /// computes the Cholesky factor and α_j = K⁻¹ỹ_j (R&amp;W Algorithm 2.1).
    /// </summary>
    /// <param name="inputs">n × d training inputs in the unit box, one point per row; n ≥ 2, all finite.</param>
    /// <param name="outputs">n × m training outputs, one column per output, all finite.</param>
    /// <param name="kernel">Covariance function.</param>
    /// <param name="hyperparameters">Hyperparameters with d length scales, in standardized output units.</param>
    /// <param name="keepCholeskyFactor">Keep L in the model for predictive variances (n² doubles).</param>
    /// <returns>The conditioned model.</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">
    /// Bad data, a dimension mismatch, or a covariance matrix that is not numerically positive definite (raise the
    /// noise variance); the message names the argument.
    /// </exception>
    public static GaussianProcessModel Condition(
        Matrix<double> inputs,
        Matrix<double> outputs,
        KernelKind kernel,
        GaussianProcessHyperparameters hyperparameters,
        bool keepCholeskyFactor = true)
    {
        MarginalLikelihood.ValidateTrainingData(inputs, outputs);
        ArgumentNullException.ThrowIfNull(hyperparameters);
        Arguments.RequireLength(hyperparameters.Dimension, inputs.ColumnCount, nameof(hyperparameters));
        (Matrix<double> standardized, double[] outputMean, double[] outputScale) = Standardize(outputs);
        var likelihood = new MarginalLikelihood(inputs, standardized, kernel);
        return Build(likelihood, inputs, hyperparameters, outputMean, outputScale, keepCholeskyFactor);
    }

    private static GaussianProcessModel Build(
        MarginalLikelihood likelihood,
        Matrix<double> inputs,
        GaussianProcessHyperparameters hyperparameters,
        double[] outputMean,
        double[] outputScale,
        bool keepCholeskyFactor)
    {
        var state = likelihood.Factor(hyperparameters.ToLogParameters())
            ?? throw new ArgumentException(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"The covariance matrix is not numerically positive definite at noise variance {hyperparameters.NoiseVariance:R}; raise it."),
                nameof(hyperparameters));
        return new GaussianProcessModel(
            likelihood.Kernel, hyperparameters, inputs.ToRowMajorArray(), state.Alpha, outputMean, outputScale,
            keepCholeskyFactor ? state.Factor : null, state.Value);
    }

    /// <summary>ỹ_j = (y_j − mean_j)/scale_j with scale_j the root-mean-square deviation (1 for a constant output).</summary>
    private static (Matrix<double> Standardized, double[] Mean, double[] Scale) Standardize(Matrix<double> outputs)
    {
        int n = outputs.RowCount, m = outputs.ColumnCount;
        var mean = new double[m];
        var scale = new double[m];
        for (int j = 0; j < m; j++)
        {
            var column = outputs.Column(j);
            mean[j] = column.Sum() / n;
            double spread = Math.Sqrt((column - mean[j]).DotProduct(column - mean[j]) / n);
            scale[j] = spread > 0.0 ? spread : 1.0;
        }

        var standardized = Matrix<double>.Build.Dense(n, m, (i, j) => (outputs[i, j] - mean[j]) / scale[j]);
        return (standardized, mean, scale);
    }

    private static (double[] Lower, double[] Upper) Bounds(GaussianProcessOptions options, int d)
    {
        if (options.Restarts < 0 || options.MaximumIterations < 1)
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"Restarts = {options.Restarts} must be ≥ 0 and MaximumIterations = {options.MaximumIterations} ≥ 1."),
                nameof(options));
        }

        RequireRange(options.MinimumSignalVariance, options.MaximumSignalVariance, "SignalVariance");
        RequireRange(options.MinimumLengthScale, options.MaximumLengthScale, "LengthScale");
        RequireRange(options.MinimumNoiseVariance, options.MaximumNoiseVariance, "NoiseVariance");
        if (options.Initial is not null)
        {
            Arguments.RequireLength(options.Initial.Dimension, d, nameof(options.Initial));
        }

        var lower = new double[d + 2];
        var upper = new double[d + 2];
        lower[0] = Math.Log(options.MinimumSignalVariance);
        upper[0] = Math.Log(options.MaximumSignalVariance);
        for (int q = 1; q <= d; q++)
        {
            lower[q] = Math.Log(options.MinimumLengthScale);
            upper[q] = Math.Log(options.MaximumLengthScale);
        }

        lower[^1] = Math.Log(options.MinimumNoiseVariance);
        upper[^1] = Math.Log(options.MaximumNoiseVariance);
        return (lower, upper);
    }

    private static void RequireRange(double minimum, double maximum, string name)
    {
        if (!(minimum > 0.0) || !(maximum >= minimum) || !double.IsFinite(maximum))
        {
            throw new ArgumentException(
                string.Create(CultureInfo.InvariantCulture, $"Minimum{name} = {minimum:R} and Maximum{name} = {maximum:R} must satisfy 0 < minimum ≤ maximum < ∞."),
                "options");
        }
    }

    /// <summary>
    /// A start where K is not numerically positive definite (near-duplicate points, a smooth kernel, a tiny nugget)
    /// gives the optimiser nothing to descend from, so the nugget is raised a hundredfold at a time until it is.
    /// </summary>
    private static void RaiseNoiseUntilDefined(MarginalLikelihood likelihood, double[] theta, double upperLogNoise)
    {
        while (double.IsNegativeInfinity(likelihood.Evaluate(theta, [])) && theta[^1] < upperLogNoise)
        {
            theta[^1] = Math.Min(upperLogNoise, theta[^1] + Math.Log(100.0));
        }
    }

    private static double[] InitialPoint(GaussianProcessOptions options, int d) =>
        options.Initial?.ToLogParameters()
        ?? new GaussianProcessHyperparameters(1.0, Enumerable.Repeat(DefaultLengthScale, d).ToArray(), DefaultNoiseVariance).ToLogParameters();

    private static double[] RandomPoint(SeededRandom random, int d)
    {
        var theta = new double[d + 2];
        theta[0] = Uniform(random, Math.Log(0.3), Math.Log(3.0));
        for (int q = 1; q <= d; q++)
        {
            theta[q] = Uniform(random, Math.Log(0.1), Math.Log(3.0));
        }

        theta[^1] = Uniform(random, Math.Log(1e-8), Math.Log(1e-4));
        return theta;
    }

    private static double Uniform(SeededRandom random, double low, double high) => low + ((high - low) * random.NextDouble());

    private static void Clamp(ReadOnlySpan<double> theta, double[] lower, double[] upper, Span<double> destination)
    {
        for (int i = 0; i < theta.Length; i++)
        {
            destination[i] = Math.Clamp(theta[i], lower[i], upper[i]);
        }
    }
}
