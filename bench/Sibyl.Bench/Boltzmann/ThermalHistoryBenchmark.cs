using BenchmarkDotNet.Attributes;
using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Boltzmann.Recombination;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Bench.Boltzmann;

/// <summary>
/// How long does the thermal history of one cosmology take to solve, and how long one opacity look-up from
/// the perturbation equations' right-hand side (called ~10⁶ times per spectrum)?
/// </summary>
[Config(typeof(SibylBenchConfig))]
[MedianColumn]
[MinColumn]
[MaxColumn]
public class ThermalHistoryBenchmark
{
    private const int LookUps = 1000;

    private RadiationBackground _background = null!;
    private ThermalHistory _history = null!;

    [GlobalSetup]
    public void Setup()
    {
        _background = new RadiationBackground(new CosmologyParameters { H = 0.6736, OmegaBaryon = 0.02237, OmegaCdm = 0.1200 });
        _history = ThermalHistory.Solve(_background, 0.2454);
    }

    [Benchmark]
    public ThermalHistory Solve() => ThermalHistory.Solve(_background, 0.2454);

    [Benchmark(OperationsPerInvoke = LookUps)]
    public double Opacity()
    {
        double sum = 0.0;
        for (int i = 0; i < LookUps; i++)
        {
            sum += _history.Opacity(-14.0 + 0.013 * i);
        }

        return sum;
    }
}
