namespace Sibyl.Cosmology.Numerics;

/// <summary>
/// Adaptive linearly implicit integrator for stiff linear homogeneous systems y' = A(t) y: the two-stage, second-order,
/// L-stable Rosenbrock method ROS2 with γ = 1 + 1/√2 (Verwer, Spee, Blom &amp; Hundsdorfer 1999, SIAM J. Sci. Comput. 20,
/// 1456). ROS2 keeps order 2 for any matrix in place of the Jacobian (a W-method), so A is taken once per step at its
/// start, and the time dependence needs no ∂f/∂t term. For a homogeneous linear system column j of A is exactly
/// F(t, e_j), so the Jacobian costs n evaluations and no differencing error. The error estimate is the difference
/// to the embedded first-order solution y + h k₁.
/// </summary>
public sealed class LinearRosenbrock2 : AdaptiveIntegrator
{
    private static readonly double Gamma = 1.0 + 1.0 / Math.Sqrt(2.0);

    private readonly double[] _jacobian, _matrix, _k1, _k2, _stage, _unit, _column, _error;
    private readonly int[] _pivots;
    private int _dimension;
    private bool _jacobianCurrent;

    /// <summary>Creates an integrator for systems of up to <paramref name="dimension"/> equations, linear and homogeneous in y.</summary>
    public LinearRosenbrock2(int dimension)
        : base(dimension)
    {
        _jacobian = new double[dimension * dimension];
        _matrix = new double[dimension * dimension];
        _k1 = new double[dimension];
        _k2 = new double[dimension];
        _stage = new double[dimension];
        _unit = new double[dimension];
        _column = new double[dimension];
        _error = new double[dimension];
        _pivots = new int[dimension];
    }

    /// <inheritdoc/>
    protected override ReadOnlySpan<double> ErrorEstimate => _error.AsSpan(0, _dimension);

    /// <inheritdoc/>
    protected override void Begin(OdeRightHandSide rhs, double t, ReadOnlySpan<double> y)
    {
        _dimension = y.Length;
        _jacobianCurrent = false;
    }

    /// <inheritdoc/>
    /// <exception cref="ArithmeticException">The stage matrix I − γhA is singular.</exception>
    protected override void Attempt(OdeRightHandSide rhs, double t, double tNext, ReadOnlySpan<double> y, Span<double> next)
    {
        int n = _dimension;
        double h = tNext - t;
        var k1 = _k1.AsSpan(0, n);
        var k2 = _k2.AsSpan(0, n);
        var stage = _stage.AsSpan(0, n);
        if (!_jacobianCurrent)
        {
            Jacobian(rhs, t, n);
            _jacobianCurrent = true;
        }

        Factor(n, h);
        rhs(t, y, k1);
        Solve(n, k1);
        for (int i = 0; i < n; i++)
        {
            stage[i] = y[i] + h * k1[i];
        }

        rhs(tNext, stage, k2);
        for (int i = 0; i < n; i++)
        {
            k2[i] -= 2.0 * k1[i];
        }

        Solve(n, k2);
        for (int i = 0; i < n; i++)
        {
            next[i] = y[i] + h * (1.5 * k1[i] + 0.5 * k2[i]);
            _error[i] = 0.5 * h * (k1[i] + k2[i]);
        }
    }

    /// <inheritdoc/>
    /// <remarks>An order-1 error estimate: the step scales as error^(−1/2).</remarks>
    protected override double StepFactor(double error, bool accepted) => Math.Clamp(0.9 / Math.Sqrt(Math.Max(error, 1e-10)), 0.2, 4.0);

    /// <inheritdoc/>
    protected override void Accepted() => _jacobianCurrent = false;

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
