using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;

namespace Sibyl.Bench.Serving;

/// <summary>Throughput: BenchmarkDotNet's default job, plus spectra per second.</summary>
public sealed class ThroughputConfig : ManualConfig
{
    public ThroughputConfig()
    {
        Add(new SibylBenchConfig());
        AddColumn(StatisticColumn.Median, new ThroughputColumn());
    }
}
