namespace Sibyl.Perturbation.Loops;

/// <summary>
/// Precomputed product-integration weights of the three P_22 integrals on a <see cref="ProductGrid"/>:
/// J_S(k) = Σ_i P_i Σ_j W_S,ij(k) P_j, exact for the grid's cubic interpolant of P, stored as one
/// contiguous band of j per (k, i).
/// </summary>
/// <remarks>
/// With d³q = 2π q p dq dp / k and the symmetry q ↔ p (keep p ≥ q, double),
/// J_S = (1/(π²k)) ∫∫_{p ≥ q, |k−q| ≤ p ≤ k+q} q²p² S P(q) P(p) du dv in u = ln q, v = ln p.
/// The outer u integral runs cell by cell (split at q = k/2, where the lower p limit switches from k − q to q,
/// and at q = qMax − k); the inner v integral is split at every grid node so that each panel meets a single
/// cubic piece of P(p). Truncation: P = 0 outside the table, so p ≤ qMax.
/// </remarks>
internal sealed class P22BandTable
{
    private const int OuterNodes = 5;
    private const int InnerNodes = 5;

    private readonly int _kCount;
    // Per k: rows [_kRowStart[k], _kRowStart[k + 1]); per row: outer index i, band start j, band length, weight offset.
    private readonly int[] _kRowStart;
    private readonly int[] _rowOuter;
    private readonly int[] _rowBandStart;
    private readonly int[] _rowLength;
    private readonly int[] _rowOffset;
    // Weights of the three structures, each laid out with the rows' offsets.
    private readonly double[][] _weights;

    public P22BandTable(ProductGrid grid, ReadOnlySpan<double> k)
    {
        _kCount = k.Length;
        int g = grid.Count;
        var outerRule = GaussLegendreRule.Create(OuterNodes);
        var innerRule = GaussLegendreRule.Create(InnerNodes);
        var dense = new double[P22Weights.Count][];
        for (int s = 0; s < P22Weights.Count; s++)
        {
            dense[s] = new double[g * g];
        }

        var rowMin = new int[g];
        var rowMax = new int[g];
        var inner = new double[P22Weights.Count][];
        for (int s = 0; s < P22Weights.Count; s++)
        {
            inner[s] = new double[g];
        }

        var kRowStart = new List<int>();
        var rowOuter = new List<int>();
        var rowBandStart = new List<int>();
        var rowLength = new List<int>();
        var rowOffset = new List<int>();
        var weights = new List<double>[P22Weights.Count];
        for (int s = 0; s < P22Weights.Count; s++)
        {
            weights[s] = [];
        }

        var outerBreaks = new List<double>();
        Span<double> values = stackalloc double[P22Weights.Count];
        Span<double> basis = stackalloc double[4];
        Span<double> outerBasis = stackalloc double[4];
        double qMax = grid.Q[^1];
        double lnMin = grid.LnQ[0];
        double lnMax = grid.LnQ[^1];
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            double kk = k[kIndex];
            double normalisation = 1.0 / (Math.PI * Math.PI * kk);
            Array.Fill(rowMin, int.MaxValue);
            Array.Fill(rowMax, int.MinValue);
            outerBreaks.Clear();
            foreach (double u in grid.LnQ)
            {
                outerBreaks.Add(u);
            }

            outerBreaks.Add(Math.Log(0.5 * kk));
            if (qMax - kk > grid.Q[0])
            {
                outerBreaks.Add(Math.Log(qMax - kk));
            }

            outerBreaks.RemoveAll(u => u < lnMin || u > lnMax);
            outerBreaks.Sort();
            for (int b = 0; b + 1 < outerBreaks.Count; b++)
            {
                double ua = outerBreaks[b];
                double ub = outerBreaks[b + 1];
                if (ub <= ua)
                {
                    continue;
                }

                int outerCell = grid.CellOf(0.5 * (ua + ub));
                int outerFirst = grid.StencilStart(outerCell);
                double outerHalf = 0.5 * (ub - ua);
                for (int n = 0; n < outerRule.Count; n++)
                {
                    double u = ua + (outerHalf * (outerRule.Nodes[n] + 1.0));
                    double q = Math.Exp(u);
                    double pLow = q < 0.5 * kk ? kk - q : q;
                    double pHigh = Math.Min(kk + q, qMax);
                    if (pHigh <= pLow)
                    {
                        continue;
                    }

                    double va = Math.Log(pLow);
                    double vEnd = Math.Log(pHigh);
                    int cell = grid.CellOf(va);
                    int touchedMin = int.MaxValue;
                    int touchedMax = int.MinValue;
                    while (va < vEnd)
                    {
                        double vb = Math.Min(vEnd, grid.LnQ[cell + 1]);
                        if (vb > va)
                        {
                            int first = grid.StencilStart(cell);
                            touchedMin = Math.Min(touchedMin, first);
                            touchedMax = Math.Max(touchedMax, first + 3);
                            double innerHalf = 0.5 * (vb - va);
                            for (int m = 0; m < innerRule.Count; m++)
                            {
                                double v = va + (innerHalf * (innerRule.Nodes[m] + 1.0));
                                double p = Math.Exp(v);
                                P22Weights.Evaluate(kk, q, p, values);
                                grid.Basis(cell, v, basis);
                                double w = innerHalf * innerRule.Weights[m];
                                for (int s = 0; s < P22Weights.Count; s++)
                                {
                                    double value = w * values[s];
                                    double[] target = inner[s];
                                    for (int l = 0; l < 4; l++)
                                    {
                                        target[first + l] += value * basis[l];
                                    }
                                }
                            }
                        }

                        va = vb;
                        if (cell + 1 >= grid.CellCount)
                        {
                            break;
                        }

                        cell++;
                    }

                    if (touchedMin > touchedMax)
                    {
                        continue;
                    }

                    grid.Basis(outerCell, u, outerBasis);
                    double outerWeight = outerHalf * outerRule.Weights[n] * normalisation;
                    for (int l = 0; l < 4; l++)
                    {
                        int i = outerFirst + l;
                        double factor = outerWeight * outerBasis[l];
                        rowMin[i] = Math.Min(rowMin[i], touchedMin);
                        rowMax[i] = Math.Max(rowMax[i], touchedMax);
                        for (int s = 0; s < P22Weights.Count; s++)
                        {
                            double[] row = dense[s];
                            double[] source = inner[s];
                            int offset = i * g;
                            for (int j = touchedMin; j <= touchedMax; j++)
                            {
                                row[offset + j] += factor * source[j];
                            }
                        }
                    }

                    for (int s = 0; s < P22Weights.Count; s++)
                    {
                        Array.Clear(inner[s], touchedMin, touchedMax - touchedMin + 1);
                    }
                }
            }

            kRowStart.Add(rowOuter.Count);
            for (int i = 0; i < g; i++)
            {
                if (rowMin[i] > rowMax[i])
                {
                    continue;
                }

                int length = rowMax[i] - rowMin[i] + 1;
                rowOuter.Add(i);
                rowBandStart.Add(rowMin[i]);
                rowLength.Add(length);
                rowOffset.Add(weights[0].Count);
                for (int s = 0; s < P22Weights.Count; s++)
                {
                    Span<double> band = dense[s].AsSpan((i * g) + rowMin[i], length);
                    foreach (double w in band)
                    {
                        weights[s].Add(w);
                    }

                    band.Clear();
                }
            }
        }

