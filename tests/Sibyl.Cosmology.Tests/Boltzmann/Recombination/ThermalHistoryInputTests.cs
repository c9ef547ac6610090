using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Boltzmann.Recombination;

namespace Sibyl.Cosmology.Tests.Boltzmann.Recombination;

public class ThermalHistoryInputTests
{
    [Theory]
    [InlineData(0.0)]
    [InlineData(-0.1)]
    [InlineData(0.5)]
    [InlineData(0.7)]
    [InlineData(double.NaN)]
    public void Helium_fraction_outside_zero_to_one_half_is_rejected(double heliumFraction)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(
            () => ThermalHistory.Solve(PlanckThermalHistory.Background, heliumFraction));

        Assert.Equal("heliumFraction", error.ParamName);
        Assert.Contains("Y_He", error.Message, StringComparison.Ordinal);
        Assert.Contains("(0, 0.5)", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Background_without_baryons_is_rejected()
    {
        var background = new RadiationBackground(PlanckThermalHistory.Parameters with { OmegaBaryon = 0.0 });

        var error = Assert.Throws<ArgumentOutOfRangeException>(() => ThermalHistory.Solve(background, 0.2454));

        Assert.Contains("OmegaBaryon", error.Message, StringComparison.Ordinal);
        Assert.Contains("(0, 1)", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_background_is_rejected()
    {
        Assert.Throws<ArgumentNullException>(() => ThermalHistory.Solve(null!, 0.2454));
    }

    [Theory]
    [InlineData(-0.5)]
    [InlineData(1e11)]
    public void Redshift_outside_the_tables_is_rejected(double z)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => PlanckThermalHistory.History.FreeElectronFraction(z));

        Assert.Equal("z", error.ParamName);
    }
}
