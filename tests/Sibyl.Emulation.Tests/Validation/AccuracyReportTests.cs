using MathNet.Numerics.Statistics;
using Sibyl.Emulation.Validation;

namespace Sibyl.Emulation.Tests.Validation;

public sealed class AccuracyReportTests
{
    [Fact]
    public void Percentiles_follow_Hyndman_and_Fan_definition_7_as_computed_by_MathNet()
    {
        // The report asks MathNet's R7 quantile of its own sorted column; the comparison here recomputes it from the
        // unsorted errors, so it checks the report feeds the right errors in sorted order (round-off: 1e-14 on errors
        // of order 0.01). The hand-computed case below is what pins the definition itself.
        var random = new Random(5);
        var comparisons = Enumerable.Range(0, 37).Select(p =>
        {
            double direct = 100.0 + p;
            double error = 0.02 * random.NextDouble();
            return new Comparison($"point {p}", [direct * (1 + error), -direct], [direct, -direct * (1 + error)]);
        }).ToList();
        var report = AccuracyReport.Measure("test", ["positive", "negative"], [0.1], comparisons);
        var relative = comparisons.Select(c => Math.Abs(c.Emulated[0] - c.Direct[0]) / c.Direct[0]).ToArray();
        Assert.True(report.IsRelative(0));
        Assert.Equal(Statistics.QuantileCustom(relative, 0.99, QuantileDefinition.R7), report.Curve(0, 99)[0], 14);
        Assert.Equal(Statistics.QuantileCustom(relative, 0.5, QuantileDefinition.R7), report.Curve(0, 50)[0], 14);
        Assert.Equal(relative.Max(), report.Curve(0, 100)[0], 14);

        // A negative term is measured against its RMS over the points instead (a relative error would blow up at a zero crossing).
        Assert.False(report.IsRelative(1));
        double rms = Math.Sqrt(comparisons.Average(c => c.Direct[1] * c.Direct[1]));
        var scaled = comparisons.Select(c => Math.Abs(c.Emulated[1] - c.Direct[1]) / rms).ToArray();
        Assert.Equal(Statistics.QuantileCustom(scaled, 0.9, QuantileDefinition.R7), report.Curve(1, 90)[0], 14);
        Assert.Contains("point", report.Contract.Worst[0], StringComparison.Ordinal);
    }

    [Fact]
    public void Percentiles_interpolate_linearly_between_order_statistics_by_hand()
    {
        // Relative errors 0.01 … 0.05 given out of order; definition 7 puts quantile p at 0-based position 4p of the
        // sorted errors: p50 at 2 → 0.03; p90 at 3.6 → 0.04 + 0.6 × 0.01 = 0.046; p99 at 3.96 → 0.04 + 0.96 × 0.01 = 0.0496.
        // Tolerance 1e-12: 1 + e − 1 rounds e by about 1e-16, far below it, while a different definition (R6 gives
        // p90 = 0.05, R5 gives 0.05) is off by more than 1e-3.
        double[] errors = [0.03, 0.05, 0.01, 0.04, 0.02];
        var comparisons = errors.Select((e, p) => new Comparison($"point {p}", [1.0 + e], [1.0])).ToList();
        var report = AccuracyReport.Measure("test", ["P"], [0.1], comparisons);
        Assert.Equal(0.03, report.Curve(0, 50)[0], 12);
        Assert.Equal(0.046, report.Curve(0, 90)[0], 12);
        Assert.Equal(0.0496, report.Curve(0, 99)[0], 12);
        Assert.Equal(0.05, report.Curve(0, 100)[0], 12);
    }

    [Fact]
    public void Headline_error_ignores_k_above_the_quoted_limit()
    {
        var comparisons = new[] { new Comparison("p", [1.001, 1.5], [1.0, 1.0]) };
        var report = AccuracyReport.Measure("test", ["P"], [0.2, 0.5], comparisons);
        Assert.Equal(0.001, report.Worst99(0), 12);
    }
}
