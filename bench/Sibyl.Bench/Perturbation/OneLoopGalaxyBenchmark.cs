using BenchmarkDotNet.Attributes;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Bench.Perturbation;

/// <summary>
/// All galaxy basis terms (P0, P2, P4) for one cosmology at 60 k in 0.01–0.3 h/Mpc (DESIGN.md target
/// ≤ 30 ms per cosmology per core); plans built once per k grid and shared, as in a training run.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class OneLoopGalaxyBenchmark
{
    private OneLoopGalaxy _calculator = null!;
    private CosmologyParameters _parameters = null!;

    [GlobalSetup]
    public void Setup()
    {
        _calculator = new OneLoopGalaxy(LogGridFunction.LogGrid(0.01, 0.3, 60));
        _parameters = new CosmologyParameters();
    }

    [Benchmark(Description = "all galaxy basis terms, new cosmology, 60 k")]
    public GalaxySpectrum Whole() => _calculator.Compute(CosmologyModel.Create(_parameters), 1.0);
}
