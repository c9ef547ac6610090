namespace Sibyl.Cosmology.Numerics;

/// <summary>
/// Adaptive linearly implicit integrator for stiff linear homogeneous systems y' = A(t) y: the two-stage, second-order,
/// L-stable Rosenbrock method ROS2 with γ = 1 + 1/√2 (Verwer, Spee, Blom &amp; Hundsdorfer 1999, SIAM J. Sci. Comput. 20,
/// 1456). ROS2 keeps order 2 for any matrix in place of the Jacobian (a W-method), so A is taken once per step at its
/// start, and the time dependence needs no ∂f/∂t term. For a homogeneous linear system column j of A is exactly
/// F(t, e_j), so the Jacobian costs n evaluations and no differencing error. The error estimate is the difference
/// to the embedded first-order solution y + h k₁. Buffers are made once; integrating allocates nothing.
/// </summary>
public sealed class LinearRosenbrock2
{
    private static readonly double Gamma = 1.0 + 1.0 / Math.Sqrt(2.0);

    private readonly int _capacity;
    private readonly double[] _jacobian, _matrix, _k1, _k2, _stage, _unit, _column;
    private readonly int[] _pivots;

    /// <summary>Creates an integrator for systems of up to <paramref name="dimension"/> equations.</summary>
    public LinearRosenbrock2(int dimension)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(dimension, 1);
        _capacity = dimension;
        _jacobian = new double[dimension * dimension];
        _matrix = new double[dimension * dimension];
        _k1 = new double[dimension];
        _k2 = new double[dimension];
        _stage = new double[dimension];
        _unit = new double[dimension];
        _column = new double[dimension];
        _pivots = new int[dimension];
    }

    /// <summary>
    /// Advances the first <paramref name="dimension"/> components of <paramref name="y"/> from <paramref name="t0"/> to
    /// <paramref name="t1"/>; the right-hand side must be linear and homogeneous in y. Error control as in
    /// <see cref="DormandPrince54.Integrate"/>.
    /// </summary>
    /// <exception cref="ArithmeticException">The step underflows, the matrix is singular, the state stops being finite, or the step budget runs out.</exception>
    public void Integrate(
        OdeRightHandSide rhs,
        Span<double> y,
        int dimension,
        double t0,
        double t1,
        ref double step,
        double relativeTolerance,
        double absoluteTolerance,
        int maxSteps = 1_000_000)
    {
        ArgumentNullException.ThrowIfNull(rhs);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(dimension, _capacity);
        if (!(t1 > t0))
        {
            return;
        }

        int n = dimension;
        var state = y[..n];
        var k1 = _k1.AsSpan(0, n);
        var k2 = _k2.AsSpan(0, n);
        var stage = _stage.AsSpan(0, n);
        double t = t0, h = Math.Min(Math.Abs(step), t1 - t0);
        bool jacobianCurrent = false;
        for (int attempts = 0; ; attempts++)
        {
            if (attempts >= maxSteps)
            {
                throw new ArithmeticException($"the implicit integration used {maxSteps} steps between t = {t0:G6} and {t1:G6} without finishing (stopped at {t:G6})");
            }

            bool last = t + h >= t1;
            if (last)
            {
                h = t1 - t;
            }

            if (!jacobianCurrent)
            {
                Jacobian(rhs, t, n);
                jacobianCurrent = true;
            }

            Factor(n, h);
            rhs(t, state, k1);
            Solve(n, k1);
            for (int i = 0; i < n; i++)
            {
                stage[i] = state[i] + h * k1[i];
            }

            double tNext = last ? t1 : t + h;
            rhs(tNext, stage, k2);
            for (int i = 0; i < n; i++)
            {
                k2[i] -= 2.0 * k1[i];
            }

            Solve(n, k2);
            double sum = 0.0;
            for (int i = 0; i < n; i++)
            {
                double next = state[i] + h * (1.5 * k1[i] + 0.5 * k2[i]);
                double scale = absoluteTolerance + relativeTolerance * Math.Max(Math.Abs(state[i]), Math.Abs(next));
                double r = 0.5 * h * (k1[i] + k2[i]) / scale;
                sum += r * r;
                stage[i] = next;
            }

            double error = Math.Sqrt(sum / n);
            if (!double.IsFinite(error))
            {
                throw new ArithmeticException($"the state stopped being finite at t = {t:G6}");
            }

            // An order-1 error estimate: the step scales as error^(−1/2).
            double factor = Math.Clamp(0.9 / Math.Sqrt(Math.Max(error, 1e-10)), 0.2, 4.0);
            if (error <= 1.0)
            {
                stage.CopyTo(state);
                t = tNext;
                jacobianCurrent = false;
                if (last)
                {
                    step = h * factor;
                    return;
                }
            }

            h *= factor;
            if (h < 1e-14 * Math.Max(Math.Abs(t), 1.0))
            {
                throw new ArithmeticException($"the implicit step underflowed at t = {t:G6}");
            }
        }
    }

    /// <summary>Column j of A(t) is F(t, e_j), exact for a linear homogeneous right-hand side.</summary>
    private void Jacobian(OdeRightHandSide rhs, double t, int n)
    {
        var unit = _unit.AsSpan(0, n);
        var column = _column.AsSpan(0, n);
        unit.Clear();
        for (int j = 0; j < n; j++)
        {
            unit[j] = 1.0;
            rhs(t, unit, column);
            unit[j] = 0.0;
            for (int i = 0; i < n; i++)
            {
                _jacobian[i * n + j] = column[i];
            }
        }
    }

    /// <summary>LU factors of I − γhA with partial pivoting, in place (Golub &amp; Van Loan, Matrix Computations, §3.4).</summary>
    private void Factor(int n, double h)
    {
        var m = _matrix;
        double scale = -Gamma * h;
        for (int i = 0; i < n * n; i++)
        {
            m[i] = scale * _jacobian[i];
        }

        for (int i = 0; i < n; i++)
        {
            m[i * n + i] += 1.0;
        }

        for (int c = 0; c < n; c++)
        {
            int pivot = c;
            double largest = Math.Abs(m[c * n + c]);
            for (int r = c + 1; r < n; r++)
            {
                double v = Math.Abs(m[r * n + c]);
                if (v > largest)
                {
                    largest = v;
                    pivot = r;
                }
            }

            if (largest == 0.0)
            {
                throw new ArithmeticException("the implicit stage matrix I − γhA is singular");
            }

            _pivots[c] = pivot;
            if (pivot != c)
            {
                for (int j = 0; j < n; j++)
                {
                    (m[c * n + j], m[pivot * n + j]) = (m[pivot * n + j], m[c * n + j]);
                }
            }

            double inverse = 1.0 / m[c * n + c];
            for (int r = c + 1; r < n; r++)
            {
                double f = m[r * n + c] * inverse;
                if (f == 0.0)
                {
                    continue;
                }

                m[r * n + c] = f;
                for (int j = c + 1; j < n; j++)
                {
                    m[r * n + j] -= f * m[c * n + j];
                }
            }
        }
    }

    /// <summary>Solves (I − γhA) x = b in place with the factors of <see cref="Factor"/>.</summary>
    private void Solve(int n, Span<double> b)
    {
        var m = _matrix;
        // The factorisation swapped whole rows, so the multipliers sit in the final row order: permute b first.
        for (int c = 0; c < n; c++)
        {
            int p = _pivots[c];
            if (p != c)
            {
                (b[c], b[p]) = (b[p], b[c]);
            }
        }

        for (int c = 0; c < n; c++)
        {
            double value = b[c];
            for (int r = c + 1; r < n; r++)
            {
                b[r] -= m[r * n + c] * value;
            }
        }

        for (int r = n - 1; r >= 0; r--)
        {
            double sum = b[r];
            for (int j = r + 1; j < n; j++)
            {
                sum -= m[r * n + j] * b[j];
            }

            b[r] = sum / m[r * n + r];
        }
    }
}
