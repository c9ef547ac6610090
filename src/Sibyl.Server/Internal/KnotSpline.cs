namespace Sibyl.Server.Internal;

/// <summary>
/// Cubic spline interpolation on fixed knots with not-a-knot end conditions (de Boor 1978, A Practical Guide to
/// Splines, ch. IV): the third derivative is continuous at the second and the second-to-last knot, which keeps the
/// fourth-order accuracy of the interior up to the ends (a natural spline drops to second order there). The knots'
/// tridiagonal system is factorised once; each series then costs one forward and one back substitution. Three knots
/// fall back to the natural spline, two to a straight line.
/// </summary>
internal sealed class KnotSpline
{
    private readonly double[] _x, _h;
    private readonly double[] _lower, _upperPrime, _inverseDenominator;

    /// <summary>Factorises the system for knots <paramref name="x"/> (strictly increasing, at least two).</summary>
    /// <exception cref="ArgumentException">Fewer than two knots, or not strictly increasing.</exception>
    public KnotSpline(ReadOnlySpan<double> x)
    {
        int n = x.Length;
        if (n < 2)
        {
            throw new ArgumentException("a spline needs at least two knots", nameof(x));
        }

        _x = x.ToArray();
        _h = new double[n - 1];
        for (int i = 0; i < n - 1; i++)
        {
            _h[i] = x[i + 1] - x[i];
            if (!(_h[i] > 0.0))
            {
                throw new ArgumentException("knots must be strictly increasing", nameof(x));
            }
        }

        int m = Math.Max(0, n - 2);
        var diagonal = new double[m];
        var upper = new double[m];
        _lower = new double[m];
        for (int r = 0; r < m; r++)
        {
            int i = r + 1;
            _lower[r] = _h[i - 1];
            diagonal[r] = 2.0 * (_h[i - 1] + _h[i]);
            upper[r] = _h[i];
        }

        if (n >= 4)
        {
            // Not-a-knot: eliminate M_0 and M_(n-1) with the continuity of the third derivative.
            double h0 = _h[0], h1 = _h[1];
            diagonal[0] = (h0 + h1) * (h0 + (2.0 * h1)) / h1;
            upper[0] = ((h1 * h1) - (h0 * h0)) / h1;
            double p = _h[n - 3], q = _h[n - 2];
            _lower[m - 1] = ((p * p) - (q * q)) / p;
            diagonal[m - 1] = (p + q) * ((2.0 * p) + q) / p;
        }

        _upperPrime = new double[m];
        _inverseDenominator = new double[m];
        for (int r = 0; r < m; r++)
        {
            double denominator = diagonal[r] - (r > 0 ? _lower[r] * _upperPrime[r - 1] : 0.0);
            _inverseDenominator[r] = 1.0 / denominator;
            _upperPrime[r] = upper[r] * _inverseDenominator[r];
        }
    }

    /// <summary>Number of knots.</summary>
    public int Count => _x.Length;

    /// <summary>Locates <paramref name="x"/> (clamped to the knots' range) and computes its weights.</summary>
    public SplinePoint Locate(double x)
    {
        x = Math.Clamp(x, _x[0], _x[^1]);
        int j = Array.BinarySearch(_x, x);
        j = j >= 0 ? Math.Min(j, _x.Length - 2) : Math.Min(~j - 1, _x.Length - 2);
        double h = _h[j];
        double a = (_x[j + 1] - x) / h, b = 1.0 - a;
        double sixth = h * h / 6.0;
        return new SplinePoint(j, a, b, ((a * a * a) - a) * sixth, ((b * b * b) - b) * sixth);
    }

    /// <summary>
    /// Interpolates the values <paramref name="y"/> at the knots to the located points; <paramref name="curvature"/>
    /// (length <see cref="Count"/>) is scratch that ends holding the second derivatives.
    /// </summary>
    public void Evaluate(ReadOnlySpan<double> y, ReadOnlySpan<SplinePoint> points, Span<double> curvature, Span<double> result)
    {
        SolveCurvature(y, curvature);
        for (int p = 0; p < points.Length; p++)
        {
            var s = points[p];
            int j = s.Interval;
            result[p] = (s.A * y[j]) + (s.B * y[j + 1]) + (s.Ca * curvature[j]) + (s.Cb * curvature[j + 1]);
        }
    }

    private void SolveCurvature(ReadOnlySpan<double> y, Span<double> curvature)
    {
        int n = _x.Length, m = n - 2;
        curvature.Clear();
        if (m <= 0)
        {
            return;
        }

        for (int r = 0; r < m; r++)
        {
            int i = r + 1;
            double rhs = 6.0 * (((y[i + 1] - y[i]) / _h[i]) - ((y[i] - y[i - 1]) / _h[i - 1]));
            curvature[i] = (rhs - (r > 0 ? _lower[r] * curvature[i - 1] : 0.0)) * _inverseDenominator[r];
        }

        for (int r = m - 2; r >= 0; r--)
        {
            curvature[r + 1] -= _upperPrime[r] * curvature[r + 2];
        }

        if (n >= 4)
        {
            double h0 = _h[0], h1 = _h[1], p = _h[n - 3], q = _h[n - 2];
            curvature[0] = (((h0 + h1) * curvature[1]) - (h0 * curvature[2])) / h1;
            curvature[n - 1] = (((p + q) * curvature[n - 2]) - (q * curvature[n - 3])) / p;
        }
    }
}
