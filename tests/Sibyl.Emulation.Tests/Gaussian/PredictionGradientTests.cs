using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class PredictionGradientTests
{
    [Theory]
    [InlineData(KernelKind.SquaredExponential)]
    [InlineData(KernelKind.Matern52)]
    public void Mean_gradient_equals_central_finite_differences_of_the_prediction(KernelKind kernel)
    {
        var x = Designs.UnitBox(seed: 3, n: 40, d: 3);
        var y = Designs.TwoWaves(x);
        var model = GaussianProcessRegression.Condition(
            x, y, kernel, new GaussianProcessHyperparameters(1.0, [0.35, 0.5, 0.9], 1e-6));
        var predictor = model.CreatePredictor();
        var mean = new double[2];
        var gradient = new double[6];
        var up = new double[2];
        var down = new double[2];
        var random = new Random(17);
        for (int trial = 0; trial < 5; trial++)
        {
            double[] point = [random.NextDouble(), random.NextDouble(), random.NextDouble()];
            predictor.Predict(point, mean, [], gradient);
            for (int q = 0; q < 3; q++)
            {
                // Central differences with h = 1e-6 (unit-box units): truncation ~h²|f'''| ≲ 1e-9 for length scales
                // ≥ 0.35 and outputs of order 10, rounding ~1e-16·10/h = 1e-9; 1e-6 relative (floor 1) is a wide margin.
                const double step = 1e-6;
                double[] shifted = (double[])point.Clone();
                shifted[q] = point[q] + step;
                predictor.PredictMean(shifted, up);
                shifted[q] = point[q] - step;
                predictor.PredictMean(shifted, down);
                for (int j = 0; j < 2; j++)
                {
                    double expected = (up[j] - down[j]) / (2.0 * step);
                    Assert.Equal(expected, gradient[(j * 3) + q], 1e-6 * Math.Max(1.0, Math.Abs(expected)));
                }
            }
        }
    }

    [Fact]
    public void Mean_is_the_same_whether_or_not_variance_and_gradient_are_requested()
    {
        var x = Designs.UnitBox(seed: 4, n: 30, d: 2);
        var model = GaussianProcessRegression.Condition(
            x, Designs.TwoWaves(x), KernelKind.Matern52, new GaussianProcessHyperparameters(1.0, [0.4, 0.4], 1e-6));
        var predictor = model.CreatePredictor();
        var alone = new double[2];
        var together = new double[2];
        predictor.PredictMean([0.3, 0.7], alone);
        predictor.Predict([0.3, 0.7], together, new double[2], new double[4]);
        // Same arithmetic in the same order: exact equality is the contract.
        Assert.Equal(alone, together);
    }
}
