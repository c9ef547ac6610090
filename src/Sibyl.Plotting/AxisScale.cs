namespace Sibyl.Plotting;

/// <summary>How values map onto a figure axis.</summary>
public enum AxisScale
{
    /// <summary>Values are placed in proportion to their size.</summary>
    Linear,

    /// <summary>
    /// Values are placed by their base-10 logarithm and ticks are labelled with the values themselves;
    /// values that are not finite and positive cannot be placed and are left out.
    /// </summary>
    Log10,
}
