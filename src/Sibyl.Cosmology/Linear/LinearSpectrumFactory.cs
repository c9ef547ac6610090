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
        var fit = Fit(parameters);
        return WithNoWiggle(parameters, FittingFormulaShape(parameters, lcdmGrowthToday), fit.SoundHorizon * parameters.H, "Eisenstein & Hu (1998) fit");
    }

    /// <summary>The Eisenstein &amp; Hu (1998) shape alone on the default grid, normalised by ln10As or σ8, in (Mpc/h)³.</summary>
    /// <param name="parameters">Cosmology.</param>
    /// <param name="lcdmGrowthToday">D(a = 1) of the general-relativity counterpart, in the D → a convention.</param>
    public static LogGridFunction FittingFormulaShape(CosmologyParameters parameters, double lcdmGrowthToday)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        var fit = Fit(parameters);
        double h = parameters.H, ns = parameters.SpectralIndex;
        var shape = LogGridFunction.Sample(k => Math.Pow(k, ns) * Square(fit.Transfer(k * h)), DefaultKMin, DefaultKMax, GridPoints);
        return parameters.Ln10As is { } lnAs
            ? shape.Scaled(ScalarAmplitudeFactor(parameters, lnAs))
            : ScaledToSigma8(parameters, shape, lcdmGrowthToday);
    }

    /// <summary>
    /// <paramref name="shape"/> rescaled so that D(1)·σ(8 Mpc/h) equals the parameters' σ8.
    /// </summary>
    /// <exception cref="ArgumentException">σ8 is not set.</exception>
    public static LogGridFunction ScaledToSigma8(CosmologyParameters parameters, LogGridFunction shape, double lcdmGrowthToday)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        ArgumentNullException.ThrowIfNull(shape);
        double sigma8 = parameters.Sigma8 ?? throw new ArgumentException("either ln10As or sigma8 must be set", nameof(parameters));
        double variance = TopHat.Variance(shape, 8.0) * lcdmGrowthToday * lcdmGrowthToday;
        return shape.Scaled(sigma8 * sigma8 / variance);
    }

    /// <summary>
    /// A linear spectrum from a shape in growth units: the no-wiggle partner comes from <see cref="NoWiggleSplit"/>
    /// against the Eisenstein &amp; Hu (1998) zero-baryon form, the same for every source.
    /// </summary>
    /// <param name="parameters">Cosmology (for the smooth reference).</param>
    /// <param name="shape">Shape(k) in (Mpc/h)³ on a log grid.</param>
    /// <param name="baoScale">Sound horizon at the drag epoch in Mpc/h.</param>
    /// <param name="source">Where the shape came from, for reports.</param>
    public static LinearSpectrum WithNoWiggle(CosmologyParameters parameters, LogGridFunction shape, double baoScale, string source)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        var fit = Fit(parameters);
        double h = parameters.H, ns = parameters.SpectralIndex;
        var noWiggle = NoWiggleSplit.Split(shape, k => Math.Pow(k, ns) * Square(fit.NoWiggleTransfer(k * h)));
        return new LinearSpectrum(shape, noWiggle, baoScale, source);
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
        return WithNoWiggle(parameters, shape, Fit(parameters).SoundHorizon * parameters.H, "user table");
    }

    /// <summary>
    /// Φ = −(3/5)ℛ in matter domination and Poisson's equation give, with D → a,
    /// P(k) = (8π²/25) A_s (k/k_p)^{n_s−1} T²(k) k (c/H0)⁴ / Ω_m²; the shape already holds k^{n_s} T².
    /// </summary>
    private static double ScalarAmplitudeFactor(CosmologyParameters p, double lnAs)
    {
        double asValue = Math.Exp(lnAs) * 1e-10;
        double pivot = PivotScale / p.H;
        return 8.0 * Math.PI * Math.PI / 25.0 * asValue * Math.Pow(pivot, 1.0 - p.SpectralIndex)
               * Math.Pow(HubbleDistance, 4) / (p.OmegaMatter * p.OmegaMatter);
    }

    private static EisensteinHu Fit(CosmologyParameters p) => new(p.OmegaBaryon, p.OmegaCdm, p.H, p.CmbTemperature);

    private static double Square(double x) => x * x;
}
