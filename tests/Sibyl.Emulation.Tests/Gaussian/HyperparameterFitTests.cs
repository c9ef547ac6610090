using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class HyperparameterFitTests
{
    private static readonly double[] TrueLengths = [0.15, 0.5];

    /// <summary>
    /// Four independent draws (the outputs) of a zero-mean process with squared-exponential covariance, σ_f² = 1,
    /// ℓ = (0.15, 0.5), σ_n² = 1e-6, at 120 seeded points: y = L z with L L ᵀ = K and z standard normal (Box–Muller).
    /// </summary>
    private static (Matrix<double> X, Matrix<double> Y) Draws()
    {
        var x = Designs.UnitBox(seed: 21, n: 120, d: 2);
        var reference = new DenseReference(x, KernelKind.SquaredExponential, 1.0, TrueLengths, 1e-6);
        var factor = reference.Covariance().Cholesky().Factor;
        var random = new Random(22);
        var z = Matrix<double>.Build.Dense(120, 4, (_, _) =>
            Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble()));
        return (x, factor * z);
    }

    [Fact]
    public void Fitted_length_scales_recover_those_of_the_generating_process()
    {
        (var x, var y) = Draws();
        var model = GaussianProcessRegression.Fit(x, y, new GaussianProcessOptions { Kernel = KernelKind.SquaredExponential, Seed = 7 });
        for (int q = 0; q < 2; q++)
        {
            double ratio = model.Hyperparameters.LengthScales[q] / TrueLengths[q];
            // Measured: 0.1524 and 0.4926 (ratios 1.016 and 0.985). The maximum-likelihood estimate from 4 × 120
            // values scatters by several per cent from seed to seed, so a factor 1.25 either way is a margin for the
            // draw, not for the method; it still separates 0.15 from 0.5 and fails on a wrong gradient or kernel.
            Assert.InRange(ratio, 1.0 / 1.25, 1.25);
        }
    }

    [Theory]
    [InlineData(KernelKind.SquaredExponential)]
    [InlineData(KernelKind.Matern52)]
    public void Fit_never_ends_below_the_marginal_likelihood_of_its_starting_point(KernelKind kernel)
    {
        (var x, var y) = Draws();
        var start = new GaussianProcessHyperparameters(1.0, [0.5, 0.5], 1e-6);
        var model = GaussianProcessRegression.Fit(
            x, y, new GaussianProcessOptions { Kernel = kernel, Initial = start, Restarts = 0, MaximumIterations = 30 });

        var standardized = Matrix<double>.Build.DenseOfColumnVectors(
            Enumerable.Range(0, y.ColumnCount).Select(j => DenseReference.Standardize(y.Column(j), out _, out _)));
        var likelihood = new MarginalLikelihood(x, standardized, kernel);
        double atStart = likelihood.Evaluate(start);
        // Every accepted step of the optimiser satisfies the Armijo decrease condition, so this is exact.
        Assert.True(model.LogMarginalLikelihood >= atStart, $"{model.LogMarginalLikelihood} < {atStart}");
        // And the model's recorded value is that of its hyperparameters (same computation; round-off only).
        Assert.Equal(likelihood.Evaluate(model.Hyperparameters), model.LogMarginalLikelihood, 1e-9 * Math.Abs(atStart));
    }

    [Fact]
    public void Fit_is_reproducible_for_a_given_seed()
    {
        (var x, var y) = Draws();
        var options = new GaussianProcessOptions { Restarts = 2, Seed = 99, MaximumIterations = 15 };
        var first = GaussianProcessRegression.Fit(x, y, options).Hyperparameters.ToLogParameters();
        var second = GaussianProcessRegression.Fit(x, y, options).Hyperparameters.ToLogParameters();
        Assert.Equal(first, second);
    }

    [Fact]
    public void Fit_starts_from_a_larger_nugget_when_the_initial_covariance_is_singular()
    {
        // Three copies of one point with different outputs and a nugget of 1e-30 (floor lowered to allow it): K is
        // σ_f² times a matrix of ones to double precision and fails to factor (see MarginalLikelihoodTests), so the
        // fit must raise the nugget before it can descend; the differences between the outputs are then noise.
        var x = Matrix<double>.Build.DenseOfArray(new double[,] { { 0.5 }, { 0.5 }, { 0.5 } });
        var y = Matrix<double>.Build.DenseOfArray(new double[,] { { 1.0 }, { 2.0 }, { 3.0 } });
        var model = GaussianProcessRegression.Fit(x, y, new GaussianProcessOptions
        {
            Kernel = KernelKind.SquaredExponential,
            Initial = new GaussianProcessHyperparameters(1.0, [10.0], 1e-30),
            MinimumNoiseVariance = 1e-30,
            Restarts = 0,
        });
        Assert.True(double.IsFinite(model.LogMarginalLikelihood));
        // Standardized outputs (−1.22, 0, 1.22) at one input: the likelihood wants a nugget of order their variance 1.
        Assert.InRange(model.Hyperparameters.NoiseVariance, 0.1, 1.0);
    }
}
