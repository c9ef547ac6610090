using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class MarginalLikelihoodTests
{
    [Theory]
    [InlineData(KernelKind.SquaredExponential)]
    [InlineData(KernelKind.Matern52)]
    public void Log_marginal_likelihood_equals_the_dense_closed_form_summed_over_outputs(KernelKind kernel)
    {
        var x = Designs.UnitBox(seed: 11, n: 12, d: 3);
        var y = Designs.TwoWaves(x);
        double[] lengths = [0.5, 0.8, 1.7];
        var likelihood = new MarginalLikelihood(x, y, kernel);
        double value = likelihood.Evaluate(new GaussianProcessHyperparameters(0.9, lengths, 1e-3));

        var reference = new DenseReference(x, kernel, 0.9, lengths, 1e-3);
        double expected = reference.LogMarginalLikelihood(y.Column(0)) + reference.LogMarginalLikelihood(y.Column(1));
        // Rasmussen & Williams 2006, eq. 2.30, via an explicit inverse and MathNet's LU determinant. Condition number
        // ~1e3–1e4 (nugget 1e-3); 1e-9 relative is far above that round-off and far below any formula error.
        Assert.Equal(expected, value, 1e-9 * Math.Abs(expected));
    }

    [Theory]
    [InlineData(KernelKind.SquaredExponential)]
    [InlineData(KernelKind.Matern52)]
    public void Gradient_equals_central_finite_differences_in_every_log_hyperparameter(KernelKind kernel)
    {
        var x = Designs.UnitBox(seed: 5, n: 15, d: 3);
        var y = Designs.TwoWaves(x);
        var likelihood = new MarginalLikelihood(x, y, kernel);
        double[] theta = new GaussianProcessHyperparameters(1.2, [0.3, 0.6, 1.1], 2e-3).ToLogParameters();
        var gradient = new double[theta.Length];
        likelihood.Evaluate(theta, gradient);

        // Central differences with step h = 1e-5 in log space: truncation ~h²|f'''| ≈ 1e-10·|f| and rounding
        // ~1e-16·|f|/h ≈ 1e-10 for |f| ~ 10, so 1e-6 (relative to max(1, |g|)) is a wide margin; a wrong term of
        // eq. 5.9 (Rasmussen & Williams 2006) changes a component by order 1.
        const double step = 1e-5;
        var plus = new double[theta.Length];
        for (int i = 0; i < theta.Length; i++)
        {
            theta.CopyTo(plus, 0);
            plus[i] = theta[i] + step;
            double up = likelihood.Evaluate(plus, []);
            plus[i] = theta[i] - step;
            double down = likelihood.Evaluate(plus, []);
            double expected = (up - down) / (2.0 * step);
            Assert.Equal(expected, gradient[i], 1e-6 * Math.Max(1.0, Math.Abs(expected)));
        }
    }

    [Fact]
    public void Covariance_that_is_not_positive_definite_gives_minus_infinity_not_an_exception()
    {
        // Two identical points, a long length scale and a nugget far below the double round-off of σ_f²: K is
        // singular in double precision, which is what the optimiser must be able to step back from.
        var x = Matrix<double>.Build.DenseOfArray(new double[,] { { 0.5 }, { 0.5 }, { 0.5 } });
        var y = Matrix<double>.Build.DenseOfArray(new double[,] { { 1.0 }, { 2.0 }, { 3.0 } });
        var likelihood = new MarginalLikelihood(x, y, KernelKind.SquaredExponential);
        var gradient = new double[3];
        double value = likelihood.Evaluate(new GaussianProcessHyperparameters(1.0, [10.0], 1e-30).ToLogParameters(), gradient);
        Assert.Equal(double.NegativeInfinity, value);
        Assert.All(gradient, g => Assert.True(double.IsNaN(g)));
    }
}
