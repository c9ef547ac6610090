using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Tests.Boltzmann.Recombination;

/// <summary>Baryon temperature, sound speed and visibility.</summary>
public class ThermalHistoryTemperatureTests
{
    [Fact]
    public void Baryons_share_the_photon_temperature_at_z_1000()
    {
        // Compton scattering on the residual electrons still outpaces expansion at z = 1000 (the coupling rate
        // exceeds H by ~3e4), so T_b = T_γ to 1e-3, the task's bound; measured T_b/T_γ − 1 = −3.8e-5.
        const double z = 1000.0;
        double photons = PlanckThermalHistory.Parameters.CmbTemperature * (1.0 + z);

        Assert.Equal(1.0, PlanckThermalHistory.History.BaryonTemperature(z) / photons, 1e-3);
    }

    [Fact]
    public void Baryons_are_colder_than_photons_at_z_50()
    {
        // Decoupled baryons cool adiabatically as a⁻², faster than the photons' a⁻¹. Strict inequality.
        const double z = 50.0;
        double photons = PlanckThermalHistory.Parameters.CmbTemperature * (1.0 + z);

        Assert.True(PlanckThermalHistory.History.BaryonTemperature(z) < photons);
    }

    [Fact]
    public void Sound_speed_is_that_of_the_tightly_coupled_ionised_gas_at_z_5000()
    {
        // With T_b = T_γ ∝ 1/a, d ln T_b/d ln a = −1 and c_s² = (4/3) k T / (μ m_H c²), μ⁻¹ = (1 − Y)(1 + f_He + x_e)
        // (Ma & Bertschinger 1995 eq. 68). z = 5000 is in the Saha era, where T_b = T_γ is imposed (the Compton
        // lag H/Γ ≈ 1e-7 is dropped), so only interpolation and rounding remain: 1e-9 relative.
        const double z = 5000.0;
        var history = PlanckThermalHistory.History;
        double inverseWeight = (1.0 - PlanckThermalHistory.HeliumFraction)
                               * (1.0 + history.HeliumToHydrogen + history.FreeElectronFraction(z));
        double temperature = PlanckThermalHistory.Parameters.CmbTemperature * (1.0 + z);
        double expected = 4.0 / 3.0 * BoltzmannConstant * temperature * inverseWeight / (HydrogenMass * SpeedOfLight * SpeedOfLight);

        Assert.Equal(1.0, history.BaryonSoundSpeedSquared(-Math.Log(1.0 + z)) / expected, 1e-9);
    }

    [Fact]
    public void Visibility_peaks_at_decoupling_with_the_known_width()
    {
        // g = κ' e^{−τ} peaks close to where τ = 1 (within 1 %, the task's bound) and has a full width at half
        // maximum of about 180–200 in z (Hu & Sugiyama 1995, ApJ 444, 489 and common practice, from memory).
        // The scan steps by 0.05 in z, far finer than either bound.
        var history = PlanckThermalHistory.History;
        double peak = 0.0, peakRedshift = 0.0;
        for (double z = 800.0; z <= 1400.0; z += 0.05)
        {
            double g = history.Visibility(z);
            if (g > peak)
            {
                (peak, peakRedshift) = (g, z);
            }
        }

        double low = peakRedshift, high = peakRedshift;
        while (history.Visibility(low) > 0.5 * peak)
        {
            low -= 0.05;
        }

        while (history.Visibility(high) > 0.5 * peak)
        {
            high += 0.05;
        }

        Assert.InRange(peakRedshift / history.PhotonDecouplingRedshift - 1.0, -0.01, 0.01);
        Assert.InRange(high - low, 180.0, 200.0);
    }
}
