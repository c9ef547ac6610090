using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;

namespace Sibyl.Bench.Serving;

/// <summary>
/// Round-trip latency: one call per iteration, 3000 iterations after 300 warm-up ones, so that the median and the
/// 99th percentile are those of single calls (each iteration's timer costs tens of ns against ~100 µs). In process
/// (no generated project to build): the server runs in the benchmark's own process anyway.
/// </summary>
public sealed class LatencyConfig : ManualConfig
{
    public LatencyConfig()
    {
        Add(new SibylBenchConfig());
        AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).WithWarmupCount(300).WithIterationCount(3000).WithInvocationCount(1).WithUnrollFactor(1));
        AddColumn(StatisticColumn.Median, StatisticColumn.P95, new PercentileColumn(99), new ThroughputColumn());
    }
}
