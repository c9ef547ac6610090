namespace Sibyl.Cosmology.Numerics;

/// <summary>
/// Adaptive explicit Runge–Kutta of order 5 with an embedded order-4 error estimate (Dormand &amp; Prince 1980,
/// J. Comput. Appl. Math. 6, 19; coefficients and the PI step control of Hairer, Nørsett &amp; Wanner, Solving ODEs I,
/// §II.4–5). First-same-as-last, so a step costs six evaluations.
/// </summary>
public sealed class DormandPrince54 : AdaptiveIntegrator
{
    private const double C2 = 1.0 / 5, C3 = 3.0 / 10, C4 = 4.0 / 5, C5 = 8.0 / 9;
    private const double A21 = 1.0 / 5;
    private const double A31 = 3.0 / 40, A32 = 9.0 / 40;
    private const double A41 = 44.0 / 45, A42 = -56.0 / 15, A43 = 32.0 / 9;
    private const double A51 = 19372.0 / 6561, A52 = -25360.0 / 2187, A53 = 64448.0 / 6561, A54 = -212.0 / 729;
    private const double A61 = 9017.0 / 3168, A62 = -355.0 / 33, A63 = 46732.0 / 5247, A64 = 49.0 / 176, A65 = -5103.0 / 18656;
    private const double B1 = 35.0 / 384, B3 = 500.0 / 1113, B4 = 125.0 / 192, B5 = -2187.0 / 6784, B6 = 11.0 / 84;
    private const double E1 = 71.0 / 57600, E3 = -71.0 / 16695, E4 = 71.0 / 1920, E5 = -17253.0 / 339200, E6 = 22.0 / 525, E7 = -1.0 / 40;

    private readonly double[] _k1, _k2, _k3, _k4, _k5, _k6, _k7, _stage, _error;
    private int _dimension;
    private double _previousError;

    /// <summary>Creates an integrator for systems of up to <paramref name="dimension"/> equations.</summary>
    public DormandPrince54(int dimension)
        : base(dimension)
    {
        _k1 = new double[dimension];
        _k2 = new double[dimension];
        _k3 = new double[dimension];
        _k4 = new double[dimension];
        _k5 = new double[dimension];
        _k6 = new double[dimension];
        _k7 = new double[dimension];
        _stage = new double[dimension];
        _error = new double[dimension];
    }

    /// <inheritdoc/>
    protected override ReadOnlySpan<double> ErrorEstimate => _error.AsSpan(0, _dimension);

    /// <inheritdoc/>
    protected override void Begin(OdeRightHandSide rhs, double t, ReadOnlySpan<double> y)
    {
        _dimension = y.Length;
        _previousError = 1e-4;
        rhs(t, y, _k1.AsSpan(0, _dimension));
    }

    /// <inheritdoc/>
    protected override void Attempt(OdeRightHandSide rhs, double t, double tNext, ReadOnlySpan<double> y, Span<double> next)
    {
        int n = _dimension;
        double h = tNext - t;
        var k1 = _k1.AsSpan(0, n);
        var k2 = _k2.AsSpan(0, n);
        var k3 = _k3.AsSpan(0, n);
        var k4 = _k4.AsSpan(0, n);
        var k5 = _k5.AsSpan(0, n);
        var k6 = _k6.AsSpan(0, n);
        var k7 = _k7.AsSpan(0, n);
        var stage = _stage.AsSpan(0, n);
        for (int i = 0; i < n; i++)
        {
            stage[i] = y[i] + h * A21 * k1[i];
        }

        rhs(t + C2 * h, stage, k2);
        for (int i = 0; i < n; i++)
        {
            stage[i] = y[i] + h * (A31 * k1[i] + A32 * k2[i]);
        }

        rhs(t + C3 * h, stage, k3);
        for (int i = 0; i < n; i++)
        {
            stage[i] = y[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
        }

        rhs(t + C4 * h, stage, k4);
        for (int i = 0; i < n; i++)
        {
            stage[i] = y[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
        }

        rhs(t + C5 * h, stage, k5);
        for (int i = 0; i < n; i++)
        {
            stage[i] = y[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
        }

        rhs(tNext, stage, k6);
        for (int i = 0; i < n; i++)
        {
            next[i] = y[i] + h * (B1 * k1[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
        }

        rhs(tNext, next, k7);
        for (int i = 0; i < n; i++)
        {
            _error[i] = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
        }
    }

    /// <inheritdoc/>
    protected override double StepFactor(double error, bool accepted)
    {
        if (!accepted)
        {
            return Math.Max(0.2, 0.9 * Math.Pow(error, -0.2));
        }

        // PI control (Hairer, Nørsett & Wanner §II.4: β = 0.04, α = 1/5 − 0.75β) damps the step oscillations a pure
        // I controller shows near the stability limit.
        double factor = 0.9 * Math.Pow(error, -0.17) * Math.Pow(_previousError, 0.04);
        _previousError = Math.Max(error, 1e-4);
        return Math.Clamp(double.IsFinite(factor) ? factor : 5.0, 0.2, 5.0);
    }

    /// <inheritdoc/>
    protected override void Accepted() => _k7.AsSpan(0, _dimension).CopyTo(_k1);
}
