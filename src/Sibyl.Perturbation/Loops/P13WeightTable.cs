namespace Sibyl.Perturbation.Loops;

/// <summary>
/// Precomputed product-integration weights of P_13-type integrals I_s(k) = (1/4π²)∫ dq q² K_s(q/k) P(q)
/// on a <see cref="ProductGrid"/>: I_s(k) = Σ_i W_s,i(k)·P(q_i), exact for the grid's cubic interpolant of P.
/// The angular kernels K_s are supplied by the caller (the six matter ones, or the redshift-space extras).
/// </summary>
/// <remarks>
/// W_s,i(k) = (1/4π²)∫ du q³ K_s(q/k) φ_i(u) over the table range (u = ln q), integrated once per plan by
/// Gauss–Legendre on every grid cell, with extra breakpoints graded geometrically towards q = k where K_s has
/// its (r − 1)ln|r − 1| kink: the innermost panel is 2.6e-7 wide in ln q, so the kink costs ≲ 1e-12.
/// </remarks>
internal sealed class P13WeightTable
{
    private const int NodesPerPanel = 6;
    private const double GradingStart = 0.4;
    private const double GradingRatio = 0.2;
    private const int GradingLevels = 9;

    private readonly double[] _weights;
    private readonly int _gridCount;
    private readonly int _kCount;
    private readonly int _kernelCount;

    /// <summary>Writes K_s(r) for every kernel of a set into <c>values</c>; r = q/k &gt; 0.</summary>
    public delegate void RadialKernels(double r, Span<double> values);

    public P13WeightTable(ProductGrid grid, ReadOnlySpan<double> k, int kernelCount, RadialKernels evaluate)
    {
        _gridCount = grid.Count;
        _kCount = k.Length;
        _kernelCount = kernelCount;
        _weights = new double[_kCount * kernelCount * _gridCount];
        var rule = GaussLegendreRule.Create(NodesPerPanel);
        var breakpoints = new List<double>();
        Span<double> kernels = stackalloc double[kernelCount];
        Span<double> basis = stackalloc double[4];
        double lnMin = grid.LnQ[0];
        double lnMax = grid.LnQ[^1];
        const double Normalisation = 1.0 / (4.0 * Math.PI * Math.PI);
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            double lnK = Math.Log(k[kIndex]);
            breakpoints.Clear();
            foreach (double u in grid.LnQ)
            {
                breakpoints.Add(u);
            }

            breakpoints.Add(lnK);
            double offset = GradingStart;
            for (int level = 0; level < GradingLevels; level++, offset *= GradingRatio)
            {
                breakpoints.Add(lnK - offset);
                breakpoints.Add(lnK + offset);
            }

            breakpoints.RemoveAll(u => u < lnMin || u > lnMax);
            breakpoints.Sort();
            Span<double> row = _weights.AsSpan(kIndex * _kernelCount * _gridCount, _kernelCount * _gridCount);
            for (int b = 0; b + 1 < breakpoints.Count; b++)
            {
                double a = breakpoints[b];
                double c = breakpoints[b + 1];
                if (c <= a)
                {
                    continue;
                }

                int cell = grid.CellOf(0.5 * (a + c));
                int first = grid.StencilStart(cell);
                double half = 0.5 * (c - a);
                for (int n = 0; n < rule.Count; n++)
                {
                    double u = a + (half * (rule.Nodes[n] + 1.0));
                    double q = Math.Exp(u);
                    evaluate(q / k[kIndex], kernels);
                    grid.Basis(cell, u, basis);
                    double measure = half * rule.Weights[n] * q * q * q * Normalisation;
                    for (int s = 0; s < _kernelCount; s++)
                    {
                        double value = measure * kernels[s];
                        int rowStart = (s * _gridCount) + first;
                        for (int m = 0; m < 4; m++)
                        {
                            row[rowStart + m] += value * basis[m];
                        }
                    }
                }
            }
        }
    }

    /// <summary>I_s(k) for one spectrum resampled on the grid; destination is structure-major (s·kCount + k).</summary>
    public void Accumulate(ReadOnlySpan<double> spectrum, Span<double> integrals)
    {
        ReadOnlySpan<double> weights = _weights;
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            for (int s = 0; s < _kernelCount; s++)
            {
                ReadOnlySpan<double> row = weights.Slice(((kIndex * _kernelCount) + s) * _gridCount, _gridCount);
                integrals[(s * _kCount) + kIndex] = VectorDot.Dot(row, spectrum);
            }
        }
    }

    /// <summary>I_s(k) for two spectra sharing each pass over the weights.</summary>
    public void Accumulate(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> firstIntegrals, Span<double> secondIntegrals)
    {
        ReadOnlySpan<double> weights = _weights;
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            for (int s = 0; s < _kernelCount; s++)
            {
                ReadOnlySpan<double> row = weights.Slice(((kIndex * _kernelCount) + s) * _gridCount, _gridCount);
                (double a, double b) = VectorDot.Dot2(row, first, second);
                firstIntegrals[(s * _kCount) + kIndex] = a;
                secondIntegrals[(s * _kCount) + kIndex] = b;
            }
        }
    }
}
