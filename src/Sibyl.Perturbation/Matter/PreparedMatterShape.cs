using Sibyl.Cosmology.Linear;
using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.Matter;

/// <summary>
/// The loop integrals of one linear shape and of its no-wiggle partner, computed once per linear spectrum
/// and reused for every redshift and gravity model that shares it.
/// </summary>
/// <param name="Linear">The linear spectrum (growth units).</param>
/// <param name="Full">Integrals of the shape with wiggles.</param>
/// <param name="NoWiggle">Integrals of the no-wiggle shape.</param>
/// <param name="Sigma2">Σ² of the shape in (Mpc/h)² (growth units: multiply by D² for a redshift).</param>
public sealed record PreparedMatterShape(LinearSpectrum Linear, MomentumIntegrals Full, MomentumIntegrals NoWiggle, double Sigma2);
