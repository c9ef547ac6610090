namespace Sibyl.Cosmology.Numerics;

/// <summary>
/// The step loop shared by the adaptive integrators: trial steps, acceptance on a scaled RMS error of at most 1,
/// landing exactly on the end point, and the guards (step budget, underflow, non-finite state). A method supplies
/// one trial step with its error estimate and its step-size rule. Buffers are made once; integrating allocates nothing.
/// </summary>
public abstract class AdaptiveIntegrator
{
    private readonly double[] _next;

    /// <summary>Creates an integrator for systems of up to <paramref name="dimension"/> equations.</summary>
    protected AdaptiveIntegrator(int dimension)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(dimension, 1);
        _next = new double[dimension];
    }

    /// <summary>Largest system this integrator was made for.</summary>
    protected int Capacity => _next.Length;

    /// <summary>
    /// Advances the first <paramref name="dimension"/> components of <paramref name="y"/> from <paramref name="t0"/> to
    /// <paramref name="t1"/> (nothing happens unless t1 &gt; t0). The error of each component is measured against
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
    /// <exception cref="ArithmeticException">The step underflows, the state stops being finite, the method fails, or the step budget runs out.</exception>
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
        ArgumentOutOfRangeException.ThrowIfGreaterThan(dimension, Capacity);
        if (!(t1 > t0))
        {
            return;
        }

        var state = y[..dimension];
        var next = _next.AsSpan(0, dimension);
        double t = t0, h = Math.Min(Math.Abs(step), t1 - t0);
        Begin(rhs, t, state);
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

            double tNext = last ? t1 : t + h;
            Attempt(rhs, t, tNext, state, next);
            double error = ScaledRms(state, next, relativeTolerance, absoluteTolerance);
            if (!double.IsFinite(error))
            {
                throw new ArithmeticException($"the state stopped being finite at t = {t:G6}");
            }

            bool accepted = error <= 1.0;
            double factor = StepFactor(error, accepted);
            if (accepted)
            {
                next.CopyTo(state);
                t = tNext;
                Accepted();
                if (last)
                {
                    step = h * factor;
                    return;
                }
            }

            h *= factor;
            if (h < 1e-14 * Math.Max(Math.Abs(t), 1.0))
            {
                throw new ArithmeticException($"the step underflowed at t = {t:G6}");
            }
        }
    }

    /// <summary>Called once at the start of <see cref="Integrate"/> with the initial state.</summary>
    protected abstract void Begin(OdeRightHandSide rhs, double t, ReadOnlySpan<double> y);

    /// <summary>
    /// One trial step from (<paramref name="t"/>, <paramref name="y"/>) to <paramref name="tNext"/>: the new state goes
    /// to <paramref name="next"/>, the local error estimate of each component to <see cref="ErrorEstimate"/>.
    /// </summary>
    protected abstract void Attempt(OdeRightHandSide rhs, double t, double tNext, ReadOnlySpan<double> y, Span<double> next);

    /// <summary>The local error estimate of the last <see cref="Attempt"/>, one entry per component.</summary>
    protected abstract ReadOnlySpan<double> ErrorEstimate { get; }

    /// <summary>The factor by which the next step grows or shrinks after a step with this scaled error.</summary>
    protected abstract double StepFactor(double error, bool accepted);

    /// <summary>Called after a step is accepted and the state advanced.</summary>
    protected abstract void Accepted();

    private double ScaledRms(ReadOnlySpan<double> y, ReadOnlySpan<double> next, double relativeTolerance, double absoluteTolerance)
    {
        var error = ErrorEstimate;
        double sum = 0.0;
        for (int i = 0; i < y.Length; i++)
        {
            double r = error[i] / (absoluteTolerance + relativeTolerance * Math.Max(Math.Abs(y[i]), Math.Abs(next[i])));
            sum += r * r;
        }

        return Math.Sqrt(sum / y.Length);
    }
}
