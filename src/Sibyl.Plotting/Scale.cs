namespace Sibyl.Plotting;

/// <summary>Maps data values to the coordinates ScottPlot draws in, which are log10 values on a log axis.</summary>
internal static class Scale
{
    public static bool IsDrawable(double value, AxisScale scale) =>
        scale == AxisScale.Log10 ? double.IsFinite(value) && value > 0 : double.IsFinite(value);

    public static double ToPlot(double value, AxisScale scale) =>
        scale == AxisScale.Log10 ? Math.Log10(value) : value;
}
