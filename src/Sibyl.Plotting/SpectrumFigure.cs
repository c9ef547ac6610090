using System.Globalization;

namespace Sibyl.Plotting;

/// <summary>
/// A figure of one or more panels stacked vertically over one shared x axis (typically the wavenumber k),
/// saved as a PNG. Every panel shows the same x range, so features line up from panel to panel.
/// </summary>
/// <example>
/// <code>
/// var figure = new SpectrumFigure("k [h/Mpc]", AxisScale.Log10);
/// figure.AddPanel("BAO wiggles", "P_total / P_nw", referenceY: 1)
///       .AddSeries("z = 0", k, ratio);
/// figure.AddPanel("One-loop terms", "|P(k)| [(Mpc/h)^3]", AxisScale.Log10)
///       .AddSeries("|P_22|", k, p22)
///       .AddSeries("|P_13|", k, p13);
/// figure.Save("spectra.png");
/// </code>
/// </example>
public sealed class SpectrumFigure
{
    /// <summary>Narrowest figure, in pixels, whose tick labels and legend still fit.</summary>
    public const int MinimumWidth = 300;

    /// <summary>Lowest panel, in pixels, whose title, ticks and axis label still fit.</summary>
    public const int MinimumPanelHeight = 200;

    /// <summary>Largest edge, in pixels, of the whole image; beyond it the figure is a mistake, not a plot.</summary>
    public const int MaximumEdge = 16_384;

    private readonly List<FigurePanel> panels = [];

    /// <summary>Starts a figure with no panels.</summary>
    /// <param name="xLabel">Label of the shared x axis, drawn under the bottom panel.</param>
    /// <param name="xScale">Scale of the shared x axis.</param>
    public SpectrumFigure(string xLabel, AxisScale xScale = AxisScale.Linear)
    {
        ArgumentNullException.ThrowIfNull(xLabel);
        XLabel = xLabel;
        XScale = xScale;
    }

    /// <summary>Label of the shared x axis.</summary>
    public string XLabel { get; }

    /// <summary>Scale of the shared x axis.</summary>
    public AxisScale XScale { get; }

    /// <summary>The panels, top to bottom.</summary>
    public IReadOnlyList<FigurePanel> Panels => panels;

    /// <summary>Adds a panel below the existing ones.</summary>
    /// <param name="title">Text drawn above the panel.</param>
    /// <param name="yLabel">Label of the panel's y axis.</param>
    /// <param name="yScale">Scale of the panel's y axis.</param>
    /// <param name="referenceY">
    /// Height of a dashed horizontal reference line (for example 1 under a ratio, 0 under a multipole), or null for none.
    /// </param>
    /// <returns>The new panel, to which curves are added.</returns>
    /// <exception cref="ArgumentOutOfRangeException">
    /// The reference height is not finite, or is not positive on a log y axis where it could never be drawn.
    /// </exception>
    public FigurePanel AddPanel(string title, string yLabel, AxisScale yScale = AxisScale.Linear, double? referenceY = null)
    {
        ArgumentNullException.ThrowIfNull(title);
        ArgumentNullException.ThrowIfNull(yLabel);
        if (referenceY is { } reference && !Scale.IsDrawable(reference, yScale))
        {
            throw new ArgumentOutOfRangeException(
                nameof(referenceY),
                reference,
                string.Create(CultureInfo.InvariantCulture, $"A reference line at y = {reference} cannot be drawn on a {yScale} axis."));
        }

        var panel = new FigurePanel(title, yLabel, yScale, referenceY);
        panels.Add(panel);
        return panel;
    }

    /// <summary>
    /// Renders the figure and writes it as a PNG. The image is written to a temporary file in the target's folder
    /// and then moved over the target, so an interrupted run leaves either the old file or the complete new one.
    /// </summary>
    /// <param name="path">Target file; its extension must be .png and its folder must exist.</param>
    /// <param name="width">Image width in pixels.</param>
    /// <param name="heightPerPanel">Height of each panel in pixels; the image is this times the panel count tall.</param>
    /// <exception cref="ArgumentException">The path is blank or does not end in .png.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A size is too small to read or too large to render.</exception>
    /// <exception cref="InvalidOperationException">
    /// The figure has no panels, or the machine has no font to draw text with.
    /// </exception>
    /// <exception cref="DirectoryNotFoundException">The target's folder does not exist.</exception>
    /// <exception cref="IOException">The file could not be written or moved into place.</exception>
    public void Save(string path, int width = 900, int heightPerPanel = 420)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        if (!string.Equals(Path.GetExtension(path), ".png", StringComparison.OrdinalIgnoreCase))
        {
            throw new ArgumentException($"A figure is saved as PNG, so '{path}' must end in .png.", nameof(path));
        }

        ArgumentOutOfRangeException.ThrowIfLessThan(width, MinimumWidth);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(width, MaximumEdge);
        ArgumentOutOfRangeException.ThrowIfLessThan(heightPerPanel, MinimumPanelHeight);
        if (panels.Count == 0)
        {
            throw new InvalidOperationException($"The figure meant for '{path}' has no panels; add one before saving.");
        }

        if ((long)heightPerPanel * panels.Count > MaximumEdge)
        {
            throw new ArgumentOutOfRangeException(
                nameof(heightPerPanel),
                heightPerPanel,
                $"{panels.Count} panels of {heightPerPanel} px exceed the {MaximumEdge} px image height limit.");
        }

        AtomicFile.RequireFolder(path);
        byte[] png = FigureRenderer.RenderPng(this, width, heightPerPanel);
        AtomicFile.WriteAllBytes(path, png);
    }
}
