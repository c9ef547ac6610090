using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;

namespace Sibyl.Bench.Serving;

/// <summary>Throughput: BenchmarkDotNet's default job run in process (as the servers are), plus spectra per second.</summary>
public sealed class ThroughputConfig : ManualConfig
{
    public ThroughputConfig()
    {
        Add(new SibylBenchConfig());
        AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance));
        AddColumn(StatisticColumn.Median, new ThroughputColumn());
    }
}
