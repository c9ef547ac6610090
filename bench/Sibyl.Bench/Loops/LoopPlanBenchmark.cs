using BenchmarkDotNet.Attributes;
using Sibyl.Perturbation.Loops;

namespace Sibyl.Bench.Loops;

/// <summary>How long does building the cosmology-independent plan for 100 output k take?</summary>
[MemoryDiagnoser]
[MedianColumn]
[MinColumn]
[MaxColumn]
public class LoopPlanBenchmark
{
    private double[] _k = null!;

    [GlobalSetup]
    public void Setup() => _k = BenchmarkSpectra.OutputGrid();

    [Benchmark]
    public LoopQuadrature BuildPlan() => new(_k);
}
