using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Tests.Boltzmann.Recombination;

/// <summary>Ionisation history against its limits: Saha equilibrium early, freeze-out late.</summary>
public class ThermalHistoryIonizationTests
{
    /// <summary>n_H in m⁻³ at redshift z for the Planck parameters, written out independently of the library.</summary>
    private static double HydrogenDensity(double z)
    {
        var parameters = PlanckThermalHistory.Parameters;
        double hundred = 1e5 / Megaparsec;
        double critical = 3.0 * hundred * hundred / (8.0 * Math.PI * GravitationalConstant);
        return (1.0 - parameters.HeliumFraction) * parameters.OmegaBaryon * critical / HydrogenMass * Math.Pow(1.0 + z, 3);
    }

    [Theory]
    [InlineData(1700.0)]
    [InlineData(1600.0)]
    public void Hydrogen_follows_Saha_before_recombination(double z)
    {
        // Saha: x_H/(1 − x_H) = (2π m_e kT/h²)^{3/2} e^{−χ_H/kT} / n_e, with T = T_γ and the model's own n_e
        // (helium electrons included). The three-level atom leaves Saha only once the Lyα bottleneck matters,
        // at x_H ≲ 0.99 (Peebles 1968); 1e-4 absolute is the bound for "still in equilibrium". Measured lag:
        // 1.2e-7 at z = 1700, 3.4e-5 at z = 1600 (and 7.4e-3 at z = 1500, see the next test).
        var history = PlanckThermalHistory.History;
        double temperature = PlanckThermalHistory.Parameters.CmbTemperature * (1.0 + z), kT = BoltzmannConstant * temperature;
        double saha = Math.Pow(2.0 * Math.PI * ElectronMass * kT / (PlanckConstant * PlanckConstant), 1.5)
                      * Math.Exp(-HydrogenIonization / kT) / HydrogenDensity(z);
        double electrons = history.FreeElectronFraction(z);

        Assert.Equal(saha / (saha + electrons), history.IonizedHydrogenFraction(z), 1e-4);
    }

    [Fact]
    public void Hydrogen_lags_Saha_once_recombination_is_under_way()
    {
        // At z = 1500 the Lyα bottleneck (Peebles 1968) holds recombination back: x_H must exceed its Saha
        // value. A strict inequality, no tolerance.
        const double z = 1500.0;
        var history = PlanckThermalHistory.History;
        double kT = BoltzmannConstant * PlanckThermalHistory.Parameters.CmbTemperature * (1.0 + z);
        double saha = Math.Pow(2.0 * Math.PI * ElectronMass * kT / (PlanckConstant * PlanckConstant), 1.5)
                      * Math.Exp(-HydrogenIonization / kT) / HydrogenDensity(z);

        Assert.True(history.IonizedHydrogenFraction(z) > saha / (saha + history.FreeElectronFraction(z)));
    }

    [Fact]
    public void Helium_is_doubly_ionised_at_z_8000()
    {
        // x_e = 1 + 2 f_He when all helium is He III. Saha leaves He II/He III ≈ 5e-5 at z = 8000 (estimate from
        // the Saha equation with χ = 54.4 eV), i.e. x_e low by ~4e-6 relative (measured 3.9e-6); 1e-5 allows
        // that and nothing more.
        var history = PlanckThermalHistory.History;

        Assert.Equal(1.0, history.FreeElectronFraction(8000.0) / (1.0 + 2.0 * history.HeliumToHydrogen), 1e-5);
    }

    [Theory]
    [InlineData(4500.0)]
    [InlineData(4000.0)]
    public void Helium_is_singly_ionised_between_its_two_recombinations(double z)
    {
        // x_e = 1 + f_He once He III has recombined and before He I does. Saha estimates: He III/He II ≈ 8e-6 at
        // z = 4500 (x_e high by 6e-7 relative, as measured); He I has begun to form at z = 4000 (measured: x_e low
        // by 2e-8). 1e-5 relative is above both and far below f_He/(1 + f_He) = 0.076.
        var history = PlanckThermalHistory.History;

        Assert.Equal(1.0, history.FreeElectronFraction(z) / (1.0 + history.HeliumToHydrogen), 1e-5);
    }

    [Fact]
    public void Residual_ionisation_freezes_out_at_a_few_1e4()
    {
        // After recombination the rate n_e α falls below H and x_e freezes out at a few 1e-4 (Peebles 1968;
        // common practice for Planck-like cosmologies is about 2e-4 to 3e-4 at z = 200, from memory). The
        // bounds say "a few 1e-4": 1.5e-4 to 5e-4. Measured: 3.33e-4, 11 % above that remembered band
        // (1.71e-4 at z = 0, against Peebles' estimate 1.2e-5 Ω_m^½/(Ω_b h) ≈ 2.0e-4, from memory).
        double residual = PlanckThermalHistory.History.FreeElectronFraction(200.0);

        Assert.InRange(residual, 1.5e-4, 5e-4);
    }

    [Fact]
    public void Opacity_is_Thomson_scattering_on_the_free_electrons()
    {
        // κ' = a n_e σ_T with n_e = x_e n_H(z), in 1/Mpc: the identity behind the table, written out with an
        // independent n_H. 1e-9 relative: cubic interpolation of a smooth table at z = 2000 plus rounding.
        const double z = 2000.0;
        var history = PlanckThermalHistory.History;
        double expected = history.FreeElectronFraction(z) * HydrogenDensity(z) * ThomsonCrossSection * Megaparsec / (1.0 + z);

        Assert.Equal(1.0, history.Opacity(-Math.Log(1.0 + z)) / expected, 1e-9);
    }
}
