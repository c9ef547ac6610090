using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Boltzmann.Recombination;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Tests.Boltzmann.Recombination;

/// <summary>
/// Base ΛCDM of Planck 2018 results VI (Planck Collaboration 2020, A&amp;A 641, A6), Table 2,
/// TT,TE,EE+lowE+lensing (values from memory). The chain has one 0.06 eV neutrino, treated here as massless:
/// at z > 1000 it is still relativistic to within a fraction of a percent of one species.
/// </summary>
internal static class PlanckThermalHistory
{
    public const double HeliumFraction = 0.2454;

    public static readonly CosmologyParameters Parameters = new()
    {
        H = 0.6736,
        OmegaBaryon = 0.02237,
        OmegaCdm = 0.1200,
        CmbTemperature = 2.7255,
        NEff = 3.046,
        HeliumFraction = HeliumFraction,
    };

    public static readonly RadiationBackground Background = new(Parameters);

    public static readonly ThermalHistory History = ThermalHistory.Solve(Background, HeliumFraction);
}
