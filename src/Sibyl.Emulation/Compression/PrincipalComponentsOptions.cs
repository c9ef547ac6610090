namespace Sibyl.Emulation.Compression;

/// <summary>
/// How many principal components <see cref="PrincipalComponents.Fit(MathNet.Numerics.LinearAlgebra.Matrix{double}, PrincipalComponentsOptions)"/>
/// keeps, and how features are standardized before the decomposition.
/// </summary>
public sealed record PrincipalComponentsOptions
{
    /// <summary>
    /// Largest acceptable reconstruction error on the training data: the maximum over samples and features of
    /// |x − x̂|, in standardized units (after subtracting the mean and dividing by <see cref="Scale"/>). Finite and
    /// non-negative; default 0, which keeps every component up to <see cref="MaximumCount"/> or the rank.
    /// </summary>
    public double Tolerance { get; init; }

    /// <summary>Most components to keep even if <see cref="Tolerance"/> is not reached; at least 1. Default: no limit.</summary>
    public int MaximumCount { get; init; } = int.MaxValue;

    /// <summary>
    /// Per-feature divisor applied after subtracting the mean (one finite positive value per feature), in the units
    /// of the features; null (the default) divides by 1. Use it to give features of different size equal weight.
    /// </summary>
    public IReadOnlyList<double>? Scale { get; init; }
}
