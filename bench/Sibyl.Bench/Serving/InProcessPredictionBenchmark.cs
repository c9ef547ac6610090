using BenchmarkDotNet.Attributes;
using Sibyl.Emulation.Emulators;

namespace Sibyl.Bench.Serving;

/// <summary>
/// The same emulator evaluated in process, for comparison with the served numbers: every basis term on its 30 k and
/// the observable assembled with cs2, with and without the gradient; what the server does per point, less the wire.
/// </summary>
[Config(typeof(ThroughputConfig))]
public class InProcessPredictionBenchmark
{
    private readonly double[] _parameters = [0.12, 0.68, 0.8];
    private readonly double[] _nuisance = [1.0];
    private EmulatorPredictor _predictor = null!;
    private double[] _values = [], _gradient = [], _observable = [];

    [GlobalSetup]
    public void Setup()
    {
        var emulator = ServingEmulator.Load();
        _predictor = emulator.CreatePredictor();
        int size = emulator.Layout.Terms.Count * emulator.K.Count;
        _values = new double[size];
        _gradient = new double[size * emulator.ParameterNames.Count];
        _observable = new double[emulator.K.Count];
    }

    [Benchmark(Baseline = true, Description = "in-process predict + assemble")]
    public double[] Predict()
    {
        _predictor.Predict(_parameters, 0).Assemble(_nuisance, 0, _observable);
        return _observable;
    }

    [Benchmark(Description = "in-process predict with gradient")]
    public double[] PredictWithGradient()
    {
        _predictor.Predict(_parameters, 0, _values, [], _gradient);
        return _gradient;
    }
}
