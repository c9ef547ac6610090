using System.Numerics;
using System.Runtime.InteropServices;
using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// Precomputed product-integration weights of any number of P_22-type integrals on a <see cref="ProductGrid"/>:
/// J_s(k) = Σ_i P_i Σ_j W_s,ij(k) P_j, exact for the grid's cubic interpolant of P, for the structure functions
/// of an <see cref="IPairStructureFunctions"/>. The real-space <c>P22BandTable</c> is the special case of the
/// three functions α_s², α_sγ, γ² with an unpadded, structure-major layout.
/// </summary>
/// <remarks>
/// <para>
/// Geometry as in <c>P22BandTable</c>: with d³q = 2π q p dq dp / k and the symmetry q ↔ p (keep p ≥ q, double),
/// J_s = (1/(π²k)) ∫∫_{p ≥ q, |k−q| ≤ p ≤ k+q} q²p² S_s P(q) P(p) du dv in u = ln q, v = ln p. The outer u integral
/// runs cell by cell, split at q = k/2 (where the lower p limit switches from k − q to q) and at q = qMax − k;
/// the inner v integral is split at every grid node so that each panel meets a single cubic piece of P(p).
/// P = 0 outside the table, so p ≤ qMax.
/// </para>
/// <para>
/// Layout: for every (k, outer node i) one row holding a contiguous band of j, stored j-major with the functions
/// innermost and padded to a multiple of <see cref="Vector{T}.Count"/>, so that an evaluation streams each weight
/// once and accumulates all functions in SIMD registers at the same time.
/// </para>
/// </remarks>
internal sealed class BandedProductTable
{
    // Five-point Gauss–Legendre on each panel: the panels are single cubic pieces of P times a smooth rational S
    // and q²p², as in P22BandTable, whose accuracy the real-space tests established.
    private const int OuterNodes = 5;
    private const int InnerNodes = 5;

    private readonly int _kCount;
    private readonly int _functionCount;
    private readonly int _stride;
    // Per k: rows [_kRowStart[k], _kRowStart[k + 1]); per row: outer i, band start j, band length, offset in _weights[k].
    private readonly int[] _kRowStart;
    private readonly int[] _rowOuter;
    private readonly int[] _rowBandStart;
    private readonly int[] _rowLength;
    private readonly int[] _rowOffset;
    private readonly double[][] _weights;

