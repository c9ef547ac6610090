using System.Globalization;
using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Reports;
using BenchmarkDotNet.Running;

namespace Sibyl.Bench.Serving;

/// <summary>
/// A percentile of the iteration times, in microseconds. With one invocation per iteration (the "single-call" job of
/// <see cref="LatencyConfig"/>) every iteration is one call, so this is the percentile of single round trips, which
/// BenchmarkDotNet's built-in columns stop short of (they end at P95); with many calls per iteration it is a
/// percentile of iteration means.
/// </summary>
public sealed class PercentileColumn(int percentile) : IColumn
{
    public string Id => $"{nameof(PercentileColumn)}.P{percentile}";

    public string ColumnName => $"P{percentile} [us]";

    public bool AlwaysShow => true;

    public ColumnCategory Category => ColumnCategory.Statistics;

    public int PriorityInCategory => 10;

    public bool IsNumeric => true;

    public UnitType UnitType => UnitType.Dimensionless;

    public string Legend => $"{percentile}th percentile of the iteration times per operation (of single calls with one call per iteration), microseconds";

    public string GetValue(Summary summary, BenchmarkCase benchmarkCase) => GetValue(summary, benchmarkCase, SummaryStyle.Default);

    public string GetValue(Summary summary, BenchmarkCase benchmarkCase, SummaryStyle style)
    {
        var statistics = summary[benchmarkCase]?.ResultStatistics;
        return statistics is null ? "-" : (statistics.Percentiles.Percentile(percentile) / 1000.0).ToString("F1", CultureInfo.InvariantCulture);
    }

    public bool IsAvailable(Summary summary) => true;

    public bool IsDefault(Summary summary, BenchmarkCase benchmarkCase) => false;
}