        kRowStart.Add(rowOuter.Count);
        _kRowStart = [.. kRowStart];
        _rowOuter = [.. rowOuter];
        _rowBandStart = [.. rowBandStart];
        _rowLength = [.. rowLength];
        _rowOffset = [.. rowOffset];
        _weights = new double[P22Weights.Count][];
        for (int s = 0; s < P22Weights.Count; s++)
        {
            _weights[s] = [.. weights[s]];
        }
    }

    /// <summary>Number of stored (i, j) weight pairs per structure.</summary>
    public int PairCount => _weights[0].Length;

    /// <summary>J_S(k) for one spectrum on the grid; destination is structure-major (S·kCount + k).</summary>
    public void Accumulate(ReadOnlySpan<double> spectrum, Span<double> integrals)
    {
        ReadOnlySpan<double> w0 = _weights[0], w1 = _weights[1], w2 = _weights[2];
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            double j0 = 0.0, j1 = 0.0, j2 = 0.0;
            for (int r = _kRowStart[kIndex]; r < _kRowStart[kIndex + 1]; r++)
            {
                int offset = _rowOffset[r];
                int length = _rowLength[r];
                ReadOnlySpan<double> band = spectrum.Slice(_rowBandStart[r], length);
                double outer = spectrum[_rowOuter[r]];
                j0 += outer * VectorDot.Dot(w0.Slice(offset, length), band);
                j1 += outer * VectorDot.Dot(w1.Slice(offset, length), band);
                j2 += outer * VectorDot.Dot(w2.Slice(offset, length), band);
            }

            integrals[kIndex] = j0;
            integrals[_kCount + kIndex] = j1;
            integrals[(2 * _kCount) + kIndex] = j2;
        }
    }

    /// <summary>J_S(k) for two spectra sharing each pass over the weights.</summary>
    public void Accumulate(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> firstIntegrals, Span<double> secondIntegrals)
    {
        ReadOnlySpan<double> w0 = _weights[0], w1 = _weights[1], w2 = _weights[2];
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            double a0 = 0.0, a1 = 0.0, a2 = 0.0, b0 = 0.0, b1 = 0.0, b2 = 0.0;
            for (int r = _kRowStart[kIndex]; r < _kRowStart[kIndex + 1]; r++)
            {
                int offset = _rowOffset[r];
                int length = _rowLength[r];
                int start = _rowBandStart[r];
                ReadOnlySpan<double> bandA = first.Slice(start, length);
                ReadOnlySpan<double> bandB = second.Slice(start, length);
                double outerA = first[_rowOuter[r]];
                double outerB = second[_rowOuter[r]];
                (double x0, double y0) = VectorDot.Dot2(w0.Slice(offset, length), bandA, bandB);
                (double x1, double y1) = VectorDot.Dot2(w1.Slice(offset, length), bandA, bandB);
                (double x2, double y2) = VectorDot.Dot2(w2.Slice(offset, length), bandA, bandB);
                a0 += outerA * x0;
                a1 += outerA * x1;
                a2 += outerA * x2;
                b0 += outerB * y0;
                b1 += outerB * y1;
                b2 += outerB * y2;
            }

            firstIntegrals[kIndex] = a0;
            firstIntegrals[_kCount + kIndex] = a1;
            firstIntegrals[(2 * _kCount) + kIndex] = a2;
            secondIntegrals[kIndex] = b0;
            secondIntegrals[_kCount + kIndex] = b1;
            secondIntegrals[(2 * _kCount) + kIndex] = b2;
        }
    }
}
