namespace Sibyl.Cosmology.Linear;

/// <summary>
/// Smooth ("no-wiggle") partner of a linear spectrum for IR resummation: the ratio of the spectrum to
/// the Eisenstein &amp; Hu (1998) zero-baryon form is smoothed with a Gaussian filter in ln k and multiplied
/// back. Smoothing a ratio that is already close to one removes the baryon oscillations while the
/// reference carries the broadband, a common practice (e.g. Vlah, Seljak, Chu &amp; Feng 2016, JCAP 03, 057,
/// smooth in log k). It works the same on a user's table as on the fitting formula.
/// </summary>
public static class NoWiggleSplit
{
    /// <summary>
    /// Filter width in k, h/Mpc. A Gaussian of width σ damps a wiggle of period Δk = 2π/r_d ≈ 0.06 h/Mpc by
    /// exp(−(2πσ/Δk)²/2), 2e-4 for σ = 0.04; a width fixed in k rather than in ln k keeps the filter
    /// narrow where the broadband curves (k ≳ 0.2), so the smooth part follows the wiggles' midpoint.
    /// </summary>
    public const double FilterWidthInK = 0.04;

    /// <summary>Cap on the width in ln k, reached below k = 0.08 h/Mpc where the ratio is nearly flat.</summary>
    public const double MaxFilterWidthInLnK = 0.5;

    /// <summary>Smoothing runs on every <c>Stride</c>-th grid point; the smoothed ratio is interpolated back.</summary>
    private const int Stride = 4;

    /// <summary>Returns the no-wiggle spectrum on the grid of <paramref name="spectrum"/>.</summary>
    /// <param name="spectrum">Linear spectrum with wiggles, on a log grid.</param>
    /// <param name="smoothReference">A smooth spectrum of similar broadband (the zero-baryon fit), any normalisation.</param>
    public static LogGridFunction Split(LogGridFunction spectrum, Func<double, double> smoothReference)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentNullException.ThrowIfNull(smoothReference);

        int n = spectrum.Count;
        var reference = new double[n];
        var coarseRatio = new double[(n - 1) / Stride + 1];
        for (int i = 0; i < n; i++)
        {
            reference[i] = smoothReference(spectrum.K(i));
        }

        for (int c = 0; c < coarseRatio.Length; c++)
        {
            int i = c * Stride;
            coarseRatio[c] = Math.Log(spectrum.Values[i] / reference[i]);
        }

        var smoothed = GaussianSmooth(coarseRatio, spectrum.LnKMin, spectrum.LnStep * Stride);
        var coarse = new LogGridFunction(spectrum.LnKMin, spectrum.LnStep * Stride, Exponentiate(smoothed));
        double lastCoarseK = coarse.KMax;
        var result = new double[n];
        for (int i = 0; i < n; i++)
        {
            double k = Math.Min(spectrum.K(i), lastCoarseK);
            result[i] = reference[i] * coarse.Evaluate(k);
        }

        return new LogGridFunction(spectrum.LnKMin, spectrum.LnStep, result);
    }

    private static double[] GaussianSmooth(double[] values, double lnKMin, double lnStep)
    {
        int n = values.Length;
        var result = new double[n];
        for (int i = 0; i < n; i++)
        {
            double k = Math.Exp(lnKMin + lnStep * i);
            double width = Math.Min(MaxFilterWidthInLnK, FilterWidthInK / k) / lnStep;
            int half = (int)Math.Ceiling(4.0 * width);
            double sum = 0.0, norm = 0.0;
            for (int j = -half; j <= half; j++)
            {
                // The ratio is flat at both ends of the table (no wiggles far from the BAO scale),
                // so holding the edge value is the right padding.
                double weight = Math.Exp(-0.5 * j * j / (width * width));
                sum += weight * values[Math.Clamp(i + j, 0, n - 1)];
                norm += weight;
            }

            result[i] = sum / norm;
        }

        return result;
    }

    private static double[] Exponentiate(double[] logs)
    {
        var values = new double[logs.Length];
        for (int i = 0; i < logs.Length; i++)
        {
            values[i] = Math.Exp(logs[i]);
        }

        return values;
    }
}
