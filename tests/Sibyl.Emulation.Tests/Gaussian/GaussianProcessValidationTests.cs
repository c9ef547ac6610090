using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Emulation.Tests.Gaussian;

public sealed class GaussianProcessValidationTests
{
    private static readonly GaussianProcessHyperparameters Two = new(1.0, [0.5, 0.5], 1e-6);

    private static Matrix<double> Inputs(int n) => Designs.UnitBox(seed: 1, n: n, d: 2);

    [Fact]
    public void Non_finite_training_input_is_rejected_naming_inputs()
    {
        var x = Inputs(5);
        x[3, 1] = double.NaN;
        var error = Assert.Throws<ArgumentException>(() => GaussianProcessRegression.Fit(x, Designs.TwoWaves(Inputs(5))));
        Assert.Equal("inputs", error.ParamName);
        Assert.Contains("inputs[3, 1] = NaN", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Non_finite_training_output_is_rejected_naming_outputs()
    {
        var y = Designs.TwoWaves(Inputs(5));
        y[0, 1] = double.PositiveInfinity;
        Assert.Equal("outputs", Assert.Throws<ArgumentException>(() => GaussianProcessRegression.Condition(Inputs(5), y, KernelKind.Matern52, Two)).ParamName);
    }

    [Fact]
    public void Outputs_with_another_number_of_rows_are_rejected_naming_outputs()
    {
        var error = Assert.Throws<ArgumentException>(() => GaussianProcessRegression.Fit(Inputs(5), Designs.TwoWaves(Inputs(6))));
        Assert.Equal("outputs", error.ParamName);
    }

    [Fact]
    public void Fewer_than_two_training_points_are_rejected_naming_inputs()
    {
        var error = Assert.Throws<ArgumentException>(() => new MarginalLikelihood(Inputs(1), Designs.TwoWaves(Inputs(1)), KernelKind.Matern52));
        Assert.Equal("inputs", error.ParamName);
    }

    [Fact]
    public void Hyperparameters_of_another_dimension_are_rejected_naming_hyperparameters()
    {
        var three = new GaussianProcessHyperparameters(1.0, [0.5, 0.5, 0.5], 1e-6);
        var error = Assert.Throws<ArgumentException>(() => GaussianProcessRegression.Condition(Inputs(5), Designs.TwoWaves(Inputs(5)), KernelKind.Matern52, three));
        Assert.Equal("hyperparameters", error.ParamName);
    }

    [Theory]
    [InlineData(0.0, 0.5, 1e-6, "signalVariance")]
    [InlineData(1.0, -0.5, 1e-6, "lengthScales")]
    [InlineData(1.0, 0.5, double.NaN, "noiseVariance")]
    public void Hyperparameters_must_be_finite_and_positive(double signal, double length, double noise, string name)
    {
        var error = Assert.Throws<ArgumentException>(() => new GaussianProcessHyperparameters(signal, [length], noise));
        Assert.Equal(name, error.ParamName);
    }

    [Fact]
    public void Prediction_checks_the_point_and_every_destination()
    {
        var predictor = GaussianProcessRegression.Condition(Inputs(5), Designs.TwoWaves(Inputs(5)), KernelKind.Matern52, Two).CreatePredictor();
        Assert.Equal("input", Assert.Throws<ArgumentException>(() => predictor.PredictMean([0.5], new double[2])).ParamName);
        Assert.Equal("input", Assert.Throws<ArgumentException>(() => predictor.PredictMean([0.5, double.NaN], new double[2])).ParamName);
        Assert.Equal("mean", Assert.Throws<ArgumentException>(() => predictor.PredictMean([0.5, 0.5], new double[3])).ParamName);
        Assert.Equal("variance", Assert.Throws<ArgumentException>(() => predictor.Predict([0.5, 0.5], new double[2], new double[1], [])).ParamName);
        Assert.Equal("gradient", Assert.Throws<ArgumentException>(() => predictor.Predict([0.5, 0.5], new double[2], [], new double[2])).ParamName);
    }

    [Fact]
    public void Inconsistent_options_are_rejected_naming_options()
    {
        var x = Inputs(5);
        var y = Designs.TwoWaves(x);
        Assert.Equal("options", Assert.Throws<ArgumentException>(() => GaussianProcessRegression.Fit(x, y, new GaussianProcessOptions { Restarts = -1 })).ParamName);
        Assert.Equal("options", Assert.Throws<ArgumentException>(() =>
            GaussianProcessRegression.Fit(x, y, new GaussianProcessOptions { MinimumLengthScale = 2.0, MaximumLengthScale = 1.0 })).ParamName);
    }

    [Fact]
    public void Model_arrays_of_inconsistent_sizes_are_rejected_naming_the_array()
    {
        var model = GaussianProcessRegression.Condition(Inputs(5), Designs.TwoWaves(Inputs(5)), KernelKind.Matern52, Two);
        var error = Assert.Throws<ArgumentException>(() => GaussianProcessModel.FromArrays(
            model.Kernel, model.Hyperparameters, model.TrainingInputs.ToArray(), model.Alpha[1..].ToArray(),
            model.OutputMean.ToArray(), model.OutputScale.ToArray(), null, model.LogMarginalLikelihood));
        Assert.Equal("alpha", error.ParamName);
    }
}
