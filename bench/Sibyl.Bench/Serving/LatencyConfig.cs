using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;

namespace Sibyl.Bench.Serving;

/// <summary>
/// Round-trip latency: one call per iteration, 3000 iterations after 300 warm-up ones, so that the median and the
/// 99th percentile are those of single calls (each iteration's timer costs tens of ns against ~100 µs).
/// </summary>
public sealed class LatencyConfig : ManualConfig
{
    public LatencyConfig()
    {
        Add(new SibylBenchConfig());
        AddJob(Job.Default.WithLaunchCount(1).WithWarmupCount(300).WithIterationCount(3000).WithInvocationCount(1).WithUnrollFactor(1));
        AddColumn(StatisticColumn.Median, StatisticColumn.P95, new PercentileColumn(99), new ThroughputColumn());
    }
}
