using Sibyl.Perturbation.Spectra;

namespace Sibyl.Demo.Theory;

/// <summary>
/// Where the sampler gets its basis spectra: every term of the galaxy multipoles at one redshift on the data's k grid,
/// for a batch of points of a cosmological parameter box. Batches are what an ensemble sampler makes (every proposal of
/// a half-step at once) and what a remote server answers best in one round trip; implementations may evaluate a batch
/// in parallel. A theory served over gRPC fits in one class: Describe gives the names, box and k grid, PredictBatch
/// with include_basis gives the terms of each point, which become <see cref="BasisSpectra"/> with the described layout.
/// </summary>
public interface ISpectrumTheory
{
    /// <summary>Short description for logs, for example "emulator survey.emulator".</summary>
    string Description { get; }

    /// <summary>Cosmological input parameters, in the order of each point's values.</summary>
    IReadOnlyList<string> ParameterNames { get; }

    /// <summary>Lower edges of the box the theory is valid in.</summary>
    IReadOnlyList<double> Min { get; }

    /// <summary>Upper edges of the box.</summary>
    IReadOnlyList<double> Max { get; }

    /// <summary>Wavenumbers of every returned spectrum, h/Mpc.</summary>
    IReadOnlyList<double> K { get; }

    /// <summary>Redshift of the spectra.</summary>
    double Redshift { get; }

    /// <summary>The basis spectra of every point, in order; each result is the caller's to keep.</summary>
    /// <param name="points">Points inside the box, values in <see cref="ParameterNames"/> order.</param>
    /// <param name="cancellation">Stops the batch.</param>
    /// <exception cref="ArgumentException">A point has the wrong length or lies outside the box.</exception>
    Task<BasisSpectra[]> PredictAsync(IReadOnlyList<double[]> points, CancellationToken cancellation = default);
}
