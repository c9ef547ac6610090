namespace Sibyl.Plotting;

/// <summary>
/// One panel of a <see cref="SpectrumFigure"/>: a title, a y axis of its own and the curves drawn on it.
/// Panels are created by <see cref="SpectrumFigure.AddPanel"/> so that they always share the figure's x axis.
/// </summary>
public sealed class FigurePanel
{
    private readonly List<LineSeries> series = [];

    internal FigurePanel(string title, string yLabel, AxisScale yScale, double? referenceY)
    {
        Title = title;
        YLabel = yLabel;
        YScale = yScale;
        ReferenceY = referenceY;
    }

    /// <summary>Text drawn above the panel.</summary>
    public string Title { get; }

    /// <summary>Label of the panel's y axis.</summary>
    public string YLabel { get; }

    /// <summary>Scale of the panel's y axis.</summary>
    public AxisScale YScale { get; }

    /// <summary>Height of the dashed horizontal reference line, or null when the panel has none.</summary>
    public double? ReferenceY { get; }

    internal IReadOnlyList<LineSeries> Series => series;

    /// <summary>
    /// Adds a named curve through the points (x[i], y[i]). Points that cannot be placed on a log axis
    /// (NaN, infinite, zero or negative) or that are not finite on a linear axis are skipped when drawing,
    /// which breaks the line there; a curve left with no drawable point is omitted from the panel and its legend.
    /// </summary>
    /// <param name="name">Legend text of the curve.</param>
    /// <param name="x">Abscissae; copied.</param>
    /// <param name="y">Ordinates, one for each abscissa; copied.</param>
    /// <returns>This panel, so that several curves can be added in one expression.</returns>
    /// <exception cref="ArgumentException">The name is blank or the two arrays differ in length.</exception>
    public FigurePanel AddSeries(string name, IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        if (x.Count != y.Count)
        {
            throw new ArgumentException(
                $"Series '{name}' has {x.Count} x values but {y.Count} y values.", nameof(y));
        }

        series.Add(new LineSeries(name, [.. x], [.. y]));
        return this;
    }
}
