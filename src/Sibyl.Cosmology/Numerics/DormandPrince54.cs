namespace Sibyl.Cosmology.Numerics;

/// <summary>
/// Adaptive explicit Runge–Kutta of order 5 with an embedded order-4 error estimate (Dormand &amp; Prince 1980,
/// J. Comput. Appl. Math. 6, 19; coefficients and the PI step control of Hairer, Nørsett &amp; Wanner, Solving ODEs I,
/// §II.4–5). First-same-as-last, so a step costs six evaluations. Scratch buffers are made once; integrating
/// allocates nothing.
/// </summary>
public sealed class DormandPrince54
{
    private const double C2 = 1.0 / 5, C3 = 3.0 / 10, C4 = 4.0 / 5, C5 = 8.0 / 9;
    private const double A21 = 1.0 / 5;
    private const double A31 = 3.0 / 40, A32 = 9.0 / 40;
    private const double A41 = 44.0 / 45, A42 = -56.0 / 15, A43 = 32.0 / 9;
    private const double A51 = 19372.0 / 6561, A52 = -25360.0 / 2187, A53 = 64448.0 / 6561, A54 = -212.0 / 729;
    private const double A61 = 9017.0 / 3168, A62 = -355.0 / 33, A63 = 46732.0 / 5247, A64 = 49.0 / 176, A65 = -5103.0 / 18656;
    private const double B1 = 35.0 / 384, B3 = 500.0 / 1113, B4 = 125.0 / 192, B5 = -2187.0 / 6784, B6 = 11.0 / 84;
    private const double E1 = 71.0 / 57600, E3 = -71.0 / 16695, E4 = 71.0 / 1920, E5 = -17253.0 / 339200, E6 = 22.0 / 525, E7 = -1.0 / 40;

    private readonly double[] _k1, _k2, _k3, _k4, _k5, _k6, _k7, _stage, _next;

    /// <summary>Creates an integrator for systems of <paramref name="dimension"/> equations.</summary>
    public DormandPrince54(int dimension)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(dimension, 1);
        _k1 = new double[dimension];
        _k2 = new double[dimension];
        _k3 = new double[dimension];
        _k4 = new double[dimension];
        _k5 = new double[dimension];
        _k6 = new double[dimension];
        _k7 = new double[dimension];
        _stage = new double[dimension];
        _next = new double[dimension];
    }

    /// <summary>
    /// Advances the first <paramref name="dimension"/> components of <paramref name="y"/> from <paramref name="t0"/> to
    /// <paramref name="t1"/> (t1 &gt; t0). The error of each component is measured against
    /// <paramref name="absoluteTolerance"/> + <paramref name="relativeTolerance"/>·|y|, in the RMS norm.
    /// </summary>
    /// <param name="rhs">Right-hand side.</param>
    /// <param name="y">State, updated in place.</param>
    /// <param name="dimension">Number of active components (the rest of the buffers is ignored).</param>
    /// <param name="t0">Start.</param>
    /// <param name="t1">End.</param>
    /// <param name="step">First trial step; on return the step the controller would take next.</param>
    /// <param name="relativeTolerance">Relative tolerance per step.</param>
    /// <param name="absoluteTolerance">Absolute tolerance per step.</param>
    /// <param name="maxSteps">Bound on accepted plus rejected steps.</param>
    /// <exception cref="ArithmeticException">The step underflows, the state stops being finite, or the step budget runs out.</exception>
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
        ArgumentOutOfRangeException.ThrowIfGreaterThan(dimension, _k1.Length);
        if (!(t1 > t0))
        {
            return;
        }

        int n = dimension;
        var y0 = y[..n];
        var k1 = _k1.AsSpan(0, n);
        var k2 = _k2.AsSpan(0, n);
        var k3 = _k3.AsSpan(0, n);
        var k4 = _k4.AsSpan(0, n);
        var k5 = _k5.AsSpan(0, n);
        var k6 = _k6.AsSpan(0, n);
        var k7 = _k7.AsSpan(0, n);
        var stage = _stage.AsSpan(0, n);
        var next = _next.AsSpan(0, n);

        double t = t0, h = Math.Min(Math.Abs(step), t1 - t0), previousError = 1e-4;
        rhs(t, y0, k1);
        for (int attempts = 0; ; attempts++)
        {
            if (attempts >= maxSteps)
            {
                throw new ArithmeticException($"the integration used {maxSteps} steps between t = {t0:G6} and {t1:G6} without finishing (stopped at {t:G6})");
            }

            bool last = t + h >= t1;
            if (last)
            {
                h = t1 - t;
            }

            for (int i = 0; i < n; i++)
            {
                stage[i] = y0[i] + h * A21 * k1[i];
            }

            rhs(t + C2 * h, stage, k2);
            for (int i = 0; i < n; i++)
            {
                stage[i] = y0[i] + h * (A31 * k1[i] + A32 * k2[i]);
            }

            rhs(t + C3 * h, stage, k3);
            for (int i = 0; i < n; i++)
            {
                stage[i] = y0[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
            }

            rhs(t + C4 * h, stage, k4);
            for (int i = 0; i < n; i++)
            {
                stage[i] = y0[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
            }

            rhs(t + C5 * h, stage, k5);
            for (int i = 0; i < n; i++)
            {
                stage[i] = y0[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
            }

            double tNext = last ? t1 : t + h;
            rhs(tNext, stage, k6);
            for (int i = 0; i < n; i++)
            {
                next[i] = y0[i] + h * (B1 * k1[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
            }

            rhs(tNext, next, k7);
            double sum = 0.0;
            for (int i = 0; i < n; i++)
            {
                double e = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
                double scale = absoluteTolerance + relativeTolerance * Math.Max(Math.Abs(y0[i]), Math.Abs(next[i]));
                double r = e / scale;
                sum += r * r;
            }

            double error = Math.Sqrt(sum / n);
            if (!double.IsFinite(error))
            {
                throw new ArithmeticException($"the state stopped being finite at t = {t:G6}");
            }

            if (error <= 1.0)
            {
                next.CopyTo(y0);
                k7.CopyTo(k1);
                t = tNext;
                // PI control (Hairer, Nørsett & Wanner §II.4: β = 0.04, α = 1/5 − 0.75β) damps the step oscillations a pure
                // I controller shows near the stability limit.
                double factor = 0.9 * Math.Pow(error, -0.17) * Math.Pow(previousError, 0.04);
                previousError = Math.Max(error, 1e-4);
                double grown = h * Math.Clamp(double.IsFinite(factor) ? factor : 5.0, 0.2, 5.0);
                if (last)
                {
                    step = grown;
                    return;
                }

                h = grown;
            }
            else
            {
                h *= Math.Max(0.2, 0.9 * Math.Pow(error, -0.2));
            }

            if (h < 1e-14 * Math.Max(Math.Abs(t), 1.0))
            {
                throw new ArithmeticException($"the step underflowed at t = {t:G6}");
            }
        }
    }
}
