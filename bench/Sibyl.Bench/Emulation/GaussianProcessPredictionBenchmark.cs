using BenchmarkDotNet.Attributes;
using Sibyl.Emulation.Compression;
using Sibyl.Emulation.Gaussian;

namespace Sibyl.Bench.Emulation;

/// <summary>
/// How long does one emulated spectrum take? 1000 training points, 8 inputs, 10 outputs sharing one kernel
/// (DESIGN.md target ≤ 5 µs per spectrum for the mean). Hyperparameters are fixed (ℓ = 0.7, σ_f² = 1, σ_n² = 1e-8):
/// the prediction cost does not depend on their values.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class GaussianProcessPredictionBenchmark
{
    private GaussianProcessPredictor _predictor = null!;
    private PrincipalComponents _basis = null!;
    private double[] _point = null!;
    private double[] _mean = null!;
    private double[] _variance = null!;
    private double[] _gradient = null!;
    private double[] _spectrum = null!;

    [Params(KernelKind.SquaredExponential, KernelKind.Matern52)]
    public KernelKind Kernel { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var x = EmulationData.Inputs(1000);
        var hyperparameters = new GaussianProcessHyperparameters(1.0, Enumerable.Repeat(0.7, EmulationData.Dimension).ToArray(), 1e-8);
        _predictor = GaussianProcessRegression.Condition(x, EmulationData.Targets(x), Kernel, hyperparameters).CreatePredictor();
        // A 10-component basis over 100 k values, as the spectrum block behind the 10 outputs would have.
        var random = new Random(7);
        var spectra = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(
            40, 100, (i, k) => Math.Sin((0.05 * k * (1.0 + (0.1 * i))) + random.NextDouble()));
        _basis = PrincipalComponents.Fit(spectra, new PrincipalComponentsOptions { MaximumCount = EmulationData.Outputs });
        _point = EmulationData.Point();
        _mean = new double[EmulationData.Outputs];
        _variance = new double[EmulationData.Outputs];
        _gradient = new double[EmulationData.Outputs * EmulationData.Dimension];
        _spectrum = new double[100];
    }

    [Benchmark(Baseline = true, Description = "mean of 10 outputs")]
    public double Mean()
    {
        _predictor.PredictMean(_point, _mean);
        return _mean[0];
    }

    [Benchmark(Description = "mean + PCA reconstruction of 100 k")]
    public double Spectrum()
    {
        _predictor.PredictMean(_point, _mean);
        _basis.Reconstruct(_mean, _spectrum);
        return _spectrum[0];
    }

    [Benchmark(Description = "mean + variance")]
    public double MeanAndVariance()
    {
        _predictor.Predict(_point, _mean, _variance, []);
        return _variance[0];
    }

    [Benchmark(Description = "mean + gradient (10 × 8)")]
    public double MeanAndGradient()
    {
        _predictor.Predict(_point, _mean, [], _gradient);
        return _gradient[0];
    }
}
