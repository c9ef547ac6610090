using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class PosteriorTests
{
    // Six points in 2-D with two outputs and fixed hyperparameters: small enough to invert by hand.
    private static readonly Matrix<double> Inputs = Matrix<double>.Build.DenseOfArray(new double[,]
    {
        { 0.10, 0.20 }, { 0.85, 0.15 }, { 0.45, 0.55 }, { 0.20, 0.90 }, { 0.70, 0.75 }, { 0.55, 0.05 },
    });

    private static readonly double[] Lengths = [0.4, 0.7];
    private const double Signal = 1.3;
    private const double Noise = 1e-4;

    private static readonly double[][] Points = [[0.3, 0.4], [0.95, 0.95], [0.45, 0.55], [-0.2, 0.5]];

    [Theory]
    [InlineData(KernelKind.SquaredExponential)]
    [InlineData(KernelKind.Matern52)]
    public void Posterior_mean_and_variance_equal_the_dense_closed_form(KernelKind kernel)
    {
        var outputs = Designs.TwoWaves(Inputs);
        var model = GaussianProcessRegression.Condition(
            Inputs, outputs, kernel, new GaussianProcessHyperparameters(Signal, Lengths, Noise));
        var predictor = model.CreatePredictor();
        var reference = new DenseReference(Inputs, kernel, Signal, Lengths, Noise);
        var mean = new double[2];
        var variance = new double[2];
        foreach (double[] point in Points)
        {
            predictor.Predict(point, mean, variance, []);
            for (int j = 0; j < 2; j++)
            {
                var standardized = DenseReference.Standardize(outputs.Column(j), out double centre, out double scale);
                double expectedMean = centre + (scale * reference.Mean(point, standardized));
                double expectedVariance = scale * scale * reference.Variance(point);
                // Rasmussen & Williams 2006, eqs. 2.25–2.26, via an explicit MathNet inverse. K has condition number
                // ~1e4 (nugget 1e-4), so both routes agree to ~1e4 × 1e-16 relative; 1e-10 leaves a wide margin and
                // still catches any error in the formulas, which would be of order 1e-2 or more.
                Assert.Equal(expectedMean, mean[j], 1e-10 * Math.Max(1.0, Math.Abs(expectedMean)));
                Assert.Equal(expectedVariance, variance[j], 1e-10 * scale * scale * Signal);
            }
        }
    }

    [Fact]
    public void Posterior_variance_collapses_to_the_nugget_scale_at_a_training_point_and_reverts_to_the_prior_far_away()
    {
        var outputs = Designs.TwoWaves(Inputs);
        var model = GaussianProcessRegression.Condition(
            Inputs, outputs.SubMatrix(0, 6, 0, 1), KernelKind.Matern52, new GaussianProcessHyperparameters(Signal, Lengths, Noise));
        var predictor = model.CreatePredictor();
        var mean = new double[1];
        var variance = new double[1];
        double priorVariance = Signal * model.OutputScale[0] * model.OutputScale[0];

        predictor.Predict([0.45, 0.55], mean, variance, []);
        // At a training point the latent variance is below the nugget σ_n² (R&W eq. 2.26 with k* a column of K).
        Assert.InRange(variance[0], 0.0, Noise * model.OutputScale[0] * model.OutputScale[0]);

        predictor.Predict([30.0, -30.0], mean, variance, []);
        // 40+ length scales away every k* entry is below e^-90: the prior σ_f² and mean return to round-off.
        Assert.Equal(priorVariance, variance[0], 1e-12 * priorVariance);
        Assert.Equal(model.OutputMean[0], mean[0], 1e-12);
    }
}
