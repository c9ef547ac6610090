namespace Sibyl.Plotting;

/// <summary>
/// Cuts a curve into the stretches of consecutive points that can be placed on both axes, in plot coordinates.
/// Joining the stretches across a skipped point would draw a segment the data never had, such as the line
/// a sign change of P_13 leaves on a log axis.
/// </summary>
internal static class DrawableRuns
{
    public static List<(double[] X, double[] Y)> Split(LineSeries series, AxisScale xScale, AxisScale yScale)
    {
        var runs = new List<(double[] X, double[] Y)>();
        var xs = new List<double>();
        var ys = new List<double>();
        for (int i = 0; i < series.X.Length; i++)
        {
            double x = series.X[i];
            double y = series.Y[i];
            if (Scale.IsDrawable(x, xScale) && Scale.IsDrawable(y, yScale))
            {
                xs.Add(Scale.ToPlot(x, xScale));
                ys.Add(Scale.ToPlot(y, yScale));
            }
            else
            {
                Flush();
            }
        }

        Flush();
        return runs;

        void Flush()
        {
            if (xs.Count > 0)
            {
                runs.Add(([.. xs], [.. ys]));
                xs.Clear();
                ys.Clear();
            }
        }
    }
}
