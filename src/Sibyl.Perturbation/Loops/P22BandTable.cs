using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

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
        var builder = new Builder(grid);
        var kRowStart = new List<int>(_kCount + 1);
        foreach (double wavenumber in k)
        {
            kRowStart.Add(builder.RowCount);
            builder.AddWavenumber(wavenumber);
        }

        kRowStart.Add(builder.RowCount);
        _kRowStart = [.. kRowStart];
        _rowOuter = [.. builder.RowOuter];
        _rowBandStart = [.. builder.RowBandStart];
        _rowLength = [.. builder.RowLength];
        _rowOffset = [.. builder.RowOffset];
        _weights = new double[P22Weights.Count][];
        for (int s = 0; s < P22Weights.Count; s++)
        {
            _weights[s] = [.. builder.Weights[s]];
        }
    }

    /// <summary>Number of stored (i, j) weight pairs per structure, zero padding included.</summary>
    public int PairCount => _weights[0].Length;

    /// <summary>
    /// How many entries past the grid's last node a resampled spectrum must provide (as zeros): bands are padded
    /// with zero weights to whole SIMD vectors so the core needs no scalar tails.
    /// </summary>
    public static int Padding => Vector<double>.Count;

    /// <summary>J_S(k) for one spectrum resampled on the grid plus <see cref="Padding"/> zeros; destination is structure-major (S·kCount + k).</summary>
    public void Accumulate(ReadOnlySpan<double> spectrum, Span<double> integrals)
    {
        ref double p = ref MemoryMarshal.GetReference(spectrum);
        ref double w0 = ref MemoryMarshal.GetArrayDataReference(_weights[0]);
        ref double w1 = ref MemoryMarshal.GetArrayDataReference(_weights[1]);
        ref double w2 = ref MemoryMarshal.GetArrayDataReference(_weights[2]);
        int lanes = Vector<double>.Count;
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            Vector<double> a0 = Vector<double>.Zero, a1 = Vector<double>.Zero, a2 = Vector<double>.Zero;
            for (int r = _kRowStart[kIndex]; r < _kRowStart[kIndex + 1]; r++)
            {
                var outer = new Vector<double>(Unsafe.Add(ref p, _rowOuter[r]));
                nuint offset = (nuint)_rowOffset[r];
                nuint start = (nuint)_rowBandStart[r];
                for (int j = 0; j < _rowLength[r]; j += lanes)
                {
                    Vector<double> product = outer * Vector.LoadUnsafe(ref p, start + (nuint)j);
                    nuint at = offset + (nuint)j;
                    a0 += Vector.LoadUnsafe(ref w0, at) * product;
                    a1 += Vector.LoadUnsafe(ref w1, at) * product;
                    a2 += Vector.LoadUnsafe(ref w2, at) * product;
                }
            }

            integrals[kIndex] = Vector.Sum(a0);
            integrals[_kCount + kIndex] = Vector.Sum(a1);
            integrals[(2 * _kCount) + kIndex] = Vector.Sum(a2);
        }
    }

    /// <summary>J_S(k) for two spectra (each with <see cref="Padding"/> trailing zeros) sharing each pass over the weights.</summary>
    public void Accumulate(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> firstIntegrals, Span<double> secondIntegrals)
    {
        ref double p = ref MemoryMarshal.GetReference(first);
        ref double q = ref MemoryMarshal.GetReference(second);
        ref double w0 = ref MemoryMarshal.GetArrayDataReference(_weights[0]);
        ref double w1 = ref MemoryMarshal.GetArrayDataReference(_weights[1]);
        ref double w2 = ref MemoryMarshal.GetArrayDataReference(_weights[2]);
        int lanes = Vector<double>.Count;
        for (int kIndex = 0; kIndex < _kCount; kIndex++)
        {
            Vector<double> a0 = Vector<double>.Zero, a1 = Vector<double>.Zero, a2 = Vector<double>.Zero;
            Vector<double> b0 = Vector<double>.Zero, b1 = Vector<double>.Zero, b2 = Vector<double>.Zero;
            for (int r = _kRowStart[kIndex]; r < _kRowStart[kIndex + 1]; r++)
            {
                int i = _rowOuter[r];
                var outerFirst = new Vector<double>(Unsafe.Add(ref p, i));
                var outerSecond = new Vector<double>(Unsafe.Add(ref q, i));
                nuint offset = (nuint)_rowOffset[r];
                nuint start = (nuint)_rowBandStart[r];
                for (int j = 0; j < _rowLength[r]; j += lanes)
                {
                    Vector<double> productFirst = outerFirst * Vector.LoadUnsafe(ref p, start + (nuint)j);
                    Vector<double> productSecond = outerSecond * Vector.LoadUnsafe(ref q, start + (nuint)j);
                    nuint at = offset + (nuint)j;
                    Vector<double> v0 = Vector.LoadUnsafe(ref w0, at);
                    Vector<double> v1 = Vector.LoadUnsafe(ref w1, at);
                    Vector<double> v2 = Vector.LoadUnsafe(ref w2, at);
                    a0 += v0 * productFirst;
                    a1 += v1 * productFirst;
                    a2 += v2 * productFirst;
                    b0 += v0 * productSecond;
                    b1 += v1 * productSecond;
                    b2 += v2 * productSecond;
                }
            }

            firstIntegrals[kIndex] = Vector.Sum(a0);
            firstIntegrals[_kCount + kIndex] = Vector.Sum(a1);
            firstIntegrals[(2 * _kCount) + kIndex] = Vector.Sum(a2);
            secondIntegrals[kIndex] = Vector.Sum(b0);
            secondIntegrals[_kCount + kIndex] = Vector.Sum(b1);
            secondIntegrals[(2 * _kCount) + kIndex] = Vector.Sum(b2);
        }
    }

    /// <summary>Integrates the weights of one k at a time into a dense scratch matrix, then keeps only its bands.</summary>
    private sealed class Builder
    {
        private readonly ProductGrid _grid;
        private readonly GaussLegendreRule _outerRule = GaussLegendreRule.Create(OuterNodes);
        private readonly GaussLegendreRule _innerRule = GaussLegendreRule.Create(InnerNodes);
        // Dense G×G weights of the current k, per structure, and the touched j range of each row i.
        private readonly double[][] _dense;
        private readonly int[] _rowMin;
        private readonly int[] _rowMax;
        // Inner (v) integrals against each basis function j, for the current outer node.
        private readonly double[][] _inner;
        private readonly List<double> _outerBreaks = [];

        public Builder(ProductGrid grid)
        {
            _grid = grid;
            int g = grid.Count;
            _dense = new double[P22Weights.Count][];
            _inner = new double[P22Weights.Count][];
            Weights = new List<double>[P22Weights.Count];
            for (int s = 0; s < P22Weights.Count; s++)
            {
                _dense[s] = new double[g * g];
                _inner[s] = new double[g];
                Weights[s] = [];
            }

            _rowMin = new int[g];
            _rowMax = new int[g];
        }

        public List<int> RowOuter { get; } = [];

        public List<int> RowBandStart { get; } = [];

        public List<int> RowLength { get; } = [];

        public List<int> RowOffset { get; } = [];

        public List<double>[] Weights { get; }

        public int RowCount => RowOuter.Count;

        public void AddWavenumber(double k)
        {
            Array.Fill(_rowMin, int.MaxValue);
            Array.Fill(_rowMax, int.MinValue);
            double normalisation = 1.0 / (Math.PI * Math.PI * k);
            Span<double> outerBasis = stackalloc double[4];
            foreach ((double ua, double ub) in OuterPanels(k))
            {
                int outerCell = _grid.CellOf(0.5 * (ua + ub));
                int outerFirst = _grid.StencilStart(outerCell);
                double outerHalf = 0.5 * (ub - ua);
                for (int n = 0; n < _outerRule.Count; n++)
                {
                    double u = ua + (outerHalf * (_outerRule.Nodes[n] + 1.0));
                    (int touchedMin, int touchedMax) = IntegrateInner(k, Math.Exp(u));
                    if (touchedMin > touchedMax)
                    {
                        continue;
                    }

                    _grid.Basis(outerCell, u, outerBasis);
                    double outerWeight = outerHalf * _outerRule.Weights[n] * normalisation;
                    for (int l = 0; l < 4; l++)
                    {
                        AddToRow(outerFirst + l, outerWeight * outerBasis[l], touchedMin, touchedMax);
                    }

                    for (int s = 0; s < P22Weights.Count; s++)
                    {
                        Array.Clear(_inner[s], touchedMin, touchedMax - touchedMin + 1);
                    }
                }
            }

            KeepBands();
        }

        /// <summary>Outer panels in u: the grid cells, split at q = k/2 and q = qMax − k.</summary>
        private List<(double Start, double End)> OuterPanels(double k)
        {
            double lnMin = _grid.LnQ[0];
            double lnMax = _grid.LnQ[^1];
            _outerBreaks.Clear();
            foreach (double u in _grid.LnQ)
            {
                _outerBreaks.Add(u);
            }

            _outerBreaks.Add(Math.Log(0.5 * k));
            if (_grid.Q[^1] - k > _grid.Q[0])
            {
                _outerBreaks.Add(Math.Log(_grid.Q[^1] - k));
            }

            _outerBreaks.RemoveAll(u => u < lnMin || u > lnMax);
            _outerBreaks.Sort();
            var panels = new List<(double, double)>(_outerBreaks.Count);
            for (int b = 0; b + 1 < _outerBreaks.Count; b++)
            {
                if (_outerBreaks[b + 1] > _outerBreaks[b])
                {
                    panels.Add((_outerBreaks[b], _outerBreaks[b + 1]));
                }
            }

            return panels;
        }

        /// <summary>
        /// Fills the inner integrals ∫dv q²p²S φ_j(v) over max(q, |k − q|) ≤ p ≤ min(k + q, qMax), one panel per
        /// grid cell met; returns the range of j touched (empty when the p interval is).
        /// </summary>
        private (int Min, int Max) IntegrateInner(double k, double q)
        {
            double pLow = q < 0.5 * k ? k - q : q;
            double pHigh = Math.Min(k + q, _grid.Q[^1]);
            int touchedMin = int.MaxValue;
            int touchedMax = int.MinValue;
            if (pHigh <= pLow)
            {
                return (touchedMin, touchedMax);
            }

            Span<double> values = stackalloc double[P22Weights.Count];
            Span<double> basis = stackalloc double[4];
            double va = Math.Log(pLow);
            double vEnd = Math.Log(pHigh);
            for (int cell = _grid.CellOf(va); va < vEnd && cell < _grid.CellCount; cell++)
            {
                double vb = Math.Min(vEnd, _grid.LnQ[cell + 1]);
                if (vb > va)
                {
                    int first = _grid.StencilStart(cell);
                    touchedMin = Math.Min(touchedMin, first);
                    touchedMax = Math.Max(touchedMax, first + 3);
                    double half = 0.5 * (vb - va);
                    for (int m = 0; m < _innerRule.Count; m++)
                    {
                        double v = va + (half * (_innerRule.Nodes[m] + 1.0));
                        P22Weights.Evaluate(k, q, Math.Exp(v), values);
                        _grid.Basis(cell, v, basis);
                        double weight = half * _innerRule.Weights[m];
                        for (int s = 0; s < P22Weights.Count; s++)
                        {
                            double value = weight * values[s];
                            double[] target = _inner[s];
                            for (int l = 0; l < 4; l++)
                            {
                                target[first + l] += value * basis[l];
                            }
                        }
                    }
                }

                va = vb;
            }

            return (touchedMin, touchedMax);
        }

        private void AddToRow(int i, double factor, int touchedMin, int touchedMax)
        {
            int offset = i * _grid.Count;
            _rowMin[i] = Math.Min(_rowMin[i], touchedMin);
            _rowMax[i] = Math.Max(_rowMax[i], touchedMax);
            for (int s = 0; s < P22Weights.Count; s++)
            {
                double[] row = _dense[s];
                double[] source = _inner[s];
                for (int j = touchedMin; j <= touchedMax; j++)
                {
                    row[offset + j] += factor * source[j];
                }
            }
        }

        /// <summary>Moves every touched row's band to the packed lists and clears the dense scratch.</summary>
        private void KeepBands()
        {
            int g = _grid.Count;
            for (int i = 0; i < g; i++)
            {
                if (_rowMin[i] > _rowMax[i])
                {
                    continue;
                }

                int length = _rowMax[i] - _rowMin[i] + 1;
                int padded = (length + Padding - 1) / Padding * Padding;
                RowOuter.Add(i);
                RowBandStart.Add(_rowMin[i]);
                RowLength.Add(padded);
                RowOffset.Add(Weights[0].Count);
                for (int s = 0; s < P22Weights.Count; s++)
                {
                    Span<double> band = _dense[s].AsSpan((i * g) + _rowMin[i], length);
                    foreach (double w in band)
                    {
                        Weights[s].Add(w);
                    }

                    for (int pad = length; pad < padded; pad++)
                    {
                        Weights[s].Add(0.0);
                    }

                    band.Clear();
                }
            }
        }
    }
}
