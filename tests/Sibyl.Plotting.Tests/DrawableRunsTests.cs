namespace Sibyl.Plotting.Tests;

public sealed class DrawableRunsTests
{
    [Fact]
    public void A_point_that_a_log_axis_cannot_show_breaks_the_line_in_two()
    {
        var series = new LineSeries("s", [1, 10, 100, 1000], [1, -1, 10, 100]);

        var runs = DrawableRuns.Split(series, AxisScale.Log10, AxisScale.Log10);

        Assert.Equal(2, runs.Count);
        Assert.Equal([0.0], runs[0].X);
        Assert.Equal([2.0, 3.0], runs[1].X);
        Assert.Equal([1.0, 2.0], runs[1].Y);
    }

    [Fact]
    public void A_series_with_no_drawable_point_has_no_runs()
    {
        var series = new LineSeries("s", [1, 2], [0, double.NaN]);

        Assert.Empty(DrawableRuns.Split(series, AxisScale.Linear, AxisScale.Log10));
    }

    [Fact]
    public void Negative_values_are_kept_on_a_linear_axis()
    {
        var series = new LineSeries("s", [1, 2, 3], [-2, 0, 2]);

        var runs = DrawableRuns.Split(series, AxisScale.Linear, AxisScale.Linear);

        Assert.Equal([-2.0, 0.0, 2.0], Assert.Single(runs).Y);
    }
}
