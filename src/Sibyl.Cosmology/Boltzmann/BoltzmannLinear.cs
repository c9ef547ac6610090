using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Boltzmann;

/// <summary>
/// The linear spectrum from the built-in Einstein–Boltzmann solver, normalised by ln10As (or σ8) and split
/// into wiggle and no-wiggle parts like every other source.
/// </summary>
public static class BoltzmannLinear
{
    /// <summary>Solves the Boltzmann hierarchy for <paramref name="parameters"/> and returns the linear spectrum in growth units.</summary>
    /// <param name="parameters">Cosmology.</param>
    /// <param name="lcdmGrowthToday">D(a = 1) of the general-relativity counterpart, in the D → a convention.</param>
    /// <param name="threads">Worker threads for the k modes; 1 inside an already parallel training run.</param>
    public static LinearSpectrum Compute(CosmologyParameters parameters, double lcdmGrowthToday, int threads = 0) =>
        throw new NotImplementedException("the Boltzmann solver is being written");
}