    public BandedProductTable(ProductGrid grid, ReadOnlySpan<double> k, IPairStructureFunctions functions)
    {
        ArgumentNullException.ThrowIfNull(functions);
        _kCount = k.Length;
        _functionCount = functions.Count;
        int lanes = Vector<double>.Count;
        _stride = (_functionCount + lanes - 1) / lanes * lanes;
        int g = grid.Count;
        int stride = _stride;
        var outerRule = GaussLegendreRule.Create(OuterNodes);
        var innerRule = GaussLegendreRule.Create(InnerNodes);

        // Scratch: the dense (i, j, s) weights of one k and the inner (j, s) integrals of one outer node.
        var dense = new double[g * g * stride];
        var inner = new double[g * stride];
        var rowMin = new int[g];
        var rowMax = new int[g];
        var values = new double[stride];
        Span<double> basis = stackalloc double[4];
        Span<double> outerBasis = stackalloc double[4];

        var kRowStart = new List<int>();
        var rowOuter = new List<int>();
        var rowBandStart = new List<int>();
        var rowLength = new List<int>();
        var rowOffset = new List<int>();
        _weights = new double[_kCount][];
        var outerBreaks = new List<double>();
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

                    (int touchedMin, int touchedMax) = IntegrateInner(grid, innerRule, functions, kk, q, pLow, pHigh, values, basis, inner);
                    if (touchedMin > touchedMax)
                    {
                        continue;
                    }

                    grid.Basis(outerCell, u, outerBasis);
                    double outerWeight = outerHalf * outerRule.Weights[n] * normalisation;
                    int bandStart = touchedMin * stride;
                    int bandLength = (touchedMax - touchedMin + 1) * stride;
                    ReadOnlySpan<double> source = inner.AsSpan(bandStart, bandLength);
                    for (int l = 0; l < 4; l++)
                    {
                        int i = outerFirst + l;
                        rowMin[i] = Math.Min(rowMin[i], touchedMin);
                        rowMax[i] = Math.Max(rowMax[i], touchedMax);
                        AddScaled(source, outerWeight * outerBasis[l], dense.AsSpan((i * g * stride) + bandStart, bandLength));
                    }

                    inner.AsSpan(bandStart, bandLength).Clear();
                }
            }

            kRowStart.Add(rowOuter.Count);
            int total = 0;
            for (int i = 0; i < g; i++)
            {
                if (rowMin[i] <= rowMax[i])
                {
                    total += (rowMax[i] - rowMin[i] + 1) * stride;
                }
            }

            var weights = new double[total];
            int offset = 0;
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
                rowOffset.Add(offset);
                Span<double> band = dense.AsSpan(((i * g) + rowMin[i]) * stride, length * stride);
                band.CopyTo(weights.AsSpan(offset));
                band.Clear();
                offset += length * stride;
            }

            _weights[kIndex] = weights;
        }

        kRowStart.Add(rowOuter.Count);
        _kRowStart = [.. kRowStart];
        _rowOuter = [.. rowOuter];
        _rowBandStart = [.. rowBandStart];
        _rowLength = [.. rowLength];
        _rowOffset = [.. rowOffset];
    }

    /// <summary>Number of structure functions.</summary>
    public int FunctionCount => _functionCount;

    /// <summary>Number of stored (k, i, j) weight pairs, each holding one weight per function (padded).</summary>
    public long PairCount
    {
        get
        {
            long total = 0;
            foreach (double[] weights in _weights)
            {
                total += weights.Length / _stride;
            }

            return total;
        }
    }

    /// <summary>Bytes held by the weights and the row index.</summary>
    public long Bytes => (PairCount * _stride * sizeof(double)) + ((long)(_kRowStart.Length + (4 * _rowOuter.Length)) * sizeof(int));

    /// <summary>J_s(k) for one spectrum on the grid; destination is function-major (s·kCount + k).</summary>
    public void Accumulate(ReadOnlySpan<double> spectrum, Span<double> integrals)
    {
        int vectors = _stride / Vector<double>.Count;
        Span<Vector<double>> sums = stackalloc Vector<double>[vectors];
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            sums.Clear();
            ReadOnlySpan<Vector<double>> weights = MemoryMarshal.Cast<double, Vector<double>>(_weights[kIndex]);
            for (int r = _kRowStart[kIndex]; r < _kRowStart[kIndex + 1]; r++)
            {
                double outer = spectrum[_rowOuter[r]];
                ReadOnlySpan<double> band = spectrum.Slice(_rowBandStart[r], _rowLength[r]);
                int w = _rowOffset[r] / Vector<double>.Count;
                foreach (double value in band)
                {
                    var product = new Vector<double>(outer * value);
                    for (int v = 0; v < vectors; v++)
                    {
                        sums[v] += weights[w + v] * product;
                    }

                    w += vectors;
                }
            }

            Scatter(sums, kIndex, integrals);
        }
    }

    /// <summary>J_s(k) for two spectra sharing each pass over the weights.</summary>
    public void Accumulate(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> firstIntegrals, Span<double> secondIntegrals)
    {
        int vectors = _stride / Vector<double>.Count;
        Span<Vector<double>> sumsFirst = stackalloc Vector<double>[vectors];
        Span<Vector<double>> sumsSecond = stackalloc Vector<double>[vectors];
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            sumsFirst.Clear();
            sumsSecond.Clear();
            ReadOnlySpan<Vector<double>> weights = MemoryMarshal.Cast<double, Vector<double>>(_weights[kIndex]);
            for (int r = _kRowStart[kIndex]; r < _kRowStart[kIndex + 1]; r++)
            {
                int start = _rowBandStart[r];
                int length = _rowLength[r];
                double outerFirst = first[_rowOuter[r]];
                double outerSecond = second[_rowOuter[r]];
                ReadOnlySpan<double> bandFirst = first.Slice(start, length);
                ReadOnlySpan<double> bandSecond = second.Slice(start, length);
                int w = _rowOffset[r] / Vector<double>.Count;
                for (int j = 0; j < length; j++)
                {
                    var productFirst = new Vector<double>(outerFirst * bandFirst[j]);
                    var productSecond = new Vector<double>(outerSecond * bandSecond[j]);
                    for (int v = 0; v < vectors; v++)
                    {
                        Vector<double> weight = weights[w + v];
                        sumsFirst[v] += weight * productFirst;
                        sumsSecond[v] += weight * productSecond;
                    }

                    w += vectors;
                }
            }

            Scatter(sumsFirst, kIndex, firstIntegrals);
            Scatter(sumsSecond, kIndex, secondIntegrals);
        }
    }

    /// <summary>
    /// The inner v integrals of q²p²S_s against each basis function of P(p), accumulated into
    /// inner[j·stride + s]; returns the range of j touched (empty when min &gt; max).
    /// </summary>
    private (int Min, int Max) IntegrateInner(
        ProductGrid grid,
        GaussLegendreRule rule,
        IPairStructureFunctions functions,
        double k,
        double q,
        double pLow,
        double pHigh,
        double[] values,
        Span<double> basis,
        double[] inner)
    {
        int stride = _stride;
        Span<double> functionValues = values.AsSpan(0, _functionCount);
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
                double half = 0.5 * (vb - va);
                for (int m = 0; m < rule.Count; m++)
                {
                    double v = va + (half * (rule.Nodes[m] + 1.0));
                    double p = Math.Exp(v);
                    functions.Evaluate(k, q, p, functionValues);
                    grid.Basis(cell, v, basis);
                    double measure = half * rule.Weights[m] * q * q * p * p;
                    for (int l = 0; l < 4; l++)
                    {
                        AddScaled(values, measure * basis[l], inner.AsSpan((first + l) * stride, stride));
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

        return (touchedMin, touchedMax);
    }

    private void Scatter(ReadOnlySpan<Vector<double>> sums, int kIndex, Span<double> integrals)
    {
        ReadOnlySpan<double> flat = MemoryMarshal.Cast<Vector<double>, double>(sums);
        for (int s = 0; s < _functionCount; s++)
        {
            integrals[(s * _kCount) + kIndex] = flat[s];
        }
    }

    /// <summary>target += factor·source over equal lengths that are multiples of the SIMD width.</summary>
    private static void AddScaled(ReadOnlySpan<double> source, double factor, Span<double> target)
    {
        ReadOnlySpan<Vector<double>> from = MemoryMarshal.Cast<double, Vector<double>>(source);
        Span<Vector<double>> to = MemoryMarshal.Cast<double, Vector<double>>(target);
        var scale = new Vector<double>(factor);
        for (int v = 0; v < from.Length; v++)
        {
            to[v] += from[v] * scale;
        }
    }
}
