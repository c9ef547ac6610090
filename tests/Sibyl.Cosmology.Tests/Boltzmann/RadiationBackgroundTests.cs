using Sibyl.Cosmology.Boltzmann;
using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Tests.Boltzmann;

public class RadiationBackgroundTests
{
    [Fact]
    public void Photon_density_follows_from_the_CODATA_constants()
    {
        // ω_γ = a_rad T⁴ / (c² ρ_crit(h = 1)), a_rad = π² k_B⁴ / (15 ħ³ c³), ρ_crit = 3 (100 km/s/Mpc)² / (8πG),
        // T = 2.7255 K. The constant carries 7 digits, so 1e-6 relative is its rounding.
        double radiation = Math.PI * Math.PI * Math.Pow(BoltzmannConstant, 4)
                           / (15.0 * Math.Pow(ReducedPlanckConstant, 3) * Math.Pow(SpeedOfLight, 3));
        double hundred = 1e5 / Megaparsec;
        double critical = 3.0 * hundred * hundred / (8.0 * Math.PI * GravitationalConstant);
        double expected = radiation * Math.Pow(2.7255, 4) / (SpeedOfLight * SpeedOfLight * critical);

        Assert.Equal(1.0, RadiationBackground.PhotonDensityAt2725 / expected, 1e-6);
    }

    [Fact]
    public void Radiation_constant_agrees_with_Stefan_Boltzmann()
    {
        // a_R = 4σ_SB/c and a_R = π² k⁴/(15 ħ³ c³) are the same CODATA quantity; the 10-digit σ_SB and ħ agree
        // to about 1e-9, so 1e-8 tests that neither constant was mistyped.
        double fromPlanck = Math.PI * Math.PI * Math.Pow(BoltzmannConstant, 4)
                            / (15.0 * Math.Pow(ReducedPlanckConstant, 3) * Math.Pow(SpeedOfLight, 3));

        Assert.Equal(1.0, RadiationDensity / fromPlanck, 1e-8);
    }
}
