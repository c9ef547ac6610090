namespace Sibyl.Perturbation.Loops;

/// <summary>
/// A linear power spectrum P(q) tabulated on a uniform grid in ln q: the only input of the one-loop
/// momentum-integral engine.
/// </summary>
/// <remarks>
/// <para>
/// Between nodes, P is interpolated by four-point (cubic) Lagrange interpolation in ln q of P itself,
/// using the two nodes on each side of the query (the stencil is shifted inwards at the table ends).
/// The interpolation error is about (3/128)·h⁴·|∂⁴P/∂(ln q)⁴| at a cell centre, with h the ln q step;
/// for the default table (h ≈ 0.0079) and a smooth spectrum of local slope |n| ≤ 3 that is below 1e-8
/// relative, and for baryon wiggles of 5 % amplitude and period 0.06 h/Mpc it is below 1e-5 of P.
/// </para>
/// <para>
/// Outside [<see cref="QMin"/>, <see cref="QMax"/>] the spectrum is taken to be exactly zero: the loop
/// integrals are truncated to the table range. The default range 1e-5 to 100 h/Mpc is chosen so that
/// this truncation changes the nine one-loop integrals of a ΛCDM-like spectrum (slope ≈ +1 at low q,
/// ≈ −3 at high q) by less than 1e-5 relative for 0.005 ≤ k ≤ 0.5 h/Mpc and 2e-5 at k = 1 h/Mpc (measured
/// against a 1e-8 to 1e4 h/Mpc table; the figure includes the two plans' own quadrature differences).
/// </para>
/// </remarks>
public sealed class LogSampledSpectrum
{
    /// <summary>Default lower end of the table, in h/Mpc.</summary>
    public const double DefaultQMin = 1e-5;

    /// <summary>Default upper end of the table, in h/Mpc.</summary>
    public const double DefaultQMax = 100.0;

    /// <summary>Default number of table nodes.</summary>
    public const int DefaultCount = 2048;

    // Cubic interpolation needs four nodes.
    private const int MinimumCount = 4;

    private readonly double[] _values;
    private readonly double _lnQMin;
    private readonly double _inverseStep;

