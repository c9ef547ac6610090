namespace Sibyl.Cosmology.Linear;

/// <summary>Variance of a spectrum smoothed with a spherical top hat.</summary>
public static class TopHat
{
    /// <summary>Fourier transform of the top hat, W(x) = 3 (sin x − x cos x)/x³, with its series below x = 1e-3.</summary>
    public static double Window(double x)
    {
        if (x < 1e-3)
        {
            return 1.0 - x * x / 10.0;
        }

        return 3.0 * (Math.Sin(x) - x * Math.Cos(x)) / (x * x * x);
    }

    /// <summary>
    /// σ²(R) = ∫ d ln k k³ P(k) W²(kR) / (2π²) over the table, by Simpson's rule in ln k. The table spans
    /// 1e-5–100 h/Mpc for the fitting formula, where the integrand at either end is below 1e-9 of its peak.
    /// </summary>
    /// <param name="spectrum">P(k) in (Mpc/h)³ on a log grid.</param>
    /// <param name="radius">R in Mpc/h, positive.</param>
    public static double Variance(LogGridFunction spectrum, double radius)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(radius);
        int n = spectrum.Count;
        if (n % 2 == 0)
        {
            throw new ArgumentException($"Simpson's rule needs an odd number of grid points, got {n}", nameof(spectrum));
        }

        double sum = 0.0;
        for (int i = 0; i < n; i++)
        {
            double k = spectrum.K(i);
            double w = Window(k * radius);
            double f = k * k * k * spectrum.Values[i] * w * w;
            double simpson = i == 0 || i == n - 1 ? 1.0 : (i % 2 == 1 ? 4.0 : 2.0);
            sum += simpson * f;
        }

        return sum * spectrum.LnStep / 3.0 / (2.0 * Math.PI * Math.PI);
    }
}
