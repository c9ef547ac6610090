namespace Sibyl.Perturbation.Loops;

/// <summary>
/// The plan's own nodes in u = ln q on which a spectrum is resampled at run time, with the piecewise-cubic
/// Lagrange interpolant that the precomputed weights integrate exactly (product integration).
/// </summary>
/// <remarks>
/// Spacing: at most <see cref="LogStep"/> in ln q everywhere, and at most <see cref="WiggleStep"/> in q for
/// q ≤ <see cref="WiggleEnd"/>, so that baryon-acoustic wiggles of period ≈ 0.06 h/Mpc get ≈ 8.6 nodes per
/// period (cubic interpolation error ≲ (3/128)(2π·0.007/0.06)⁴ ≈ 0.7 % of the wiggle amplitude, which the
/// integrals average down further: measured ≤ 4e-5 on all nine integrals for 5 % wiggles).
/// Beyond <see cref="WiggleEnd"/> the spacing grows by at most <see cref="GrowthLimit"/> per node (Silk damping
/// suppresses real wiggles there below 1e-3 of P). The spacings were chosen as the coarsest giving a ≥ 20×
/// margin on the 1e-3 accuracy target, since the P_22 cost grows as the inverse square of the spacing.
/// </remarks>
internal sealed class ProductGrid
{
    /// <summary>Largest ln q step; the interpolation bias (≈ 0.015 h⁴|∂⁴P/∂u⁴|) is ≲ 1.2e-4 of P for slopes |n| ≤ 3.</summary>
    public const double LogStep = 0.1;

    /// <summary>Largest step in q (h/Mpc) inside the wiggle band.</summary>
    public const double WiggleStep = 0.007;

    /// <summary>Upper end of the wiggle band, h/Mpc.</summary>
    public const double WiggleEnd = 0.7;

    /// <summary>Largest ratio of consecutive steps, to keep the non-uniform interpolation well conditioned.</summary>
    public const double GrowthLimit = 1.25;

    private readonly double[] _u;
    private readonly double[] _q;
    // Per cell: 1/Π(u_m − u_l) for the four stencil nodes, m = 0..3.
    private readonly double[] _denominators;

    public ProductGrid(double qMin, double qMax)
    {
        var steps = new List<double>();
        double lnMin = Math.Log(qMin);
        double lnMax = Math.Log(qMax);
        double u = lnMin;
        double previous = double.PositiveInfinity;
        while (u < lnMax)
        {
            double q = Math.Exp(u);
            double step = q <= WiggleEnd ? Math.Min(LogStep, WiggleStep / q) : LogStep;
            step = Math.Min(step, previous * GrowthLimit);
            steps.Add(step);
            previous = step;
            u += step;
        }

        // Stretch uniformly so the last node lands on ln qMax; at least three cells for a cubic stencil.
        while (steps.Count < 3)
        {
            steps.Add(steps[^1]);
        }

        double total = 0.0;
        foreach (double step in steps)
        {
            total += step;
        }

        double scale = (lnMax - lnMin) / total;
        _u = new double[steps.Count + 1];
        _q = new double[steps.Count + 1];
        _u[0] = lnMin;
        for (int i = 0; i < steps.Count; i++)
        {
            _u[i + 1] = _u[i] + (steps[i] * scale);
        }

        _u[^1] = lnMax;
        for (int i = 0; i < _u.Length; i++)
        {
            _q[i] = Math.Exp(_u[i]);
        }

        _q[0] = qMin;
        _q[^1] = qMax;
        _denominators = new double[CellCount * 4];
        for (int cell = 0; cell < CellCount; cell++)
        {
            int first = StencilStart(cell);
            for (int m = 0; m < 4; m++)
            {
                double product = 1.0;
                for (int l = 0; l < 4; l++)
                {
                    if (l != m)
                    {
                        product *= _u[first + m] - _u[first + l];
                    }
                }

                _denominators[(cell * 4) + m] = 1.0 / product;
            }
        }
    }

    /// <summary>Number of nodes.</summary>
    public int Count => _u.Length;

    /// <summary>Number of cells between nodes.</summary>
    public int CellCount => _u.Length - 1;

    /// <summary>Nodes in ln q.</summary>
    public ReadOnlySpan<double> LnQ => _u;

    /// <summary>Nodes in q, h/Mpc.</summary>
    public ReadOnlySpan<double> Q => _q;

    /// <summary>First of the four nodes whose cubic interpolates cell <paramref name="cell"/> (shifted inwards at the ends).</summary>
    public int StencilStart(int cell) => Math.Clamp(cell - 1, 0, Count - 4);

    /// <summary>The cell containing ln q = <paramref name="u"/> (clamped to the grid).</summary>
    public int CellOf(double u)
    {
        int index = Array.BinarySearch(_u, u);
        int cell = index >= 0 ? index : ~index - 1;
        return Math.Clamp(cell, 0, CellCount - 1);
    }

    /// <summary>The four Lagrange basis values at <paramref name="u"/> for the stencil of <paramref name="cell"/>.</summary>
    public void Basis(int cell, double u, Span<double> basis)
    {
        int first = StencilStart(cell);
        double d0 = u - _u[first], d1 = u - _u[first + 1], d2 = u - _u[first + 2], d3 = u - _u[first + 3];
        int offset = cell * 4;
        basis[0] = d1 * d2 * d3 * _denominators[offset];
        basis[1] = d0 * d2 * d3 * _denominators[offset + 1];
        basis[2] = d0 * d1 * d3 * _denominators[offset + 2];
        basis[3] = d0 * d1 * d2 * _denominators[offset + 3];
    }

    /// <summary>
    /// Samples <paramref name="spectrum"/> at the grid nodes (the input of every product-integration table), then
    /// zeros up to the destination's end (the P_22 bands' padding).
    /// </summary>
    public void Resample(LogSampledSpectrum spectrum, Span<double> destination)
    {
        ReadOnlySpan<double> lnQ = _u;
        for (int i = 0; i < lnQ.Length; i++)
        {
            destination[i] = spectrum.EvaluateInside(lnQ[i]);
        }

        destination[lnQ.Length..].Clear();
    }
}
