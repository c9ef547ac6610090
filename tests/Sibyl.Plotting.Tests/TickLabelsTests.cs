namespace Sibyl.Plotting.Tests;

public sealed class TickLabelsTests
{
    [Theory]
    [InlineData(1, -3, "0.001")]
    [InlineData(2, -1, "0.2")]
    [InlineData(1, 0, "1")]
    [InlineData(5, 4, "50000")]
    public void Decimal_powers_of_ten_are_written_exactly(int mantissa, int exponent, string expected)
    {
        Assert.Equal(expected, TickLabels.Power(mantissa, exponent, asDecimal: true));
    }

    [Theory]
    [InlineData(1.0, 0.01, "1.00")]
    [InlineData(0.1 + 0.2, 0.1, "0.3")]
    [InlineData(-5.5e-17, 0.25, "0.00")]
    [InlineData(12500, 2500, "12500")]
    [InlineData(3e-6, 1e-6, "3E-06")]
    public void Grid_labels_carry_the_decimals_of_the_step_and_a_decimal_point(double value, double step, string expected)
    {
        Assert.Equal(expected, TickLabels.Fixed(value, step));
    }

    [Fact]
    public void Every_major_label_of_a_linear_axis_has_the_same_number_of_decimals()
    {
        ScottPlot.Tick[] ticks = [ScottPlot.Tick.Major(0.99, "x"), ScottPlot.Tick.Major(1.0, "x"), ScottPlot.Tick.Minor(1.005), ScottPlot.Tick.Major(1.01, "x")];

        string[] labels = [.. LinearTicks.Relabel(ticks).Where(t => t.IsMajor).Select(t => t.Label)];

        Assert.Equal(["0.99", "1.00", "1.01"], labels);
    }
}
