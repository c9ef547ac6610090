using System.Globalization;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Sibyl.Plotting;

/// <summary>
/// ScottPlot's automatic linear ticks, relabelled in the invariant culture with one number of decimals for the
/// whole axis, so a ratio axis reads 0.99, 1.00, 1.01 rather than 0.99, 1, 1.01.
/// </summary>
internal sealed class LinearTicks : ITickGenerator
{
    private readonly NumericAutomatic automatic;

    /// <param name="targetTickCount">How many labels fit along the axis.</param>
    public LinearTicks(int targetTickCount)
    {
        automatic = new NumericAutomatic { TargetTickCount = targetTickCount };
    }

    public Tick[] Ticks { get; private set; } = [];

    public int MaxTickCount
    {
        get => automatic.MaxTickCount;
        set => automatic.MaxTickCount = value;
    }

    public void Regenerate(CoordinateRange range, Edge edge, PixelLength size, Paint paint, LabelStyle labelStyle)
    {
        automatic.Regenerate(range, edge, size, paint, labelStyle);
        Ticks = Relabel(automatic.Ticks);
    }

    /// <summary>Labels the major ticks from their common step; a lone major keeps a plain invariant label.</summary>
    public static Tick[] Relabel(Tick[] ticks)
    {
        double[] majors = [.. ticks.Where(t => t.IsMajor).Select(t => t.Position).Order()];
        double step = majors.Length < 2 ? double.NaN : majors.Zip(majors.Skip(1), (a, b) => b - a).Min();
        return Array.ConvertAll(ticks, t => !t.IsMajor ? t : Tick.Major(
            t.Position,
            double.IsNaN(step) ? t.Position.ToString("G6", CultureInfo.InvariantCulture) : TickLabels.Fixed(t.Position, step)));
    }
}
