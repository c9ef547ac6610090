namespace Sibyl.Cosmology.Linear;

/// <summary>
/// Which built-in calculation supplies a model's linear spectrum. A user's table (<see cref="CosmologyModel.CreateFromTable"/>)
/// is the third way and needs no member here.
/// </summary>
public enum LinearSource
{
    /// <summary>
    /// The Eisenstein &amp; Hu (1998, ApJ 496, 605) fitting formula with baryon wiggles: <c>fit</c>, the default.
    /// Milliseconds per cosmology, good to a few per cent.
    /// </summary>
    Fit,

    /// <summary>
    /// The built-in linear Einstein–Boltzmann solver (<see cref="Boltzmann.BoltzmannLinear"/>): <c>boltzmann</c>.
    /// 0.15–0.35 s per cosmology on 2 cores; the only source that reads N_eff and Y_He.
    /// </summary>
    Boltzmann,
}
