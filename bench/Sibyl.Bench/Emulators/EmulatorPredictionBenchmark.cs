using BenchmarkDotNet.Attributes;
using Sibyl.Emulation.Emulators;
using Sibyl.Perturbation.Spectra;
using Sibyl.Training.Design;
using Sibyl.Training.Runs;
using Sibyl.Training.Specs;

namespace Sibyl.Bench.Emulators;

/// <summary>
/// In-process prediction of one spectrum (both matter basis terms at 40 k values) from an emulator with 1000 training
/// points and 8 parameters (the quasi-static model's box: h, ω_b, ω_cdm, n_s, ln10As, z, mu0, vertex2), as fitted by
/// default (the leading component per term with its own process, the rest sharing one). DESIGN.md target: ≤ 5 µs
/// for the mean. The setup computes the 1000-point training set directly and fits with a short hyperparameter search
/// (prediction cost does not depend on how well the hyperparameters were optimised).
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class EmulatorPredictionBenchmark
{
    private const string Spec = """
        {
          "name": "bench-qs-8d", "output": "matter", "model": "qs",
          "vary": { "h": [0.62, 0.74], "omega_b": [0.0205, 0.0245], "omega_cdm": [0.105, 0.135], "n_s": [0.92, 1.01],
                    "ln10As": [2.8, 3.25], "z": [0.2, 1.5], "mu0": [-0.2, 0.3], "vertex2": [-1, 1] },
          "k": { "min": 0.01, "max": 0.3, "count": 40 },
          "points": { "training": 1000, "heldout": 20 },
          "seed": 8, "chunk_size": 50
        }
        """;

    private EmulatorPredictor _predictor = null!;
    private double[] _point = null!, _values = null!, _variance = null!, _gradient = null!;
    private string _folder = "";

    [GlobalSetup]
    public void Setup()
    {
        var design = TrainingDesign.Create(GridSpecReader.Parse(Spec, "benchmark spec"));
        _folder = Path.Combine(Path.GetTempPath(), $"sibyl-bench-emulator-{Guid.NewGuid():N}");
        new TrainingRun(design, _folder, ShardSelection.All, Environment.ProcessorCount, retryFailed: false).Execute(null, null, CancellationToken.None);
        var set = TrainingSetMerger.Merge(design, [_folder]);
        var emulator = EmulatorFitter.Fit(set, new EmulatorFitOptions { HyperparameterPoints = 150, Restarts = 0, MaxIterations = 30, KeepVariance = true }, null);
        _predictor = emulator.CreatePredictor();
        _point = [0.68, 0.0224, 0.12, 0.965, 3.05, 0.8, 0.05, 0.2];
        int size = emulator.Layout.Terms.Count * emulator.K.Count;
        _values = new double[size];
        _variance = new double[size];
        _gradient = new double[size * _point.Length];
    }

    [GlobalCleanup]
    public void Cleanup() => Directory.Delete(_folder, recursive: true);

    [Benchmark(Baseline = true, Description = "mean (BasisSpectra)")]
    public BasisSpectra Mean() => _predictor.Predict(_point);

    [Benchmark(Description = "mean and gradient")]
    public double[] Gradient()
    {
        _predictor.Predict(_point, 0, _values, [], _gradient);
        return _gradient;
    }

    [Benchmark(Description = "mean and variance")]
    public double[] Variance()
    {
        _predictor.Predict(_point, 0, _values, _variance, []);
        return _variance;
    }
}
