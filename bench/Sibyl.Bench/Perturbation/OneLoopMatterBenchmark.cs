using BenchmarkDotNet.Attributes;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Matter;

namespace Sibyl.Bench.Perturbation;

/// <summary>
/// The whole direct matter calculation for one cosmology at 100 k in 0.005–0.5 h/Mpc (DESIGN.md target
/// ≤ 3 ms per cosmology per core): linear spectrum and its split, loop integrals of both, time
/// coefficients and assembly. The quadrature plan is built once per k grid and shared, as in a training run.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class OneLoopMatterBenchmark
{
    private OneLoopMatter _calculator = null!;
    private CosmologyParameters _parameters = null!;
    private CosmologyModel _model = null!;
    private PreparedMatterShape _prepared = null!;

    [GlobalSetup]
    public void Setup()
    {
        _calculator = new OneLoopMatter(LogGridFunction.LogGrid(0.005, 0.5, 100));
        _parameters = new CosmologyParameters();
        _model = CosmologyModel.Create(_parameters);
        _prepared = _calculator.Prepare(_model.Linear);
    }

    [Benchmark(Baseline = true, Description = "whole calculation, new cosmology")]
    public MatterSpectrum Whole() => _calculator.Compute(CosmologyModel.Create(_parameters), 0.5);

    [Benchmark(Description = "linear spectrum and no-wiggle split")]
    public CosmologyModel Linear() => CosmologyModel.Create(_parameters);

    [Benchmark(Description = "loop integrals of both spectra")]
    public PreparedMatterShape Loops() => _calculator.Prepare(_model.Linear);

    [Benchmark(Description = "time coefficients and assembly at one z")]
    public MatterSpectrum Assembly() => _calculator.Compute(_prepared, _model, 0.5);
}
