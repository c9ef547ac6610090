using BenchmarkDotNet.Attributes;
using Sibyl.Cosmology.Background;
using Sibyl.Cosmology.Gravity;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Bench.Perturbation;

/// <summary>How long the second- and third-order time coefficients of one cosmology take to solve.</summary>
[Config(typeof(SibylBenchConfig))]
public class TimeCoefficientsBenchmark
{
    private readonly ExpansionHistory _background = new(0.31);
    private IGravityModel _ndgp = GeneralRelativity.Instance;

    [GlobalSetup]
    public void Setup() => _ndgp = new NormalBranchDgp(_background, 0.25);

    [Benchmark(Baseline = true)]
    public TimeCoefficients Lcdm() => TimeCoefficientSolver.Solve(_background, GeneralRelativity.Instance, 1.0 / 1.5);

    [Benchmark]
    public TimeCoefficients Ndgp() => TimeCoefficientSolver.Solve(_background, _ndgp, 1.0 / 1.5);
}
