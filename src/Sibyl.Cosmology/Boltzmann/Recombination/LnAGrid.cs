namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>
/// A uniform grid in ln a with four-point (cubic Lagrange) interpolation and fourth-order cumulative
/// integration. At the thermal history's spacing of 1e-3 the interpolation error is of order h⁴ f'''' ≈ 1e-12
/// relative for the smooth tables and well under 1e-6 through recombination.
/// </summary>
internal sealed class LnAGrid
{
    /// <summary>Creates <paramref name="count"/> nodes from <paramref name="start"/> with spacing <paramref name="step"/>.</summary>
    public LnAGrid(double start, double step, int count)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 4);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(step);
        Start = start;
        Step = step;
        InverseStep = 1.0 / step;
        Count = count;
    }

    /// <summary>ln a of the first node.</summary>
    public double Start { get; }

    /// <summary>Spacing in ln a.</summary>
    public double Step { get; }

    /// <summary>1 / <see cref="Step"/>.</summary>
    public double InverseStep { get; }

    /// <summary>Number of nodes.</summary>
    public int Count { get; }

    /// <summary>ln a of the last node.</summary>
    public double End => Start + (Count - 1) * Step;

    /// <summary>ln a of node <paramref name="index"/>.</summary>
    public double LnA(int index) => Start + index * Step;

    /// <summary>
    /// Cubic interpolation of <paramref name="values"/> at <paramref name="lnA"/>, clamped to the grid's range.
    /// No allocation and no search: this sits in the right-hand side of the perturbation equations.
    /// </summary>
    public double Interpolate(double[] values, double lnA)
    {
        double position = (lnA - Start) * InverseStep;
        position = Math.Clamp(position, 0.0, Count - 1);

        // The stencil i−1 … i+2 stays inside the grid; at the two end intervals t runs over [−1, 0) or (1, 2]
        // and the same cubic is used slightly off-centre.
        int i = Math.Clamp((int)position, 1, Count - 3);
        double t = position - i;
        double tp = t + 1.0, tm = t - 1.0, tm2 = t - 2.0;
        return (-t * tm * tm2 * values[i - 1] + tp * t * tm * values[i + 2]) / 6.0
               + (tp * tm * tm2 * values[i] - tp * t * tm2 * values[i + 1]) * 0.5;
    }

    /// <summary>
    /// Fills <paramref name="integral"/> with ∫ from node 0 to node i of <paramref name="integrand"/> d ln a,
    /// plus <paramref name="initial"/>, using the four-point rule on every interval (one-sided at the ends).
    /// </summary>
    public void IntegrateFromStart(ReadOnlySpan<double> integrand, double initial, Span<double> integral)
    {
        integral[0] = initial;
        for (int i = 0; i < Count - 1; i++)
        {
            integral[i + 1] = integral[i] + Interval(integrand, i);
        }
    }

    /// <summary>Fills <paramref name="integral"/> with ∫ from node i to the last node of <paramref name="integrand"/> d ln a.</summary>
    public void IntegrateToEnd(ReadOnlySpan<double> integrand, Span<double> integral)
    {
        integral[Count - 1] = 0.0;
        for (int i = Count - 2; i >= 0; i--)
        {
            integral[i] = integral[i + 1] + Interval(integrand, i);
        }
    }

    /// <summary>Integral over [node i, node i+1] of the cubic through the four nearest nodes.</summary>
    private double Interval(ReadOnlySpan<double> f, int i)
    {
        double h24 = Step / 24.0;
        if (i == 0)
        {
            return h24 * (9.0 * f[0] + 19.0 * f[1] - 5.0 * f[2] + f[3]);
        }

        if (i == Count - 2)
        {
            return h24 * (f[i - 2] - 5.0 * f[i - 1] + 19.0 * f[i] + 9.0 * f[i + 1]);
        }

        return h24 * (-f[i - 1] + 13.0 * f[i] + 13.0 * f[i + 1] - f[i + 2]);
    }
}
