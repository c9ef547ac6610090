using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;

namespace Sibyl.Bench.Serving;

/// <summary>
/// Round-trip latency, two ways. "single-call": one call per iteration, 3000 iterations after 300 warm-up ones, so
/// that the median and the 99th percentile are those of single calls (the timer costs tens of ns against the call);
/// between calls the benchmark engine does its own bookkeeping, so the server's and client's threads go idle as they
/// would while a sampler computes its likelihood, and every call pays for waking them. "back-to-back": the default
/// job, many calls per iteration, the warm per-call time of a client that does nothing else. In process (no generated
/// project to build): the server runs in the benchmark's own process anyway.
/// </summary>
public sealed class LatencyConfig : ManualConfig
{
    public LatencyConfig()
    {
        Add(new SibylBenchConfig());
        AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).WithWarmupCount(300).WithIterationCount(3000).WithInvocationCount(1).WithUnrollFactor(1).WithId("single-call"));
        AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).WithId("back-to-back"));
        AddColumn(StatisticColumn.Median, StatisticColumn.P95, new PercentileColumn(99), new ThroughputColumn());
    }
}
