using System.Globalization;
using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Reports;
using BenchmarkDotNet.Running;

namespace Sibyl.Bench.Serving;

/// <summary>Spectra per second: one over the mean time per operation (benchmarks set OperationsPerInvoke to the spectra per call).</summary>
public sealed class ThroughputColumn : IColumn
{
    public string Id => nameof(ThroughputColumn);

    public string ColumnName => "Spectra/s";

    public bool AlwaysShow => true;

    public ColumnCategory Category => ColumnCategory.Custom;

    public int PriorityInCategory => 0;

    public bool IsNumeric => true;

    public UnitType UnitType => UnitType.Dimensionless;

    public string Legend => "spectra per second, 1e9 / Mean[ns] per spectrum";

    public string GetValue(Summary summary, BenchmarkCase benchmarkCase) => GetValue(summary, benchmarkCase, SummaryStyle.Default);

    public string GetValue(Summary summary, BenchmarkCase benchmarkCase, SummaryStyle style)
    {
        var statistics = summary[benchmarkCase]?.ResultStatistics;
        return statistics is null ? "-" : (1e9 / statistics.Mean).ToString("N0", CultureInfo.InvariantCulture);
    }

    public bool IsAvailable(Summary summary) => true;

    public bool IsDefault(Summary summary, BenchmarkCase benchmarkCase) => false;
}
