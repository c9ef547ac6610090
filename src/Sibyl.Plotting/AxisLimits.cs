namespace Sibyl.Plotting;

/// <summary>
/// Chooses an axis range, in plot coordinates, from the values that will be drawn on it.
/// The figure sets its limits itself rather than leaving them to ScottPlot so that the shared x range is the union
/// over all panels and so that log ticks can be laid out for the range actually shown.
/// </summary>
internal static class AxisLimits
{
    private const double MarginFraction = 0.04;

    public static (double Min, double Max) Around(IEnumerable<double> values, AxisScale scale)
    {
        double min = double.PositiveInfinity;
        double max = double.NegativeInfinity;
        foreach (double v in values)
        {
            min = Math.Min(min, v);
            max = Math.Max(max, v);
        }

        if (min > max)
        {
            // Nothing to show: a unit range (one decade on a log axis) still gives readable, honest empty axes.
            return (0, 1);
        }

        double span = max - min;
        if (span <= 0)
        {
            // A single value gets room on both sides: half a decade on a log axis, a tenth of its size on a linear one.
            double half = scale == AxisScale.Log10 ? 0.5 : (min == 0 ? 1 : Math.Abs(min) * 0.1);
            return (min - half, max + half);
        }

        return (min - (span * MarginFraction), max + (span * MarginFraction));
    }
}
