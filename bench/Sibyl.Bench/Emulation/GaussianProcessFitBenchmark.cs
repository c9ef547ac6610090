using BenchmarkDotNet.Attributes;
using MathNet.Numerics.LinearAlgebra;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Bench.Emulation;

/// <summary>
/// How long does a hyperparameter fit take for 8 inputs and 10 outputs sharing one Matérn-5/2 kernel? 200 points are
/// fitted to convergence from the default start (no restarts); 1000 points run 5 L-BFGS iterations only, enough to
/// time the per-iteration cost (one n³ factorisation and inverse per likelihood evaluation), which a full fit
/// multiplies by its iteration count. One likelihood-with-gradient evaluation at 1000 points is timed on its own.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class GaussianProcessFitBenchmark
{
    private Matrix<double> _x200 = null!;
    private Matrix<double> _y200 = null!;
    private Matrix<double> _x1000 = null!;
    private Matrix<double> _y1000 = null!;
    private MarginalLikelihood _likelihood = null!;
    private double[] _theta = null!;
    private double[] _gradient = null!;

    [GlobalSetup]
    public void Setup()
    {
        _x200 = EmulationData.Inputs(200);
        _y200 = EmulationData.Targets(_x200);
        _x1000 = EmulationData.Inputs(1000);
        _y1000 = EmulationData.Targets(_x1000);
        _likelihood = new MarginalLikelihood(_x1000, _y1000, KernelKind.Matern52);
        _theta = new GaussianProcessHyperparameters(1.0, Enumerable.Repeat(0.7, EmulationData.Dimension).ToArray(), 1e-6).ToLogParameters();
        _gradient = new double[_theta.Length];
    }

    [Benchmark(Baseline = true, Description = "fit, 200 points, to convergence")]
    public GaussianProcessModel Fit200() =>
        GaussianProcessRegression.Fit(_x200, _y200, new GaussianProcessOptions { Restarts = 0 });

    [Benchmark(Description = "fit, 1000 points, 5 iterations")]
    public GaussianProcessModel Fit1000() =>
        GaussianProcessRegression.Fit(_x1000, _y1000, new GaussianProcessOptions { Restarts = 0, MaximumIterations = 5 });

    [Benchmark(Description = "log likelihood + gradient, 1000 points")]
    public double LikelihoodAndGradient1000() => _likelihood.Evaluate(_theta, _gradient);
}