    /// <summary>Tabulates <paramref name="spectrum"/> at <paramref name="count"/> nodes uniform in ln q.</summary>
    /// <param name="spectrum">The linear power spectrum P(q): q in h/Mpc, P in (Mpc/h)³; must return finite values.</param>
    /// <param name="qMin">First node, in h/Mpc; finite and positive.</param>
    /// <param name="qMax">Last node, in h/Mpc; finite and above <paramref name="qMin"/>.</param>
    /// <param name="count">Number of nodes, at least 4.</param>
    /// <exception cref="ArgumentException">A range, count or sampled value is invalid.</exception>
    public LogSampledSpectrum(
        Func<double, double> spectrum,
        double qMin = DefaultQMin,
        double qMax = DefaultQMax,
        int count = DefaultCount)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ValidateGeometry(qMin, qMax, count);
        QMin = qMin;
        QMax = qMax;
        _lnQMin = Math.Log(qMin);
        LnStep = (Math.Log(qMax) - _lnQMin) / (count - 1);
        _inverseStep = 1.0 / LnStep;
        _values = new double[count];
        for (int i = 0; i < count; i++)
        {
            // The ends are set exactly so that rounding in exp(ln q) cannot move them.
            double q = i == 0 ? qMin : i == count - 1 ? qMax : Math.Exp(_lnQMin + (i * LnStep));
            double value = spectrum(q);
            if (!double.IsFinite(value))
            {
                throw new ArgumentException(
                    string.Create(System.Globalization.CultureInfo.InvariantCulture, $"P({q:R}) = {value:R} is not finite."),
                    nameof(spectrum));
            }

            _values[i] = value;
        }
    }

    /// <summary>Wraps values already sampled at nodes uniform in ln q from <paramref name="qMin"/> to <paramref name="qMax"/>.</summary>
    /// <param name="values">P at the nodes, in (Mpc/h)³; at least 4, all finite. Copied.</param>
    /// <param name="qMin">First node, in h/Mpc; finite and positive.</param>
    /// <param name="qMax">Last node, in h/Mpc; finite and above <paramref name="qMin"/>.</param>
    /// <exception cref="ArgumentException">The range or a value is invalid.</exception>
    public LogSampledSpectrum(ReadOnlySpan<double> values, double qMin = DefaultQMin, double qMax = DefaultQMax)
    {
        ValidateGeometry(qMin, qMax, values.Length);
        for (int i = 0; i < values.Length; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                throw new ArgumentException(
                    string.Create(System.Globalization.CultureInfo.InvariantCulture, $"values[{i}] = {values[i]:R} is not finite."),
                    nameof(values));
            }
        }

        QMin = qMin;
        QMax = qMax;
        _lnQMin = Math.Log(qMin);
        LnStep = (Math.Log(qMax) - _lnQMin) / (values.Length - 1);
        _inverseStep = 1.0 / LnStep;
        _values = values.ToArray();
    }

    /// <summary>First node of the table, in h/Mpc.</summary>
    public double QMin { get; }

    /// <summary>Last node of the table, in h/Mpc.</summary>
    public double QMax { get; }

    /// <summary>Number of nodes.</summary>
    public int Count => _values.Length;

    /// <summary>Spacing of the nodes in ln q (dimensionless).</summary>
    public double LnStep { get; }

    /// <summary>P at the nodes, in (Mpc/h)³.</summary>
    public ReadOnlySpan<double> Values => _values;

    /// <summary>The wavenumber of node <paramref name="index"/>, in h/Mpc.</summary>
    /// <param name="index">Node index, 0 ≤ index &lt; <see cref="Count"/>.</param>
    public double NodeQ(int index)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(index);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(index, Count);
        return index == 0 ? QMin : index == Count - 1 ? QMax : Math.Exp(_lnQMin + (index * LnStep));
    }

    /// <summary>P(q) by cubic Lagrange interpolation in ln q; zero outside the table (and for NaN).</summary>
    /// <param name="q">Wavenumber in h/Mpc.</param>
    /// <returns>P in (Mpc/h)³.</returns>
    public double Evaluate(double q) => q >= QMin && q <= QMax ? EvaluateInside(Math.Log(q)) : 0.0;

    /// <summary>P at ln q; the caller guarantees QMin ≤ q ≤ QMax (up to rounding of the logarithm).</summary>
    internal double EvaluateInside(double lnQ)
    {
        double position = (lnQ - _lnQMin) * _inverseStep;
        int cell = (int)position;
        int first = Math.Clamp(cell - 1, 0, _values.Length - 4);
        double t = position - first;
        // Lagrange weights for nodes first..first+3 at offset t (nodes at 0, 1, 2, 3).
        double t0 = t, t1 = t - 1.0, t2 = t - 2.0, t3 = t - 3.0;
        double w0 = -t1 * t2 * t3 / 6.0;
        double w1 = t0 * t2 * t3 / 2.0;
        double w2 = -t0 * t1 * t3 / 2.0;
        double w3 = t0 * t1 * t2 / 6.0;
        ref double v = ref _values[first];
        return (w0 * v) + (w1 * System.Runtime.CompilerServices.Unsafe.Add(ref v, 1))
            + (w2 * System.Runtime.CompilerServices.Unsafe.Add(ref v, 2)) + (w3 * System.Runtime.CompilerServices.Unsafe.Add(ref v, 3));
    }

    /// <summary>True when this table spans [<paramref name="qMin"/>, <paramref name="qMax"/>] (h/Mpc) to <see cref="LoopRange.RelativeTolerance"/>.</summary>
    internal bool HasSameRangeAs(double qMin, double qMax) =>
        Math.Abs(qMin - QMin) <= LoopRange.RelativeTolerance * QMin && Math.Abs(qMax - QMax) <= LoopRange.RelativeTolerance * QMax;

    private static void ValidateGeometry(double qMin, double qMax, int count)
    {
        if (!double.IsFinite(qMin) || qMin <= 0.0)
        {
            throw new ArgumentException(
                string.Create(System.Globalization.CultureInfo.InvariantCulture, $"qMin = {qMin:R} h/Mpc must be finite and positive."),
                nameof(qMin));
        }

        if (!double.IsFinite(qMax) || qMax <= qMin)
        {
            throw new ArgumentException(
                string.Create(System.Globalization.CultureInfo.InvariantCulture, $"qMax = {qMax:R} h/Mpc must be finite and above qMin = {qMin:R}."),
                nameof(qMax));
        }

        if (count < MinimumCount)
        {
            throw new ArgumentException(
                string.Create(System.Globalization.CultureInfo.InvariantCulture, $"count = {count} must be at least {MinimumCount} for cubic interpolation."),
                nameof(count));
        }
    }
}
