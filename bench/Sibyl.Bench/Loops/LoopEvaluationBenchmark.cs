using BenchmarkDotNet.Attributes;
using Sibyl.Perturbation.Loops;

namespace Sibyl.Bench.Loops;

/// <summary>How long do all nine one-loop integrals take for a spectrum and its no-wiggle partner at 100 k?</summary>
[MemoryDiagnoser]
[MedianColumn]
[MinColumn]
[MaxColumn]
public class LoopEvaluationBenchmark
{
    private LoopQuadrature _plan = null!;
    private LogSampledSpectrum _wiggly = null!;
    private LogSampledSpectrum _smooth = null!;
    private MomentumIntegrals _wigglyResult = null!;
    private MomentumIntegrals _smoothResult = null!;

    [GlobalSetup]
    public void Setup()
    {
        _plan = new LoopQuadrature(BenchmarkSpectra.OutputGrid());
        _wiggly = new LogSampledSpectrum(BenchmarkSpectra.Wiggly);
        _smooth = new LogSampledSpectrum(BenchmarkSpectra.Smooth);
        _wigglyResult = new MomentumIntegrals(_plan.KCount);
        _smoothResult = new MomentumIntegrals(_plan.KCount);
    }

    [Benchmark(Baseline = true)]
    public MomentumIntegrals BothSpectra()
    {
        _plan.Compute(_wiggly, _smooth, _wigglyResult, _smoothResult);
        return _wigglyResult;
    }

    [Benchmark]
    public MomentumIntegrals OneSpectrum()
    {
        _plan.Compute(_wiggly, _wigglyResult);
        return _wigglyResult;
    }
}
