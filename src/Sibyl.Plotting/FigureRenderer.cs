using ScottPlot;
using ScottPlot.TickGenerators;

namespace Sibyl.Plotting;

/// <summary>Turns a <see cref="SpectrumFigure"/> into PNG bytes through a ScottPlot multiplot, one subplot per panel.</summary>
internal static class FigureRenderer
{
    private const float CurveWidth = 2;
    private const float LoneMarkerSize = 5;

    /// <summary>Pixels each label needs along an axis; more ticks than this allows would make labels collide.</summary>
    private const int PixelsPerXLabel = 90;
    private const int PixelsPerYLabel = 50;

    private static readonly IPalette Palette = new ScottPlot.Palettes.Category10();

    public static byte[] RenderPng(SpectrumFigure figure, int width, int heightPerPanel)
    {
        string font = FontChoice.SansFamily;
        var curves = figure.Panels
            .Select(p => p.Series
                .Select(s => (s.Name, Runs: DrawableRuns.Split(s, figure.XScale, p.YScale)))
                .Where(c => c.Runs.Count > 0)
                .ToList())
            .ToList();
        (double xMin, double xMax) = AxisLimits.Around(
            curves.SelectMany(c => c).SelectMany(c => c.Runs).SelectMany(r => r.X), figure.XScale);

        var multiplot = new Multiplot { Layout = new ScottPlot.MultiplotLayouts.Rows() };
        multiplot.AddPlots(figure.Panels.Count);
        for (int i = 0; i < figure.Panels.Count; i++)
        {
            FigurePanel panel = figure.Panels[i];
            Plot plot = multiplot.GetPlot(i);
            plot.Font.Set(font);

            // Setting the family pins every label to its regular typeface; dropping the title's pin lets it be bold again,
            // which keeps panels easy to tell apart.
            plot.Axes.Title.Label.Font = null;
            plot.Axes.Title.Label.Bold = true;
            plot.Title(panel.Title);
            plot.YLabel(panel.YLabel);
            plot.XLabel(i == figure.Panels.Count - 1 ? figure.XLabel : string.Empty);

            for (int c = 0; c < curves[i].Count; c++)
            {
                AddCurve(plot, curves[i][c].Name, curves[i][c].Runs, Palette.GetColor(c));
            }

            var yValues = curves[i].SelectMany(c => c.Runs).SelectMany(r => r.Y);
            if (panel.ReferenceY is { } reference)
            {
                double y = Scale.ToPlot(reference, panel.YScale);
                plot.Add.HorizontalLine(y, 1.5f, Colors.Gray, LinePattern.Dashed);
                yValues = yValues.Append(y);
            }

            (double yMin, double yMax) = AxisLimits.Around(yValues, panel.YScale);
            plot.Axes.SetLimits(xMin, xMax, yMin, yMax);
            plot.Axes.Bottom.TickGenerator = Ticks(figure.XScale, xMin, xMax, width / PixelsPerXLabel);
            plot.Axes.Left.TickGenerator = Ticks(panel.YScale, yMin, yMax, heightPerPanel / PixelsPerYLabel);
            ShowMinorGrid(plot.Grid.XAxisStyle, figure.XScale);
            ShowMinorGrid(plot.Grid.YAxisStyle, panel.YScale);

            if (curves[i].Count > 0)
            {
                // Outside the data area a legend can never hide a curve, wherever the curves happen to run.
                plot.ShowLegend(Edge.Right).Alignment = Alignment.UpperCenter;
            }
        }

        AlignDataAreas(multiplot, width, heightPerPanel * figure.Panels.Count);
        using Image image = multiplot.Render(width, heightPerPanel * figure.Panels.Count);
        return image.GetImageBytes(ImageFormat.Png);
    }

    private static void AddCurve(Plot plot, string name, List<(double[] X, double[] Y)> runs, Color color)
    {
        for (int r = 0; r < runs.Count; r++)
        {
            var scatter = plot.Add.Scatter(runs[r].X, runs[r].Y, color);
            scatter.LineWidth = CurveWidth;

            // A point between two gaps has no segment to draw, so it needs a marker to be seen at all.
            scatter.MarkerSize = runs[r].X.Length == 1 ? LoneMarkerSize : 0;
            if (r == 0)
            {
                scatter.LegendText = name;
            }
        }
    }

    private static ITickGenerator Ticks(AxisScale scale, double min, double max, int maxMajorTicks)
    {
        if (scale == AxisScale.Log10)
        {
            return new NumericManual(LogTicks.Generate(min, max, maxMajorTicks));
        }

        return new LinearTicks(maxMajorTicks);
    }

    private static void ShowMinorGrid(GridStyle style, AxisScale scale)
    {
        // On a log axis the 2..9 lines are what let a reader place a value between decades.
        if (scale == AxisScale.Log10)
        {
            style.MinorLineStyle.Width = 1;
            style.MinorLineStyle.Color = Colors.Black.WithAlpha(0.05);
        }
    }

    /// <summary>
    /// Gives every panel the same left and right margins, so the shared x axis falls at the same pixels in each.
    /// ScottPlot sizes margins per subplot from its own tick labels and legend, so one render measures them all
    /// and the widest margins are then fixed for the render that is kept.
    /// </summary>
    private static void AlignDataAreas(Multiplot multiplot, int width, int height)
    {
        multiplot.Render(width, height).Dispose();

        Plot[] plots = multiplot.GetPlots();
        float left = plots.Max(p => p.LastRender.DataRect.Left - p.LastRender.FigureRect.Left);
        float right = plots.Max(p => p.LastRender.FigureRect.Right - p.LastRender.DataRect.Right);
        foreach (Plot plot in plots)
        {
            RenderDetails last = plot.LastRender;
            plot.Layout.Fixed(new PixelPadding(
                left,
                right,
                last.FigureRect.Bottom - last.DataRect.Bottom,
                last.DataRect.Top - last.FigureRect.Top));
        }
    }
}
