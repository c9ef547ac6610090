namespace Sibyl.Emulation.Gaussian;

/// <summary>
/// Settings of <see cref="GaussianProcessRegression.Fit"/>: kernel, optimiser effort, restarts and the box in which
/// the hyperparameters are sought. Bounds are in standardized output units and unit-box input units.
/// </summary>
public sealed record GaussianProcessOptions
{
    /// <summary>Covariance function. Default <see cref="KernelKind.Matern52"/>.</summary>
    public KernelKind Kernel { get; init; } = KernelKind.Matern52;

    /// <summary>
    /// Starting point of the first optimisation; null (the default) starts from σ_f² = 1, every ℓ_q = 0.5 and
    /// σ_n² = 1e-6. Must have one length scale per input dimension.
    /// </summary>
    public GaussianProcessHyperparameters? Initial { get; init; }

    /// <summary>
    /// Additional optimisations from seeded random starting points (ln ℓ uniform in [ln 0.1, ln 3], ln σ_f² in
    /// [ln 0.3, ln 3], ln σ_n² in [ln 1e-8, ln 1e-4], clamped to the bounds); the best marginal likelihood wins.
    /// Non-negative; default 2.
    /// </summary>
    public int Restarts { get; init; } = 2;

    /// <summary>Seed of the restart generator; the same seed gives the same fit. Default 1.</summary>
    public ulong Seed { get; init; } = 1;

    /// <summary>Most quasi-Newton iterations per start; at least 1. Default 200.</summary>
    public int MaximumIterations { get; init; } = 200;

    /// <summary>Smallest length scale, unit-box units. Default 1e-3.</summary>
    public double MinimumLengthScale { get; init; } = 1e-3;

    /// <summary>Largest length scale, unit-box units. Default 1e3.</summary>
    public double MaximumLengthScale { get; init; } = 1e3;

    /// <summary>Smallest σ_f², standardized units. Default 1e-3.</summary>
    public double MinimumSignalVariance { get; init; } = 1e-3;

    /// <summary>Largest σ_f², standardized units. Default 1e3.</summary>
    public double MaximumSignalVariance { get; init; } = 1e3;

    /// <summary>
    /// Smallest nugget σ_n², relative to the unit variance of the standardized outputs: the floor that keeps the
    /// Cholesky factorisation stable for smooth kernels and dense designs. Default 1e-10.
    /// </summary>
    public double MinimumNoiseVariance { get; init; } = 1e-10;

    /// <summary>Largest nugget σ_n², standardized units. Default 1.</summary>
    public double MaximumNoiseVariance { get; init; } = 1.0;

    /// <summary>
    /// Keep the Cholesky factor of the training covariance in the model, which predictive variances need
    /// (n² doubles). Default true.
    /// </summary>
    public bool KeepCholeskyFactor { get; init; } = true;
}
