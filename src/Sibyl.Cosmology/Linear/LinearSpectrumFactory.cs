using MathNet.Numerics.Interpolation;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Linear;

/// <summary>Builds a normalised <see cref="LinearSpectrum"/> from the fitting formula or from a user's table.</summary>
public static class LinearSpectrumFactory
{
    /// <summary>Default table range and size: 1e-5 to 100 h/Mpc, 2049 points (odd, for Simpson's rule).</summary>
    public const double DefaultKMin = 1e-5, DefaultKMax = 100.0;

    /// <summary>Grid points of every linear-spectrum table.</summary>
    public const int GridPoints = 2049;

    /// <summary>c/H0 in Mpc/h.</summary>
    public const double HubbleDistance = 2997.92458;

    /// <summary>Primordial pivot scale in 1/Mpc.</summary>
    public const double PivotScale = 0.05;

    /// <summary>
    /// Eisenstein &amp; Hu (1998) shape, normalised by ln10As or σ8.
    /// </summary>
    /// <param name="parameters">Cosmology.</param>
    /// <param name="lcdmGrowthToday">D(a = 1) of the general-relativity counterpart, in the D → a convention.</param>
    public static LinearSpectrum FromFittingFormula(CosmologyParameters parameters, double lcdmGrowthToday)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        var fit = new EisensteinHu(parameters.OmegaBaryon, parameters.OmegaCdm, parameters.H, parameters.CmbTemperature);
        double h = parameters.H, ns = parameters.SpectralIndex;
        var shape = LogGridFunction.Sample(k => Math.Pow(k, ns) * Square(fit.Transfer(k * h)), DefaultKMin, DefaultKMax, GridPoints);
        double amplitude = Amplitude(parameters, shape, lcdmGrowthToday);
        shape = shape.Scaled(amplitude);
        var noWiggle = NoWiggleSplit.Split(shape, k => Math.Pow(k, ns) * Square(fit.NoWiggleTransfer(k * h)));
        return new LinearSpectrum(shape, noWiggle, fit.SoundHorizon * h, "Eisenstein & Hu (1998) fit");
    }

    /// <summary>
    /// A user's table of the general-relativity linear spectrum at z = 0, interpolated by a natural cubic
    /// spline in (ln k, ln P) and resampled on the log grid within the table's own k range (never extrapolated).
    /// ln10As or σ8, if set, are ignored: the table carries its own amplitude.
    /// </summary>
    /// <param name="parameters">Cosmology (for the BAO scale and the smooth reference).</param>
    /// <param name="k">Wavenumbers in h/Mpc, strictly increasing, at least 8 values.</param>
    /// <param name="power">P_L(k, z = 0) in (Mpc/h)³, positive.</param>
    /// <param name="lcdmGrowthToday">D(a = 1) of the general-relativity counterpart.</param>
    /// <param name="rangeMin">Smallest k of the resampled table when the table reaches below it, h/Mpc.</param>
    /// <param name="rangeMax">Largest k of the resampled table when the table reaches above it, h/Mpc.</param>
    /// <exception cref="ArgumentException">The table is too short, not increasing, or has non-positive or non-finite values.</exception>
    public static LinearSpectrum FromTable(
        CosmologyParameters parameters,
        IReadOnlyList<double> k,
        IReadOnlyList<double> power,
        double lcdmGrowthToday,
        double rangeMin = DefaultKMin,
        double rangeMax = DefaultKMax)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        ArgumentNullException.ThrowIfNull(k);
        ArgumentNullException.ThrowIfNull(power);
        if (k.Count != power.Count || k.Count < 8)
        {
            throw new ArgumentException($"linear table needs at least 8 rows of (k, P); got {k.Count} k and {power.Count} P values");
        }

        var lnK = new double[k.Count];
        var lnP = new double[k.Count];
        for (int i = 0; i < k.Count; i++)
        {
            if (!(k[i] > 0.0 && double.IsFinite(k[i])) || !(power[i] > 0.0 && double.IsFinite(power[i])))
            {
                throw new ArgumentException($"linear table row {i + 1}: k and P must be positive and finite, got k = {k[i]}, P = {power[i]}");
            }

            if (i > 0 && !(k[i] > k[i - 1]))
            {
                throw new ArgumentException($"linear table row {i + 1}: k must increase strictly, got {k[i]} after {k[i - 1]}");
            }

            lnK[i] = Math.Log(k[i]);
            lnP[i] = Math.Log(power[i]);
        }

        var spline = CubicSpline.InterpolateNatural(lnK, lnP);
        double kMin = Math.Max(k[0], Math.Max(rangeMin, DefaultKMin)), kMax = Math.Min(k[^1], Math.Min(rangeMax, DefaultKMax));
        double growthSquared = lcdmGrowthToday * lcdmGrowthToday;
        var shape = LogGridFunction.Sample(q => Math.Exp(spline.Interpolate(Math.Log(q))) / growthSquared, kMin, kMax, GridPoints);
        var fit = new EisensteinHu(parameters.OmegaBaryon, parameters.OmegaCdm, parameters.H, parameters.CmbTemperature);
        double h = parameters.H, ns = parameters.SpectralIndex;
        var noWiggle = NoWiggleSplit.Split(shape, q => Math.Pow(q, ns) * Square(fit.NoWiggleTransfer(q * h)));
        return new LinearSpectrum(shape, noWiggle, fit.SoundHorizon * h, "user table");
    }

    private static double Amplitude(CosmologyParameters p, LogGridFunction shape, double lcdmGrowthToday)
    {
        if (p.Ln10As is { } lnAs)
        {
            // Φ = −(3/5)ℛ in matter domination and Poisson's equation give, with D → a,
            // P(k) = (8π²/25) A_s (k/k_p)^{n_s−1} T²(k) k (c/H0)⁴ / Ω_m²; the shape already holds k^{n_s} T².
            double asValue = Math.Exp(lnAs) * 1e-10;
            double pivot = PivotScale / p.H;
            return 8.0 * Math.PI * Math.PI / 25.0 * asValue * Math.Pow(pivot, 1.0 - p.SpectralIndex)
                   * Math.Pow(HubbleDistance, 4) / (p.OmegaMatter * p.OmegaMatter);
        }

        double sigma8 = p.Sigma8 ?? throw new ArgumentException("either ln10As or sigma8 must be set", nameof(p));
        double variance = TopHat.Variance(shape, 8.0) * lcdmGrowthToday * lcdmGrowthToday;
        return sigma8 * sigma8 / variance;
    }

    private static double Square(double x) => x * x;
}
