using ScottPlot;

namespace Sibyl.Demo.Figures;

/// <summary>
/// A corner-style figure of posterior samples: the 1-D histogram of every parameter on the diagonal and the 2-D
/// scatter of every pair below it, with the injected values marked by lines.
/// </summary>
public static class CornerFigure
{
    private const int Bins = 30;
    private const int PanelPixels = 260;

    /// <summary>Most points drawn per scatter panel; more only hide each other and slow the render.</summary>
    private const int MaxScatter = 4000;

    /// <summary>Writes the PNG.</summary>
    /// <param name="path">Target .png file.</param>
    /// <param name="names">Parameter names.</param>
    /// <param name="samples">Posterior samples, each with one value per name.</param>
    /// <param name="injected">Injected (true) value of each parameter, NaN where there is none.</param>
    public static void Save(string path, IReadOnlyList<string> names, IReadOnlyList<double[]> samples, IReadOnlyList<double> injected)
    {
        ArgumentNullException.ThrowIfNull(names);
        ArgumentNullException.ThrowIfNull(samples);
        ArgumentNullException.ThrowIfNull(injected);
        int d = names.Count;
        int stride = Math.Max(1, samples.Count / MaxScatter);
        var thinned = samples.Where((_, i) => i % stride == 0).ToList();
        var multiplot = new Multiplot();
        multiplot.AddPlots(d * d);
        multiplot.Layout = new ScottPlot.MultiplotLayouts.Grid(d, d);
        var truthColor = Colors.Red;
        for (int row = 0; row < d; row++)
        {
            for (int column = 0; column < d; column++)
            {
                var plot = multiplot.GetPlot((row * d) + column);
                plot.Font.Set(FigureFont.Sans);
                if (column > row)
                {
                    plot.Layout.Frameless();
                    plot.HideGrid();
                    continue;
                }

                if (column == row)
                {
                    Histogram(plot, [.. samples.Select(s => s[row])]);
                    if (double.IsFinite(injected[row]))
                    {
                        plot.Add.VerticalLine(injected[row], 2, truthColor);
                    }

                    plot.Axes.Left.TickLabelStyle.IsVisible = false;
                }
                else
                {
                    plot.Add.Markers(thinned.Select(s => s[column]).ToArray(), thinned.Select(s => s[row]).ToArray(), MarkerShape.FilledCircle, 2, Colors.Navy.WithAlpha(0.3));
                    if (double.IsFinite(injected[column]))
                    {
                        plot.Add.VerticalLine(injected[column], 1.5f, truthColor);
                    }

                    if (double.IsFinite(injected[row]))
                    {
                        plot.Add.HorizontalLine(injected[row], 1.5f, truthColor);
                    }

                    plot.YLabel(column == 0 ? names[row] : string.Empty);
                }

                plot.XLabel(row == d - 1 ? names[column] : string.Empty);
            }
        }

        multiplot.SavePng(path, PanelPixels * d, PanelPixels * d);
    }

    /// <summary>A step outline of a normalised histogram (drawn as a line, which needs nothing beyond scatter plots).</summary>
    private static void Histogram(Plot plot, double[] values)
    {
        double min = values.Min(), max = values.Max();
        double width = (max - min) / Bins;
        if (!(width > 0.0))
        {
            return;
        }

        var counts = new double[Bins];
        foreach (double v in values)
        {
            counts[Math.Min(Bins - 1, (int)((v - min) / width))]++;
        }

        var xs = new List<double>();
        var ys = new List<double>();
        for (int b = 0; b < Bins; b++)
        {
            double density = counts[b] / (values.Length * width);
            xs.Add(min + (b * width));
            ys.Add(density);
            xs.Add(min + ((b + 1) * width));
            ys.Add(density);
        }

        var line = plot.Add.Scatter(xs.ToArray(), ys.ToArray(), Colors.Navy);
        line.MarkerSize = 0;
        line.LineWidth = 2;
    }
}
