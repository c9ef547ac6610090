using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class ModelStateTests
{
    [Fact]
    public void Model_rebuilt_from_its_plain_arrays_predicts_bit_identically()
    {
        var x = Designs.UnitBox(seed: 8, n: 25, d: 3);
        var model = GaussianProcessRegression.Condition(
            x, Designs.TwoWaves(x), KernelKind.SquaredExponential, new GaussianProcessHyperparameters(0.8, [0.3, 0.5, 0.7], 1e-5));
        // Everything through plain arrays and numbers, as a file layer would store them.
        var h = model.Hyperparameters;
        var copy = GaussianProcessModel.FromArrays(
            model.Kernel,
            new GaussianProcessHyperparameters(h.SignalVariance, h.LengthScales.ToArray(), h.NoiseVariance),
            model.TrainingInputs.ToArray(),
            model.Alpha.ToArray(),
            model.OutputMean.ToArray(),
            model.OutputScale.ToArray(),
            model.CholeskyFactor.ToArray(),
            model.LogMarginalLikelihood);
        double[] point = [0.2, 0.6, 0.9];
        Assert.Equal(Predict(model, point), Predict(copy, point));
        Assert.Equal(model.LogMarginalLikelihood, copy.LogMarginalLikelihood);
    }

    [Fact]
    public void Each_output_of_a_shared_kernel_equals_its_own_single_output_process()
    {
        var x = Designs.UnitBox(seed: 9, n: 20, d: 2);
        var y = Designs.TwoWaves(x);
        var hyperparameters = new GaussianProcessHyperparameters(1.1, [0.3, 0.45], 1e-5);
        var both = GaussianProcessRegression.Condition(x, y, KernelKind.Matern52, hyperparameters).CreatePredictor();
        var mean = new double[2];
        var variance = new double[2];
        both.Predict([0.4, 0.35], mean, variance, []);
        for (int j = 0; j < 2; j++)
        {
            var single = GaussianProcessRegression.Condition(x, y.SubMatrix(0, 20, j, 1), KernelKind.Matern52, hyperparameters)
                .CreatePredictor();
            var one = new double[1];
            var oneVariance = new double[1];
            single.Predict([0.4, 0.35], one, oneVariance, []);
            // Shared K and per-output α_j = K⁻¹y_j: identical algebra, so agreement to round-off (1e-12 relative).
            Assert.Equal(one[0], mean[j], 1e-12 * Math.Max(1.0, Math.Abs(one[0])));
            Assert.Equal(oneVariance[0], variance[j], 1e-12 * Math.Max(1.0, oneVariance[0]));
        }
    }

    [Fact]
    public void Prediction_allocates_nothing_on_the_heap()
    {
        var x = Designs.UnitBox(seed: 10, n: 50, d: 4);
        var y = Matrix<double>.Build.Dense(50, 3, (i, j) => Math.Sin(x[i, 0] + j) * x[i, 3]);
        var predictor = GaussianProcessRegression.Condition(
            x, y, KernelKind.Matern52, new GaussianProcessHyperparameters(1.0, [0.5, 0.5, 0.5, 0.5], 1e-6)).CreatePredictor();
        double[] point = [0.1, 0.2, 0.3, 0.4];
        var mean = new double[3];
        var variance = new double[3];
        var gradient = new double[12];
        predictor.Predict(point, mean, variance, gradient);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 100; i++)
        {
            predictor.Predict(point, mean, variance, gradient);
            predictor.PredictMean(point, mean);
        }

        Assert.Equal(before, GC.GetAllocatedBytesForCurrentThread());
    }

    [Fact]
    public void Model_without_its_Cholesky_factor_predicts_means_but_refuses_variances()
    {
        var x = Designs.UnitBox(seed: 12, n: 10, d: 2);
        var model = GaussianProcessRegression.Condition(
            x, Designs.TwoWaves(x), KernelKind.SquaredExponential, new GaussianProcessHyperparameters(1.0, [0.5, 0.5], 1e-6),
            keepCholeskyFactor: false);
        Assert.False(model.HasCholeskyFactor);
        Assert.True(model.CholeskyFactor.IsEmpty);
        var predictor = model.CreatePredictor();
        predictor.PredictMean([0.5, 0.5], new double[2]);
        Assert.Throws<InvalidOperationException>(() => predictor.Predict([0.5, 0.5], new double[2], new double[2], []));
    }

    private static double[] Predict(GaussianProcessModel model, double[] point)
    {
        var mean = new double[2];
        var variance = new double[2];
        var gradient = new double[2 * point.Length];
        model.CreatePredictor().Predict(point, mean, variance, gradient);
        return [.. mean, .. variance, .. gradient];
    }
}
