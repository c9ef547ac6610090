using ScottPlot;
using Sibyl.Demo.Survey;

namespace Sibyl.Demo.Figures;

/// <summary>
/// Data with 1σ error bars against model curves, as k·P_ℓ(k) (which keeps the multipoles on one comparable scale),
/// one colour per multipole, with a lower panel of the residuals in units of σ.
/// </summary>
public static class MultipoleFigure
{
    private static readonly IPalette Palette = new ScottPlot.Palettes.Category10();

    /// <summary>Writes the PNG.</summary>
    /// <param name="path">Target .png file.</param>
    /// <param name="title">Title of the upper panel.</param>
    /// <param name="data">The data vector.</param>
    /// <param name="model">Model vector in the data's order.</param>
    /// <param name="modelName">Legend text of the model curves.</param>
    public static void Save(string path, string title, DataVector data, double[] model, string modelName)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(model);
        int nk = data.K.Length;
        var multiplot = new Multiplot();
        multiplot.AddPlots(2);
        var top = multiplot.GetPlot(0);
        var bottom = multiplot.GetPlot(1);
        foreach (var plot in new[] { top, bottom })
        {
            plot.Font.Set(FigureFont.Sans);
        }

        for (int s = 0; s < data.Ells.Length; s++)
        {
            var color = Palette.GetColor(s);
            double[] y = [.. Enumerable.Range(0, nk).Select(i => data.K[i] * data.Values[(s * nk) + i])];
            double[] error = [.. Enumerable.Range(0, nk).Select(i => data.K[i] * data.Sigma((s * nk) + i))];
            double[] curve = [.. Enumerable.Range(0, nk).Select(i => data.K[i] * model[(s * nk) + i])];
            double[] pull = [.. Enumerable.Range(0, nk).Select(i => (data.Values[(s * nk) + i] - model[(s * nk) + i]) / data.Sigma((s * nk) + i))];

            var bars = top.Add.ErrorBar(data.K, y, error);
            bars.Color = color;
            var points = top.Add.Markers(data.K, y, MarkerShape.FilledCircle, 6, color);
            points.LegendText = $"data P{data.Ells[s]}";
            var line = top.Add.Scatter(data.K, curve, color);
            line.MarkerSize = 0;
            line.LineWidth = 2;
            line.LegendText = $"{modelName} P{data.Ells[s]}";

            var residual = bottom.Add.Markers(data.K, pull, MarkerShape.FilledCircle, 6, color);
            residual.LegendText = $"P{data.Ells[s]}";
        }

        top.Title(title);
        top.YLabel("k P_ell(k) [(Mpc/h)^2]");
        top.ShowLegend(Edge.Right);
        bottom.Add.HorizontalLine(0, 1.5f, Colors.Gray, LinePattern.Dashed);
        bottom.Title("(data - model) / sigma");
        bottom.YLabel("residual [sigma]");
        bottom.XLabel("k [h/Mpc]");
        bottom.ShowLegend(Edge.Right);
        multiplot.SavePng(path, 1000, 900);
    }
}
