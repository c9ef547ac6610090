using BenchmarkDotNet.Attributes;
using Sibyl.Cosmology;
using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Bench.Boltzmann;

/// <summary>
/// How long does the built-in Boltzmann solver take for one new cosmology? The whole linear spectrum (background,
/// recombination, every solver wavenumber to z = 0, normalisation and no-wiggle split) on one thread and on all
/// cores; the target is ≤ 1 s for 100–200 k values on 2 cores. The thermal history and the mode tables alone are timed too, since it is
/// paid once per cosmology whatever the number of modes.
/// </summary>
[Config(typeof(SibylBenchConfig))]
public class BoltzmannSolverBenchmark
{
    private readonly CosmologyParameters _parameters = new() { H = 0.6736, OmegaBaryon = 0.02237, OmegaCdm = 0.1200, SpectralIndex = 0.9649, Ln10As = 3.044, Sigma8 = null };
    private double _growthToday;

    /// <summary>Worker threads for the modes.</summary>
    [Params(1, 2)]
    public int Threads { get; set; }

    [GlobalSetup]
    public void Setup() => _growthToday = CosmologyModel.Create(_parameters).LcdmGrowthToday;

    [Benchmark]
    public double LinearSpectrum() => BoltzmannLinear.Compute(_parameters, _growthToday, Threads).Shape.Evaluate(0.1);

    [Benchmark]
    public double ThermalHistoryAndTables() => new TransferSolver(new RadiationBackground(_parameters), _parameters.HeliumFraction).Thermal.SoundHorizonAtDrag;
}
